import { EventEmitter } from 'node:events';
import { BadRequestException, HttpException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, QueryRunner } from 'typeorm';
import {
  WeatherDatasetUploadFieldsSchema,
  resolveWeatherColumns,
  type WeatherDataset as WeatherDatasetResponse,
  type WeatherDatasetListResponse,
  type WeatherImportJob,
  type WeatherImportResult,
} from '@beamwright/link-core/contracts';
import { formatZodIssues } from '@beamwright/link-core';
import type { AuthUser } from '../common/auth-user.js';
import { weatherConfig, type WeatherConfig } from '../config/weather.config.js';
import type { JobQueueConnection } from '../jobs/job-queue.js';
import { JobQueueService } from '../jobs/job-queue.service.js';
import { SitesService } from '../sites/sites.service.js';
import { WEATHER_IMPORT_QUEUE, importJobOptions } from './weather-import.jobs.js';
import { toWeatherDataset, toWeatherImportJob, type WeatherDatasetRow, type WeatherImportRow } from './weather.mapper.js';
import { readVisibilityRecords, type StoredVisibilityRecords } from './weather-records.writer.js';
import type { StoredWeatherUpload } from './weather-upload.storage.js';

export const FINAL_IMPORT_STATES = ['succeeded', 'failed', 'cancelled'] as const;

/** Told by this process's worker when an import ends, so a waiting upload answers at once. */
@Injectable()
export class WeatherImportEvents extends EventEmitter {}

/** How an upload is answered: the import's result (201), or the job to poll (202). */
export type UploadAnswer = { status: 201; body: WeatherImportResult } | { status: 202; body: WeatherImportJob };

const DATASET_COLUMNS = `d.id, d.name, d.notes, d.site_id AS "siteId", s.name AS "siteName", d.visibility_definition AS "visibilityDefinition",
  d.source_unit AS "sourceUnit", d.source_file_name AS "sourceFileName", d.record_count AS "recordCount", d.missing_visibility_count AS "missingVisibilityCount",
  d.first_observed_at AS "firstObservedAt", d.last_observed_at AS "lastObservedAt", d.has_rain_rate AS "hasRainRate", d.has_snow_rate AS "hasSnowRate",
  d.has_temperature AS "hasTemperature", d.has_cn2 AS "hasCn2", d.invented, d.created_at AS "createdAt", d.created_by_id AS "createdById", u.display_name AS "createdByName"`;
const DATASET_FROM = `weather_dataset d LEFT JOIN site s ON s.id = d.site_id LEFT JOIN app_user u ON u.id = d.created_by_id`;
const IMPORT_COLUMNS = `id, state, name, file_name AS "fileName", byte_count::float8 AS "byteCount", bytes_read::float8 AS "bytesRead", rows_read AS "rowsRead",
  attempt, result, error, created_at AS "createdAt", updated_at AS "updatedAt"`;

/** A transaction's connection as pg-boss's `db` option wants it, so a job is sent inside the transaction. */
function jobConnectionOf(runner: QueryRunner): JobQueueConnection {
  return { executeSql: async (text, values) => ({ rows: (await runner.query(text, values, true)).records as unknown[] }) };
}

/**
 * Weather data sets of an organisation: the upload becomes an import job (pg-boss), the job's
 * state is polled or awaited, data sets are listed and deleted, and their records read for the
 * availability. Every method scopes by the caller's organisation: another organisation's data set
 * or import is a 404.
 */
