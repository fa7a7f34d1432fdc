import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { RateLimitCounter } from './rate-limit-counter.entity.js';
import { PostgresThrottlerStorage } from './postgres-throttler.storage.js';

/** The throttler storage shared through PostgreSQL; which routes are limited is up to each feature. */
@Module({
  imports: [TypeOrmModule.forFeature([RateLimitCounter])],
  providers: [PostgresThrottlerStorage],
  exports: [PostgresThrottlerStorage],
})
export class RateLimitsModule {}
