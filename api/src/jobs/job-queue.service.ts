import { Inject, Injectable, Logger, type OnApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import type PgBoss from 'pg-boss';
import { databaseConfig, type DatabaseConfig } from '../config/database.config.js';
import { createJobQueue, type JobQueueConnection } from './job-queue.js';

/**
 * The job queue of the app (pg-boss on the app's PostgreSQL): jobs survive a restart and any API
 * process on the same database may run them. Started with the Nest application and stopped with it:
 * a feature registers its workers in onApplicationBootstrap (the queue has started by then) and
 * stops its running jobs in beforeApplicationShutdown; the queue stops in onApplicationShutdown.
 */
@Injectable()
export class JobQueueService implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger(JobQueueService.name);
  private readonly boss: PgBoss;

  constructor(@Inject(databaseConfig.KEY) database: DatabaseConfig) {
    this.boss = createJobQueue(database, { applicationName: 'beamwright-api-jobs' });
    // pg-boss reports its own trouble (a lost connection, a failed fetch) as events; an unhandled
    // 'error' event would end the process
    this.boss.on('error', (error) => this.logger.warn(`job queue: ${error.message}`));
  }

  async onModuleInit(): Promise<void> {
    await this.boss.start();
  }

  async onApplicationShutdown(): Promise<void> {
    // jobs still running after 10 s are failed by pg-boss (and retried later, by this or another process)
    await this.boss.stop({ graceful: true, timeout: 10_000 });
  }

  createQueue(name: string, options: Omit<PgBoss.Queue, 'name'> = {}): Promise<void> {
    // creating a queue that exists changes nothing
    return this.boss.createQueue(name, { name, ...options });
  }

  work<Data extends object>(name: string, options: PgBoss.WorkOptions, handler: PgBoss.WorkHandler<Data>): Promise<string> {
    return this.boss.work<Data>(name, options, handler);
  }

  /** Wakes a local worker now instead of at its next poll. */
  notifyWorker(workerId: string): void {
    this.boss.notifyWorker(workerId);
  }

  /** Sends a job; through `options.db` it is inserted in that transaction (and exists only if it commits). */
  async send(name: string, data: object, options: Omit<PgBoss.SendOptions, 'db'> & { db?: JobQueueConnection } = {}): Promise<string> {
    const id = await this.boss.send(name, data, options as PgBoss.SendOptions);
    if (!id) throw new Error(`job queue: the job for ${name} was not created`);
    return id;
  }

  /** Fails an active job, which pg-boss retries while the queue's retry limit allows. */
  fail(name: string, jobId: string, reason: object): Promise<void> {
    return this.boss.fail(name, jobId, reason);
  }

  getJob(name: string, jobId: string): Promise<PgBoss.JobWithMetadata | null> {
    return this.boss.getJobById(name, jobId);
  }
}
