import { Readable } from 'node:stream';
import { createGunzip } from 'node:zlib';
import { parse, type CsvError } from 'csv-parse';
import type { DataSource, QueryRunner } from 'typeorm';
import {
  WEATHER_UPLOAD_LIMITS,
  readWeatherRow,
  resolveWeatherColumns,
  type ResolvedWeatherColumns,
  type WeatherImportJob,
  type WeatherImportResult,
  type WeatherRowError,
} from '@beamwright/link-core/contracts';
import { RECORD_BATCH_ROWS, emptyRecordColumns, type RecordColumns } from './weather-records.writer.js';
import type { WeatherImport } from './weather-import.entity.js';

/** An import that ends without storing anything, with the answer its request gets (422, 413, 415, 400). */
export class ImportRefusal extends Error {
  constructor(readonly body: NonNullable<WeatherImportJob['error']>) {
    super(body.message);
  }
}

/** An import stopped on purpose: cancelled by its user, or its process is shutting down. */
export class ImportStopped extends Error {
  constructor(readonly reason: 'cancelled' | 'shutdown' | 'superseded') {
    super(`import ${reason}`);
  }
}

export interface ImportProcessorOptions {
  /** how often the heartbeat and the progress are written [ms] */
  heartbeatMs: number;
  /** the run gives up (and is retried) before its job would expire [ms] */
  deadlineMs: number;
  /** the most data rows one import takes (default WEATHER_UPLOAD_LIMITS.maxRows) */
  maxRows?: number;
}

type ImportRow = Pick<WeatherImport, 'id' | 'organisationId' | 'createdById' | 'state' | 'name' | 'siteId' | 'notes' | 'mapping' | 'onRowErrors' | 'fileName' | 'byteCount' | 'gzip' | 'encoding' | 'attempt' | 'cancelRequested'> & {
  delimiter: string;
};

const listedErrors = WEATHER_UPLOAD_LIMITS.maxListedRowErrors;
const plural = (count: number, word: string) => `${count.toLocaleString('en-GB')} ${word}${count === 1 ? '' : 's'}`;

/**
 * Runs one weather import: reads the uploaded chunks in order, inflates them when gzip, parses the
 * CSV as a stream (csv-parse; never the whole file in memory), checks every row with the shared cell
 * readers, and writes the rows and the data set in ONE transaction: a failed, cancelled or killed run
 * leaves nothing behind (PostgreSQL rolls back a transaction whose connection dies), and the earlier
 * data sets are never touched. Progress and a heartbeat go out on a separate connection.
 *
 * Plain (no Nest), so a separate worker process can run it. A run commits only while it is the
 * import's latest attempt, so a run presumed dead that wakes up cannot store the data a second time.
 */
export class WeatherImportProcessor {
  constructor(
    private readonly dataSource: DataSource,
    private readonly options: ImportProcessorOptions,
  ) {}

