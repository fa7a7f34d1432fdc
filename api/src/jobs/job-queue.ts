import PgBoss from 'pg-boss';
import type { DatabaseConnectionSettings } from '../database/typeorm-options.js';

/** The PostgreSQL schema pg-boss keeps its queue tables in (created and upgraded by pg-boss itself). */
export const JOB_QUEUE_SCHEMA = 'pgboss';

/** A query runner pg-boss can insert a job through, so a job is sent in the caller's own transaction. */
export interface JobQueueConnection {
  executeSql(text: string, values: unknown[]): Promise<{ rows: unknown[] }>;
}

/**
 * A pg-boss instance on the app's database. Plain (no Nest), so a separate worker process can run
 * the same queue. pg-boss creates and upgrades its own schema at start (under an advisory lock, so
 * several processes may start together); cron scheduling is off, as nothing here is scheduled.
 */
export function createJobQueue(database: DatabaseConnectionSettings, options: { applicationName?: string } = {}): PgBoss {
  return new PgBoss({
    host: database.host,
    port: database.port,
    user: database.username,
    password: database.password,
    database: database.database,
    schema: JOB_QUEUE_SCHEMA,
    application_name: options.applicationName ?? 'beamwright-jobs',
    // a few connections: fetches, completions and the maintenance of expired jobs
    max: 4,
    schedule: false,
    supervise: true,
    maintenanceIntervalSeconds: 30,
  });
}
