import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { INestApplication } from '@nestjs/common';
import PgBoss from 'pg-boss';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { typeOrmOptions } from '../src/database/typeorm-options.js';
import { upsertOrganisation } from '../src/database/seeds/demo-seed.js';
import { createJobQueue } from '../src/jobs/job-queue.js';
import { WEATHER_IMPORT_QUEUE, importJobOptions, registerWeatherImportQueues } from '../src/weather/weather-import.jobs.js';
import { WeatherImportProcessor } from '../src/weather/weather-import.processor.js';
import { createTestApp } from './utils/test-app.js';
import { applyTestEnv, databaseSettingsFromEnv } from './utils/test-env.js';
import { HOURLY_MAPPING, hourlyCsv } from './utils/weather.js';

const API_DIR = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const ROWS = 3000;

/**
 * An import killed half-way, with a real process kill: the worker-only process
 * (src/weather/import-worker.main.ts) runs the import and is held at its last write by a lock the
 * test takes on weather_record; it is then killed with SIGKILL. Nothing of the import may remain,
 * and the job must be retried (and succeed) or, with no retry left, be reported failed. The API
 * process started afterwards does the recovery: its sweep sees the silent heartbeat.
 */
describe('weather imports that are killed or too long (e2e)', () => {
  let dataSource: DataSource;
  let boss: PgBoss;
  let organisationId: string;
  let app: INestApplication | undefined;
  const children: ChildProcess[] = [];

  beforeAll(async () => {
    applyTestEnv();
    const settings = databaseSettingsFromEnv();
    dataSource = new DataSource(typeOrmOptions(settings));
    await dataSource.initialize();
    boss = createJobQueue(settings, { applicationName: 'weather-recovery-test' });
    boss.on('error', () => undefined);
    await boss.start();
    await registerWeatherImportQueues({ createQueue: (name, options) => boss.createQueue(name, { name, ...options }), fail: (name, id, reason) => boss.fail(name, id, reason) });
    const organisation = await dataSource.transaction((manager) => upsertOrganisation(manager, { slug: `test-recovery-${randomBytes(4).toString('hex')}`, name: 'Test organisation recovery' }));
    organisationId = organisation.id;
  });

  afterAll(async () => {
    for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    await app?.close();
    await boss?.stop({ graceful: false });
    await dataSource?.query('DELETE FROM organisation WHERE id = $1', [organisationId]);
    await dataSource?.destroy();
  });

  /** An upload as the API leaves it once its fields are read: the file in chunks, the import queued. */
  async function queuedImport(name: string, csv: string): Promise<string> {
    const header = csv.slice(0, csv.indexOf('\n')).split(',');
    const [row] = (await dataSource.query(
      `INSERT INTO weather_import (organisation_id, state, name, mapping, on_row_errors, file_name, byte_count, header)
       VALUES ($1, 'queued', $2, $3, 'reject', 'records.csv', $4, $5) RETURNING id`,
      [organisationId, name, JSON.stringify(HOURLY_MAPPING), Buffer.byteLength(csv), JSON.stringify(header)],
    )) as { id: string }[];
    const bytes = Buffer.from(csv);
    for (let seq = 0; seq * 16384 < bytes.length; seq++) {
      await dataSource.query(`INSERT INTO weather_import_chunk (import_id, seq, data) VALUES ($1, $2, $3)`, [row!.id, seq, bytes.subarray(seq * 16384, (seq + 1) * 16384)]);
    }
    return row!.id;
  }

  async function send(importId: string, retries: number): Promise<void> {
    const jobId = await boss.send(WEATHER_IMPORT_QUEUE, { importId }, importJobOptions(retries));
    await dataSource.query(`UPDATE weather_import SET job_id = $2 WHERE id = $1`, [importId, jobId]);
  }

  const importRow = async (id: string) =>
    ((await dataSource.query(`SELECT state, attempt, rows_read AS "rowsRead", error, dataset_id AS "datasetId" FROM weather_import WHERE id = $1`, [id])) as {
      state: string;
      attempt: number;
      rowsRead: number;
      error: { statusCode: number; message: string } | null;
      datasetId: string | null;
    }[])[0]!;
  const datasetsOfOrganisation = async () => Number((await dataSource.query(`SELECT count(*) AS n FROM weather_dataset WHERE organisation_id = $1`, [organisationId]))[0].n);
  const recordsOfOrganisation = async () =>
    Number((await dataSource.query(`SELECT count(*) AS n FROM weather_record r JOIN weather_dataset d ON d.id = r.dataset_id WHERE d.organisation_id = $1`, [organisationId]))[0].n);

  async function until<T>(what: string, probe: () => Promise<T | undefined | false>, timeoutMs = 60_000): Promise<T> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const value = await probe();
      if (value) return value;
      if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }

  /** The worker-only process, from its TypeScript source. */
  function startWorkerProcess(): ChildProcess {
    const child = spawn(process.execPath, ['--import', 'tsx', '--conditions=@beamwright/source', 'src/weather/import-worker.main.ts'], {
      cwd: API_DIR,
      env: { ...process.env, WEATHER_IMPORT_STALL_SECONDS: '30' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    children.push(child);
    return child;
  }

  async function killWhileBlocked(importId: string): Promise<void> {
    const child = startWorkerProcess();
    // held at its last statement: every row read and staged, the data set written, nothing committed
    await until('the import to wait on the lock', async () => {
      const [waiting] = await dataSource.query(`SELECT count(*)::int AS n FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND query LIKE 'INSERT INTO weather_record%'`);
      const row = await importRow(importId);
      // the heartbeat goes on while the statement waits, and reports every row read
      return waiting.n > 0 && row.state === 'running' && row.rowsRead === ROWS;
    });
    const exited = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGKILL');
    await exited;
  }

  it('refuses a file with more rows than an import takes (413), storing nothing', async () => {
    const importId = await queuedImport('Too many rows', hourlyCsv('2024-01-01T00:00Z', [1000, 1000, 1000, 1000, 1000, 1000]));
    const processor = new WeatherImportProcessor(dataSource, { heartbeatMs: 200, deadlineMs: 60_000, maxRows: 5 });
    expect(await processor.run(importId)).toBe('failed');
    const row = await importRow(importId);
    expect(row.error).toMatchObject({ statusCode: 413, message: expect.stringMatching(/more than 5 rows/) });
    expect(await datasetsOfOrganisation()).toBe(0);
    expect(Number((await dataSource.query('SELECT count(*) AS n FROM weather_import_chunk WHERE import_id = $1', [importId]))[0].n)).toBe(0);
  });

  it('leaves no partial rows when its process is killed, then retries the job or reports it given up', { timeout: 180_000 }, async () => {
    const csv = hourlyCsv('2023-01-01T00:00Z', Array.from({ length: ROWS }, (_, i) => (i % 50 === 0 ? 80 : 12_000)));
    const retried = await queuedImport('Killed, then retried', csv);
    const givenUp = await queuedImport('Killed, no retry left', csv);

    const blocker = dataSource.createQueryRunner();
    await blocker.connect();
    await blocker.startTransaction();
    await blocker.query('LOCK TABLE weather_record IN SHARE MODE');
    try {
      await send(retried, 1);
      await killWhileBlocked(retried);
      await send(givenUp, 0);
      await killWhileBlocked(givenUp);
      // the killed runs' transactions are gone with their connections: nothing of them is visible
      expect(await datasetsOfOrganisation()).toBe(0);
    } finally {
      await blocker.commitTransaction();
      await blocker.release();
    }
    expect(await datasetsOfOrganisation()).toBe(0);
    expect(await recordsOfOrganisation()).toBe(0);
    expect((await importRow(retried)).state).toBe('running');

    // an API process on the same database takes over: its sweep finds both heartbeats silent
    app = await createTestApp({ env: { WEATHER_IMPORT_STALL_SECONDS: '2' } });
    const done = await until('the retried import to succeed', async () => {
      const row = await importRow(retried);
      return row.state === 'succeeded' && row;
    });
    expect(done.attempt).toBe(2);
    expect(Number((await dataSource.query('SELECT count(*) AS n FROM weather_record WHERE dataset_id = $1', [done.datasetId]))[0].n)).toBe(ROWS);
    expect(await datasetsOfOrganisation()).toBe(1);

    const reported = await until('the import without retries to be reported', async () => {
      const row = await importRow(givenUp);
      return row.state === 'failed' && row;
    });
    expect(reported.error?.message).toMatch(/interrupted 1 time and has been given up; nothing was stored/);
    expect(reported.datasetId).toBeNull();
    expect(Number((await dataSource.query('SELECT count(*) AS n FROM weather_import_chunk WHERE import_id = $1', [givenUp]))[0].n)).toBe(0);
    expect(await recordsOfOrganisation()).toBe(ROWS);
  });
});