  /**
   * Runs the import `importId` if it is waiting or was interrupted; returns what it ended as.
   * Throws (so the job is failed and retried) on an unexpected error or on `signal` (shutdown).
   */
  async run(importId: string, signal?: AbortSignal): Promise<'succeeded' | 'failed' | 'cancelled' | 'skipped'> {
    const claimed = (await this.dataSource.query(
      `UPDATE weather_import SET state = 'running', attempt = attempt + 1, heartbeat_at = now(), bytes_read = 0, rows_read = 0, updated_at = now()
        WHERE id = $1 AND state IN ('queued', 'running')
        RETURNING id, organisation_id AS "organisationId", created_by_id AS "createdById", state, name, site_id AS "siteId", notes, mapping,
                  on_row_errors AS "onRowErrors", file_name AS "fileName", byte_count::float8 AS "byteCount", gzip, encoding, delimiter, attempt,
                  cancel_requested AS "cancelRequested"`,
      [importId],
    )) as [ImportRow[], number];
    const row = claimed[0][0];
    if (!row) return 'skipped';
    if (row.cancelRequested) {
      await this.finish(row, 'cancelled', { error: { statusCode: 409, error: 'Conflict', message: 'The import was cancelled before it started; nothing was stored.' } });
      return 'cancelled';
    }

    const progress = { bytesRead: 0, rowsRead: 0, cancelRequested: false };
    let heartbeatRunning = false;
    const heartbeat = setInterval(() => {
      if (heartbeatRunning) return;
      heartbeatRunning = true;
      this.dataSource
        .query(
          `UPDATE weather_import SET heartbeat_at = now(), bytes_read = $2, rows_read = $3, updated_at = now()
            WHERE id = $1 AND attempt = $4 AND state = 'running' RETURNING cancel_requested AS "cancelRequested"`,
          [row.id, progress.bytesRead, progress.rowsRead, row.attempt],
        )
        .then((result: [{ cancelRequested: boolean }[], number]) => {
          if (result[0][0]?.cancelRequested) progress.cancelRequested = true;
        })
        .catch(() => undefined)
        .finally(() => {
          heartbeatRunning = false;
        });
    }, this.options.heartbeatMs);
    const startedAt = Date.now();
    const checkStop = () => {
      if (progress.cancelRequested) throw new ImportStopped('cancelled');
      if (signal?.aborted) throw new ImportStopped('shutdown');
      if (Date.now() - startedAt > this.options.deadlineMs) throw new Error('the import ran past its time limit');
    };

    const runner = this.dataSource.createQueryRunner();
    try {
      await runner.connect();
      await runner.startTransaction();
      const result = await this.importRows(runner, row, progress, checkStop);
      // the last word: only the latest attempt of a running import may store its data
      const [current] = (await runner.query(`SELECT attempt, state, cancel_requested AS "cancelRequested" FROM weather_import WHERE id = $1 FOR UPDATE`, [row.id])) as {
        attempt: number;
        state: string;
        cancelRequested: boolean;
      }[];
      if (!current || current.attempt !== row.attempt || current.state !== 'running') throw new ImportStopped('superseded');
      if (current.cancelRequested) throw new ImportStopped('cancelled');
      await runner.query(
        `UPDATE weather_import SET state = 'succeeded', result = $2, dataset_id = $3, error = NULL, bytes_read = byte_count, rows_read = $4, updated_at = now() WHERE id = $1`,
        [row.id, JSON.stringify(result), result.id, progress.rowsRead],
      );
      await runner.query(`DELETE FROM weather_import_chunk WHERE import_id = $1`, [row.id]);
      await runner.commitTransaction();
      return 'succeeded';
    } catch (error) {
      if (runner.isTransactionActive) await runner.rollbackTransaction().catch(() => undefined);
      if (error instanceof ImportRefusal) {
        await this.finish(row, 'failed', { error: error.body, rowsRead: progress.rowsRead });
        return 'failed';
      }
      if (error instanceof ImportStopped && error.reason === 'cancelled') {
        await this.finish(row, 'cancelled', { error: { statusCode: 409, error: 'Conflict', message: 'The import was cancelled; nothing was stored.' }, rowsRead: progress.rowsRead });
        return 'cancelled';
      }
      if (error instanceof ImportStopped && error.reason === 'superseded') return 'skipped';
      // interrupted: back in the queue for the retry pg-boss makes of the failed job
      await this.dataSource
        .query(`UPDATE weather_import SET state = 'queued', heartbeat_at = NULL, updated_at = now() WHERE id = $1 AND attempt = $2 AND state = 'running'`, [row.id, row.attempt])
        .catch(() => undefined);
      throw error;
    } finally {
      clearInterval(heartbeat);
      await runner.release().catch(() => undefined);
    }
  }

