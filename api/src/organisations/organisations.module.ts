import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { Organisation } from './organisation.entity.js';
import { OrganisationSettingsController } from './organisation-settings.controller.js';
import { OrganisationSettingsService } from './organisation-settings.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Organisation])],
  controllers: [OrganisationSettingsController],
  providers: [OrganisationSettingsService],
})
export class OrganisationsModule {}
