import { Module } from '@nestjs/common';
import { JobQueueService } from './job-queue.service.js';

/** The PostgreSQL-backed job queue (pg-boss), one per process, shared by the features that run jobs. */
@Module({ providers: [JobQueueService], exports: [JobQueueService] })
export class JobsModule {}