@Injectable()
export class WeatherDatasetsService {
  /** the local worker, when this process runs one (woken up when a job is sent) */
  localWorkerId: string | undefined;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly jobs: JobQueueService,
    private readonly sites: SitesService,
    private readonly events: WeatherImportEvents,
    @Inject(weatherConfig.KEY) private readonly config: WeatherConfig,
  ) {}

  async list(caller: AuthUser, siteId?: string): Promise<WeatherDatasetListResponse> {
    const rows = (await this.dataSource.query(
      `SELECT ${DATASET_COLUMNS} FROM ${DATASET_FROM} WHERE d.organisation_id = $1 AND ($2::uuid IS NULL OR d.site_id = $2) ORDER BY d.created_at DESC, d.name`,
      [caller.organisationId, siteId ?? null],
    )) as WeatherDatasetRow[];
    return { items: rows.map(toWeatherDataset) };
  }

  async get(caller: AuthUser, id: string): Promise<WeatherDatasetResponse> {
    return toWeatherDataset(await this.findOwnedRow(caller, id));
  }

  async remove(caller: AuthUser, id: string): Promise<void> {
    const [, deleted] = (await this.dataSource.query(`DELETE FROM weather_dataset WHERE id = $1 AND organisation_id = $2`, [id, caller.organisationId])) as [unknown, number];
    if (!deleted) throw new NotFoundException('Weather data set not found');
  }

  /** A data set of the caller's organisation with its records in time order (for the availability). */
  async recordsOf(caller: AuthUser, id: string): Promise<{ dataset: WeatherDatasetResponse; records: StoredVisibilityRecords }> {
    const dataset = toWeatherDataset(await this.findOwnedRow(caller, id));
    return { dataset, records: await readVisibilityRecords(this.dataSource, id) };
  }

  /**
   * Turns a stored upload into an import job: checks the fields (400 with the field, and the mapping's
   * columns against the file's header), queues the job in the same transaction that marks the import
   * queued, and waits for it up to WEATHER_IMPORT_WAIT_SECONDS (none with `respondAsync`).
   */
  async createFromUpload(caller: AuthUser, upload: StoredWeatherUpload | undefined, rawFields: unknown, respondAsync: boolean): Promise<UploadAnswer> {
    if (!upload) {
      throw new BadRequestException({ message: 'file is required: send the CSV as the multipart part "file"', issues: [{ path: 'file', message: 'is required' }] });
    }
    const discard = () => this.dataSource.query(`DELETE FROM weather_import WHERE id = $1 AND state = 'uploading'`, [upload.importId]);
    try {
      const parsed = WeatherDatasetUploadFieldsSchema.safeParse({ ...(rawFields as object) });
      if (!parsed.success) {
        const issues = formatZodIssues(parsed.error);
        throw new BadRequestException({ message: `${issues[0]!.path} ${issues[0]!.message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ''}`, issues });
      }
      const fields = parsed.data;
      if (fields.siteId && (await this.sites.findOwnedByIds(caller, [fields.siteId])).length === 0) {
        throw new BadRequestException({ message: 'siteId is not a site of your organisation', issues: [{ path: 'siteId', message: 'is not a site of your organisation' }] });
      }
      const resolved = resolveWeatherColumns(upload.facts.header, fields.mapping);
      if ('issues' in resolved) throw new BadRequestException({ message: `${resolved.issues[0]!.path} ${resolved.issues[0]!.message}`, issues: resolved.issues });

      const runner = this.dataSource.createQueryRunner();
      await runner.connect();
      try {
        await runner.startTransaction();
        const jobId = await this.jobs.send(WEATHER_IMPORT_QUEUE, { importId: upload.importId }, { ...importJobOptions(this.config.importRetries), db: jobConnectionOf(runner) });
        await runner.query(
          `UPDATE weather_import SET state = 'queued', name = $2, site_id = $3, notes = $4, mapping = $5, on_row_errors = $6, job_id = $7, updated_at = now() WHERE id = $1`,
          [upload.importId, fields.name, fields.siteId ?? null, fields.notes, JSON.stringify(fields.mapping), fields.onRowErrors, jobId],
        );
        await runner.commitTransaction();
      } catch (error) {
        if (runner.isTransactionActive) await runner.rollbackTransaction();
        throw error;
      } finally {
        await runner.release();
      }
    } catch (error) {
      await discard().catch(() => undefined);
      throw error;
    }
    if (this.localWorkerId) this.jobs.notifyWorker(this.localWorkerId);

    const job = respondAsync ? await this.getImport(caller, upload.importId) : await this.waitForImport(caller, upload.importId, this.config.importWaitMs);
    if (job.state === 'succeeded' && job.result) return { status: 201, body: job.result };
    if ((job.state === 'failed' || job.state === 'cancelled') && job.error) throw new HttpException(job.error, job.error.statusCode);
    return { status: 202, body: job };
  }

  async getImport(caller: AuthUser, importId: string): Promise<WeatherImportJob> {
    const [row] = (await this.dataSource.query(`SELECT ${IMPORT_COLUMNS} FROM weather_import WHERE id = $1 AND organisation_id = $2 AND state <> 'uploading'`, [
      importId,
      caller.organisationId,
    ])) as WeatherImportRow[];
    if (!row) throw new NotFoundException('Weather import not found');
    return toWeatherImportJob(row);
  }

  /** Asks a queued or running import to stop; it rolls back and ends `cancelled`. An ended import stays as it is (409). */
  async cancelImport(caller: AuthUser, importId: string): Promise<WeatherImportJob> {
    const current = await this.getImport(caller, importId);
    if ((FINAL_IMPORT_STATES as readonly string[]).includes(current.state)) {
      throw new HttpException({ message: `The import has already ${current.state === 'succeeded' ? 'succeeded' : `ended (${current.state})`}`, job: current }, 409);
    }
    await this.dataSource.transaction(async (manager) => {
      await manager.query(`UPDATE weather_import SET cancel_requested = true, updated_at = now() WHERE id = $1`, [importId]);
      // not started yet: it ends now (the job finds it cancelled and does nothing)
      const [, queued] = (await manager.query(
        `UPDATE weather_import SET state = 'cancelled', error = $2, updated_at = now() WHERE id = $1 AND state = 'queued' AND attempt = 0`,
        [importId, JSON.stringify({ statusCode: 409, error: 'Conflict', message: 'The import was cancelled before it started; nothing was stored.' })],
      )) as [unknown, number];
      if (queued) await manager.query(`DELETE FROM weather_import_chunk WHERE import_id = $1`, [importId]);
    });
    return this.waitForImport(caller, importId, 5000);
  }

  /** The import's state once it has ended, or after `waitMs` (local completions answer at once; others are polled). */
  async waitForImport(caller: AuthUser, importId: string, waitMs: number): Promise<WeatherImportJob> {
    const deadline = Date.now() + waitMs;
    for (;;) {
      const job = await this.getImport(caller, importId);
      const left = deadline - Date.now();
      if ((FINAL_IMPORT_STATES as readonly string[]).includes(job.state) || left <= 0) return job;
      await new Promise<void>((resolve) => {
        const done = (id: string) => {
          if (id === importId) finish();
        };
        const timer = setTimeout(() => finish(), Math.min(250, left));
        const finish = () => {
          clearTimeout(timer);
          this.events.off('ended', done);
          resolve();
        };
        this.events.on('ended', done);
      });
    }
  }

  private async findOwnedRow(caller: AuthUser, id: string): Promise<WeatherDatasetRow> {
    const [row] = (await this.dataSource.query(`SELECT ${DATASET_COLUMNS} FROM ${DATASET_FROM} WHERE d.id = $1 AND d.organisation_id = $2`, [id, caller.organisationId])) as WeatherDatasetRow[];
    if (!row) throw new NotFoundException('Weather data set not found');
    return row;
  }
}
