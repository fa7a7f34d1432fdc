/**
 * A worker-only process: runs weather imports from the shared queue without serving HTTP, beside
 * (or instead of) the API processes' own workers. `npm run worker -w @beamwright/api` (built), with
 * the same DATABASE_* and WEATHER_IMPORT_* settings as the API. SIGINT/SIGTERM stop the running
 * import (it rolls back and is retried), then the queue.
 */
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadCheckoutEnvFile } from '../config/checkout-paths.js';
import { EnvSchema } from '../config/env.schema.js';
import { typeOrmOptions } from '../database/typeorm-options.js';
import { createJobQueue } from '../jobs/job-queue.js';
import { WeatherImportRunner } from './weather-import.runner.js';

loadCheckoutEnvFile();
const env = EnvSchema.omit({ JWT_SECRET: true }).parse(process.env);
const settings = { host: env.DATABASE_HOST, port: env.DATABASE_PORT, username: env.DATABASE_USER, password: env.DATABASE_PASSWORD, database: env.DATABASE_NAME };
const dataSource = new DataSource({ ...typeOrmOptions(settings), extra: { max: 4, connectionTimeoutMillis: 5000 } });
await dataSource.initialize();
const boss = createJobQueue(settings, { applicationName: 'beamwright-import-worker' });
boss.on('error', (error) => console.error(`job queue: ${error.message}`));
await boss.start();
const runner = new WeatherImportRunner(
  dataSource,
  {
    createQueue: (name, options) => boss.createQueue(name, { name, ...options }),
    fail: (name, jobId, reason) => boss.fail(name, jobId, reason),
    work: (name, options, handler) => boss.work(name, options, handler),
  },
  { stallMs: env.WEATHER_IMPORT_STALL_SECONDS * 1000, log: (message) => console.error(message) },
);
await runner.start();
console.log(`weather import worker ready (pid ${process.pid})`);

let stopping = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (stopping) return;
    stopping = true;
    runner.stop();
    void boss
      .stop({ graceful: true, timeout: 10_000 })
      .finally(() => dataSource.destroy())
      .finally(() => process.exit(0));
  });
}
