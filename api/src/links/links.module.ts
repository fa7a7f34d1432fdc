import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { SitesModule } from '../sites/sites.module.js';
import { LinkReview } from './link-review.entity.js';
import { LinkRevision } from './link-revision.entity.js';
import { LinkRevisionVariant } from './link-revision-variant.entity.js';
import { Link } from './link.entity.js';
import { LinksController } from './links.controller.js';
import { LinksService } from './links.service.js';
import { ReviewsService } from './reviews.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Link, LinkRevision, LinkRevisionVariant, LinkReview]), SitesModule],
  controllers: [LinksController],
  providers: [LinksService, ReviewsService],
  exports: [LinksService],
})
export class LinksModule {}
