import type { EntityManager, QueryRunner } from 'typeorm';

/** Rows per INSERT: large enough that 87 600 rows take a handful of statements, small enough to stay far from the parameter limits. */
export const RECORD_BATCH_ROWS = 5000;

/** Columns of records on their way to weather_record, one array per column (times in ms since the epoch). */
export interface RecordColumns {
  observedAtMs: number[];
  visibilityM: (number | null)[];
  rainRateMmPerH: (number | null)[];
  snowRateMmPerH: (number | null)[];
  temperatureC: (number | null)[];
  cn2: (number | null)[];
}

export function emptyRecordColumns(): RecordColumns {
  return { observedAtMs: [], visibilityM: [], rainRateMmPerH: [], snowRateMmPerH: [], temperatureC: [], cn2: [] };
}

type Executor = Pick<EntityManager, 'query'> | Pick<QueryRunner, 'query'>;

/**
 * Inserts records of one data set with one statement per batch: every column travels as one array
 * parameter and unnest() turns them back into rows (the fastest way short of COPY, and with no new
 * dependency). The caller's transaction decides whether they stay.
 */
export async function insertRecords(executor: Executor, datasetId: string, columns: RecordColumns): Promise<void> {
  for (let start = 0; start < columns.observedAtMs.length; start += RECORD_BATCH_ROWS) {
    const end = start + RECORD_BATCH_ROWS;
    await executor.query(
      `INSERT INTO weather_record (dataset_id, observed_at, visibility_m, rain_rate_mm_per_h, snow_rate_mm_per_h, temperature_c, cn2)
       SELECT $1, to_timestamp(t / 1000.0), v, r, s, c, n
         FROM unnest($2::float8[], $3::float8[], $4::float8[], $5::float8[], $6::float8[], $7::float8[]) AS u(t, v, r, s, c, n)`,
      [
        datasetId,
        columns.observedAtMs.slice(start, end),
        columns.visibilityM.slice(start, end),
        columns.rainRateMmPerH.slice(start, end),
        columns.snowRateMmPerH.slice(start, end),
        columns.temperatureC.slice(start, end),
        columns.cn2.slice(start, end),
      ],
    );
  }
}

/** A data set's visibility records in time order, as link-core's availability routines take them. */
export interface StoredVisibilityRecords {
  timestampsMs: Float64Array;
  /** [m]; NaN where the file held no reading */
  visibilityM: Float64Array;
}

/**
 * Reads a data set's records for the availability: two arrays built in PostgreSQL (one row comes
 * back, not one per record), parsed into typed arrays.
 */
export async function readVisibilityRecords(executor: Executor, datasetId: string): Promise<StoredVisibilityRecords> {
  const [row] = (await executor.query(
    `SELECT coalesce(string_agg((extract(epoch FROM observed_at) * 1000)::bigint::text, ',' ORDER BY observed_at), '') AS times,
            coalesce(string_agg(coalesce(visibility_m::text, ''), ',' ORDER BY observed_at), '') AS visibilities
       FROM weather_record WHERE dataset_id = $1`,
    [datasetId],
  )) as { times: string; visibilities: string }[];
  if (!row || row.times === '') return { timestampsMs: new Float64Array(0), visibilityM: new Float64Array(0) };
  const times = row.times.split(',');
  const visibilities = row.visibilities.split(',');
  const timestampsMs = new Float64Array(times.length);
  const visibilityM = new Float64Array(times.length);
  for (let i = 0; i < times.length; i++) {
    timestampsMs[i] = Number(times[i]);
    visibilityM[i] = visibilities[i] === '' ? Number.NaN : Number(visibilities[i]);
  }
  return { timestampsMs, visibilityM };
}
