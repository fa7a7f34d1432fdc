import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import { TypeOrmModule, getDataSourceToken } from '@nestjs/typeorm';
import { WEATHER_UPLOAD_LIMITS } from '@beamwright/link-core/contracts';
import type { DataSource } from 'typeorm';
import { JobsModule } from '../jobs/jobs.module.js';
import { LinksModule } from '../links/links.module.js';
import { SitesModule } from '../sites/sites.module.js';
import { WeatherAvailabilityController } from './weather-availability.controller.js';
import { WeatherAvailabilityService } from './weather-availability.service.js';
import { WeatherDatasetsController } from './weather-datasets.controller.js';
import { WeatherDatasetsService, WeatherImportEvents } from './weather-datasets.service.js';
import { WeatherDataset } from './weather-dataset.entity.js';
import { WeatherImportChunk } from './weather-import-chunk.entity.js';
import { WeatherImport } from './weather-import.entity.js';
import { WeatherImportWorker } from './weather-import.worker.js';
import { WeatherRecord } from './weather-record.entity.js';
import { WeatherUploadStorage } from './weather-upload.storage.js';

/**
 * Weather data sets (a site's visibility history), their import as a pg-boss job, and the
 * availability of a link revision over them.
 */
@Module({
  imports: [
    TypeOrmModule.forFeature([WeatherDataset, WeatherRecord, WeatherImport, WeatherImportChunk]),
    // uploads stream into PostgreSQL (the storage engine), one file per request, a few small fields
    MulterModule.registerAsync({
      inject: [getDataSourceToken()],
      useFactory: (dataSource: DataSource) => ({
        storage: new WeatherUploadStorage(dataSource),
        // the storage engine refuses a file at 50 MB + 1 byte with its own 413 and message; multer's
        // limit sits above it as a backstop, so the two never race
        limits: { fileSize: WEATHER_UPLOAD_LIMITS.maxBytes + 1024 * 1024, files: 1, fields: 10, fieldSize: 64 * 1024, parts: 12 },
      }),
    }),
    JobsModule,
    LinksModule,
    SitesModule,
  ],
  controllers: [WeatherDatasetsController, WeatherAvailabilityController],
  providers: [WeatherDatasetsService, WeatherAvailabilityService, WeatherImportEvents, WeatherImportWorker],
  exports: [WeatherDatasetsService],
})
export class WeatherModule {}
