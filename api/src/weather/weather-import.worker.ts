import { Inject, Injectable, Logger, type BeforeApplicationShutdown, type OnApplicationBootstrap } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { weatherConfig, type WeatherConfig } from '../config/weather.config.js';
import { JobQueueService } from '../jobs/job-queue.service.js';
import { WeatherDatasetsService, WeatherImportEvents } from './weather-datasets.service.js';
import { WeatherImportRunner } from './weather-import.runner.js';

/**
 * Runs weather imports in this API process, started and stopped with the application: the queue has
 * started by onApplicationBootstrap; on shutdown the running import is stopped and rolled back first,
 * then the queue stops (onApplicationShutdown) and pg-boss fails the job, whose retry runs it again
 * (after a restart, or in another process).
 */
@Injectable()
export class WeatherImportWorker implements OnApplicationBootstrap, BeforeApplicationShutdown {
  private readonly logger = new Logger(WeatherImportWorker.name);
  private readonly runner: WeatherImportRunner;

  constructor(
    @InjectDataSource() dataSource: DataSource,
    jobs: JobQueueService,
    private readonly datasets: WeatherDatasetsService,
    events: WeatherImportEvents,
    @Inject(weatherConfig.KEY) config: WeatherConfig,
  ) {
    this.runner = new WeatherImportRunner(dataSource, jobs, {
      stallMs: config.importStallMs,
      onEnded: (importId) => events.emit('ended', importId),
      log: (message) => this.logger.warn(message),
    });
  }

  async onApplicationBootstrap(): Promise<void> {
    this.datasets.localWorkerId = await this.runner.start();
  }

  beforeApplicationShutdown(): void {
    this.runner.stop();
  }
}