  /** Ends an import without data: its state and answer, and its uploaded bytes deleted. */
  private async finish(row: ImportRow, state: 'failed' | 'cancelled', outcome: { error: NonNullable<WeatherImportJob['error']>; rowsRead?: number }): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      await manager.query(
        `UPDATE weather_import SET state = $3, error = $4, rows_read = coalesce($5, rows_read), heartbeat_at = NULL, updated_at = now()
          WHERE id = $1 AND attempt = $2 AND state IN ('queued', 'running')`,
        [row.id, row.attempt, state, JSON.stringify(outcome.error), outcome.rowsRead ?? null],
      );
      await manager.query(`DELETE FROM weather_import_chunk WHERE import_id = $1`, [row.id]);
    });
  }

  /** The uploaded bytes, chunk by chunk, in order (one chunk in memory at a time), on a connection of their own. */
  private chunks(importId: string, progress: { bytesRead: number }): Readable {
    let seq = 0;
    const dataSource = this.dataSource;
    return new Readable({
      read() {
        dataSource
          .query(`SELECT data FROM weather_import_chunk WHERE import_id = $1 AND seq = $2`, [importId, seq])
          .then((rows: { data: Buffer }[]) => {
            seq += 1;
            const data = rows[0]?.data;
            if (data) progress.bytesRead += data.length;
            this.push(data ?? null);
          })
          .catch((error: Error) => this.destroy(error));
      },
    });
  }

  /** Reads, checks and stages every row; then writes the data set and its records. Throws ImportRefusal for a file it will not store. */
  private async importRows(runner: QueryRunner, row: ImportRow, progress: { bytesRead: number; rowsRead: number }, checkStop: () => void): Promise<WeatherImportResult> {
    if (!row.mapping) throw new Error(`import ${row.id} has no mapping`);
    const mapping = row.mapping;
    const maxRows = this.options.maxRows ?? WEATHER_UPLOAD_LIMITS.maxRows;
    await runner.query(
      `CREATE TEMPORARY TABLE weather_staging (line integer, observed_at_ms float8, visibility_m float8, rain_rate_mm_per_h float8, snow_rate_mm_per_h float8, temperature_c float8, cn2 float8) ON COMMIT DROP`,
    );
    const rowErrors: WeatherRowError[] = [];
    let rowErrorCount = 0;
    const addError = (error: WeatherRowError) => {
      rowErrorCount += 1;
      if (rowErrors.length < listedErrors) rowErrors.push(error);
    };

    const source = this.chunks(row.id, progress);
    const parser = parse({
      delimiter: row.delimiter,
      bom: true,
      encoding: row.encoding,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      // a quote that never closes would swallow the rest of the file: one row is refused instead
      max_record_size: 64 * 1024,
      skip_records_with_error: true,
      on_skip: (error: CsvError | undefined) => {
        const line = typeof error?.lines === 'number' ? error.lines : 0;
        addError({ line: Math.max(1, line), column: null, message: `cannot be read as CSV: ${error?.message ?? 'malformed row'}` });
        return undefined;
      },
    });
    const input = row.gzip ? source.pipe(createGunzip()) : source;
    input.on('error', (error) => parser.destroy(error));
    input.pipe(parser);

    let columns: ResolvedWeatherColumns | undefined;
    let batch: RecordColumns & { line: number[] } = { ...emptyRecordColumns(), line: [] };
    let dataRows = 0;
    const flush = async () => {
      if (batch.line.length === 0) return;
      checkStop();
      await runner.query(
        `INSERT INTO weather_staging SELECT * FROM unnest($1::int[], $2::float8[], $3::float8[], $4::float8[], $5::float8[], $6::float8[], $7::float8[])`,
        [batch.line, batch.observedAtMs, batch.visibilityM, batch.rainRateMmPerH, batch.snowRateMmPerH, batch.temperatureC, batch.cn2],
      );
      batch = { ...emptyRecordColumns(), line: [] };
    };

    try {
      for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
        if (!columns) {
          const resolved = resolveWeatherColumns(record, mapping);
          if ('issues' in resolved) {
            throw new ImportRefusal({ statusCode: 400, error: 'Bad Request', message: `${resolved.issues[0]!.path} ${resolved.issues[0]!.message}`, issues: resolved.issues });
          }
          columns = resolved.columns;
          continue;
        }
        dataRows += 1;
        progress.rowsRead = dataRows;
        if (dataRows > maxRows) {
          throw new ImportRefusal({
            statusCode: 413,
            error: 'Payload Too Large',
            message: `The file has more than ${maxRows.toLocaleString('en-GB')} rows, the most one import takes; split it into several data sets.`,
          });
        }
        const read = readWeatherRow(record, columns);
        if (!read.ok) {
          for (const error of read.errors) addError({ line: info.lines, ...error });
          continue;
        }
        batch.line.push(info.lines);
        batch.observedAtMs.push(read.row.observedAtMs);
        batch.visibilityM.push(read.row.visibilityM);
        batch.rainRateMmPerH.push(read.row.rainRateMmPerH);
        batch.snowRateMmPerH.push(read.row.snowRateMmPerH);
        batch.temperatureC.push(read.row.temperatureC);
        batch.cn2.push(read.row.cn2);
        if (batch.line.length >= RECORD_BATCH_ROWS) await flush();
      }
      await flush();
    } finally {
      source.destroy();
    }
    checkStop();

    // one record per instant: a time seen before is an error on every later line that repeats it
    const duplicates = (await runner.query(
      `SELECT line, first_line AS "firstLine" FROM (
         SELECT line, min(line) OVER (PARTITION BY observed_at_ms) AS first_line FROM weather_staging
       ) AS seen WHERE line <> first_line ORDER BY line`,
    )) as { line: number; firstLine: number }[];
    const timeColumn = mapping.timestampColumn;
    for (const duplicate of duplicates) addError({ line: duplicate.line, column: timeColumn, message: `repeats the time of line ${duplicate.firstLine}` });
    rowErrors.sort((a, b) => a.line - b.line);

    if (rowErrorCount > 0 && row.onRowErrors === 'reject') {
      throw new ImportRefusal({
        statusCode: 422,
        error: 'Unprocessable Entity',
        message: `${plural(rowErrorCount, 'problem')} in the file's rows, so nothing was imported. Fix the rows listed, or upload again with onRowErrors "skip" to import only the valid rows.`,
        rowErrors,
        rowErrorCount,
      });
    }
    if (duplicates.length) await runner.query(`DELETE FROM weather_staging s USING unnest($1::int[]) AS d(line) WHERE s.line = d.line`, [duplicates.map((duplicate) => duplicate.line)]);

    const [summary] = (await runner.query(
      `SELECT count(*)::int AS count, count(*) FILTER (WHERE visibility_m IS NULL)::int AS missing,
              min(observed_at_ms) AS first, max(observed_at_ms) AS last,
              bool_or(rain_rate_mm_per_h IS NOT NULL) AS rain, bool_or(snow_rate_mm_per_h IS NOT NULL) AS snow,
              bool_or(temperature_c IS NOT NULL) AS temperature, bool_or(cn2 IS NOT NULL) AS cn2
         FROM weather_staging`,
    )) as { count: number; missing: number; first: number | null; last: number | null; rain: boolean; snow: boolean; temperature: boolean; cn2: boolean }[];
    if (!summary || summary.count === 0) {
      throw new ImportRefusal({
        statusCode: 422,
        error: 'Unprocessable Entity',
        message: dataRows === 0 ? 'The file has a header but no data rows; nothing was imported.' : 'No row of the file could be read, so nothing was imported.',
        rowErrors,
        rowErrorCount,
      });
    }
    checkStop();

    const [dataset] = (await runner.query(
      `INSERT INTO weather_dataset (organisation_id, site_id, name, notes, visibility_definition, source_unit, source_file_name, mapping, record_count,
                                    missing_visibility_count, first_observed_at, last_observed_at, has_rain_rate, has_snow_rate, has_temperature, has_cn2, created_by_id)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, to_timestamp($11::float8 / 1000), to_timestamp($12::float8 / 1000), $13, $14, $15, $16, $17)
       RETURNING id`,
      [
        row.organisationId,
        row.siteId,
        row.name,
        row.notes,
        mapping.visibilityDefinition,
        mapping.visibilityUnit,
        row.fileName.slice(0, 255) || null,
        JSON.stringify(mapping),
        summary.count,
        summary.missing,
        summary.first,
        summary.last,
        summary.rain,
        summary.snow,
        summary.temperature,
        summary.cn2,
        row.createdById,
      ],
    )) as { id: string }[];
    await runner.query(
      `INSERT INTO weather_record (dataset_id, observed_at, visibility_m, rain_rate_mm_per_h, snow_rate_mm_per_h, temperature_c, cn2)
       SELECT $1, to_timestamp(observed_at_ms / 1000.0), visibility_m, rain_rate_mm_per_h, snow_rate_mm_per_h, temperature_c, cn2 FROM weather_staging`,
      [dataset!.id],
    );
    return { id: dataset!.id, rowsImported: summary.count, rowErrors, rowErrorCount, missingVisibilityCount: summary.missing };
  }
}
