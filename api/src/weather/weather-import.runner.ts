import type { DataSource } from 'typeorm';
import {
  IMPORT_DEADLINE_MS,
  WEATHER_IMPORT_DEAD_QUEUE,
  WEATHER_IMPORT_QUEUE,
  registerWeatherImportQueues,
  reportGivenUpImport,
  sweepWeatherImports,
  type ImportJobData,
  type ImportJobQueue,
} from './weather-import.jobs.js';
import { WeatherImportProcessor } from './weather-import.processor.js';

/** The queue as the runner uses it: JobQueueService in the app, a thin adapter over pg-boss in the worker process. */
export interface ImportRunnerQueue extends ImportJobQueue {
  work<Data extends object>(name: string, options: { batchSize: number; pollingIntervalSeconds: number }, handler: (jobs: { data: Data }[]) => Promise<unknown>): Promise<string>;
}

export interface ImportRunnerOptions {
  /** a running import silent for longer is taken as stopped [ms] */
  stallMs: number;
  /** told when an import this process ran has ended */
  onEnded?: (importId: string) => void;
  log?: (message: string) => void;
}

/**
 * Runs weather imports in one process: one at a time from the shared queue (several processes share
 * the work, each job goes to one), reports the ones pg-boss gave up on, and sweeps for the imports of
 * a process that stopped. Used by the API (WeatherImportWorker) and by the worker-only process.
 */
export class WeatherImportRunner {
  private readonly processor: WeatherImportProcessor;
  private readonly running = new Set<AbortController>();
  private sweepTimer: NodeJS.Timeout | undefined;

  constructor(
    private readonly dataSource: DataSource,
    private readonly queue: ImportRunnerQueue,
    private readonly options: ImportRunnerOptions,
  ) {
    this.processor = new WeatherImportProcessor(dataSource, { heartbeatMs: Math.min(1000, options.stallMs / 3), deadlineMs: IMPORT_DEADLINE_MS });
  }

  /** Registers the queues and the workers; returns the import worker's id (to wake it when a job is sent). */
  async start(): Promise<string> {
    await registerWeatherImportQueues(this.queue);
    const workerId = await this.queue.work<ImportJobData>(WEATHER_IMPORT_QUEUE, { batchSize: 1, pollingIntervalSeconds: 2 }, async ([job]) => {
      const controller = new AbortController();
      this.running.add(controller);
      try {
        return { outcome: await this.processor.run(job!.data.importId, controller.signal) };
      } finally {
        this.running.delete(controller);
        this.options.onEnded?.(job!.data.importId);
      }
    });
    await this.queue.work<ImportJobData>(WEATHER_IMPORT_DEAD_QUEUE, { batchSize: 1, pollingIntervalSeconds: 5 }, async ([job]) => {
      await reportGivenUpImport(this.dataSource, job!.data.importId);
      this.options.onEnded?.(job!.data.importId);
    });
    this.sweepTimer = setInterval(() => {
      sweepWeatherImports(this.dataSource, this.queue, this.options.stallMs).catch((error: Error) => this.options.log?.(`weather import sweep: ${error.message}`));
    }, Math.max(1000, this.options.stallMs / 3));
    this.sweepTimer.unref();
    return workerId;
  }

  /** Stops sweeping and stops the running import (it rolls back; its job is failed and retried later). */
  stop(): void {
    clearInterval(this.sweepTimer);
    for (const controller of this.running) controller.abort();
  }
}
