import type { DataSource } from 'typeorm';

/** The queue of weather imports, and where pg-boss moves a job whose retries ran out. */
export const WEATHER_IMPORT_QUEUE = 'weather-import';
export const WEATHER_IMPORT_DEAD_QUEUE = 'weather-import-dead';

/** A run gives up (and is retried) a minute before its pg-boss job would expire. */
export const IMPORT_JOB_EXPIRE_SECONDS = 15 * 60;
export const IMPORT_DEADLINE_MS = (IMPORT_JOB_EXPIRE_SECONDS - 60) * 1000;

export interface ImportJobData {
  importId: string;
}

/** The part of a job queue these functions use (JobQueueService in the app, a plain pg-boss in a worker process). */
export interface ImportJobQueue {
  createQueue(name: string, options?: { deadLetter?: string }): Promise<void>;
  fail(name: string, jobId: string, reason: object): Promise<void>;
}

/** The job options of an import: retried `retries` times after an interruption, then given up to the dead-letter queue. */
export function importJobOptions(retries: number) {
  return { retryLimit: retries, retryDelay: 1, expireInSeconds: IMPORT_JOB_EXPIRE_SECONDS, deadLetter: WEATHER_IMPORT_DEAD_QUEUE };
}

export async function registerWeatherImportQueues(jobs: ImportJobQueue): Promise<void> {
  await jobs.createQueue(WEATHER_IMPORT_DEAD_QUEUE);
  await jobs.createQueue(WEATHER_IMPORT_QUEUE, { deadLetter: WEATHER_IMPORT_DEAD_QUEUE });
}

/**
 * Housekeeping any API process may do (each row is claimed by one UPDATE, so two processes never
 * act on the same import):
 * - a running import whose heartbeat stopped (its process was killed or lost the database) goes
 *   back to the queue and its job is failed, so pg-boss retries it — or gives it up when its
 *   retries are spent;
 * - an upload abandoned half-way (its process died during the upload) is deleted after an hour;
 * - ended imports are forgotten after a week (their data sets stay).
 */
export async function sweepWeatherImports(dataSource: DataSource, jobs: ImportJobQueue, stallMs: number): Promise<void> {
  const [stalled] = (await dataSource.query(
    `UPDATE weather_import SET state = 'queued', heartbeat_at = NULL, updated_at = now()
      WHERE state = 'running' AND heartbeat_at < now() - make_interval(secs => $1) RETURNING id, job_id AS "jobId"`,
    [stallMs / 1000],
  )) as [{ id: string; jobId: string | null }[], number];
  for (const { jobId } of stalled) {
    if (jobId) await jobs.fail(WEATHER_IMPORT_QUEUE, jobId, { message: 'the import stopped answering (its process stopped or lost the database)' });
  }
  await dataSource.query(`DELETE FROM weather_import WHERE state = 'uploading' AND updated_at < now() - interval '1 hour'`);
  await dataSource.query(`DELETE FROM weather_import WHERE state IN ('succeeded', 'failed', 'cancelled') AND updated_at < now() - interval '7 days'`);
}

/** A job pg-boss gave up on: the import is reported failed and its uploaded bytes are deleted. */
export async function reportGivenUpImport(dataSource: DataSource, importId: string): Promise<void> {
  await dataSource.transaction(async (manager) => {
    const [row] = (await manager.query(`SELECT attempt FROM weather_import WHERE id = $1 AND state IN ('queued', 'running') FOR UPDATE`, [importId])) as { attempt: number }[];
    if (row) {
      const runs = Math.max(1, row.attempt);
      const error = {
        statusCode: 500,
        error: 'Internal Server Error',
        message: `The import was interrupted ${runs} time${runs === 1 ? '' : 's'} and has been given up; nothing was stored. Upload the file again.`,
      };
      await manager.query(`UPDATE weather_import SET state = 'failed', error = $2, heartbeat_at = NULL, updated_at = now() WHERE id = $1`, [importId, JSON.stringify(error)]);
    }
    await manager.query(`DELETE FROM weather_import_chunk WHERE import_id = $1`, [importId]);
  });
}
