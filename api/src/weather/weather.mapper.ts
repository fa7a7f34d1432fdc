import type { VisibilityDefinition } from '@beamwright/link-core';
import type { VisibilityUnit, WeatherDataset, WeatherImportJob, WeatherImportResult } from '@beamwright/link-core/contracts';
import type { WeatherImportRowState } from './weather-import.entity.js';

/** A data set as the service's query reads it (with its site's and author's names). */
export interface WeatherDatasetRow {
  id: string;
  name: string;
  notes: string;
  siteId: string | null;
  siteName: string | null;
  visibilityDefinition: VisibilityDefinition;
  sourceUnit: VisibilityUnit | null;
  sourceFileName: string | null;
  recordCount: number;
  missingVisibilityCount: number;
  firstObservedAt: Date | null;
  lastObservedAt: Date | null;
  hasRainRate: boolean;
  hasSnowRate: boolean;
  hasTemperature: boolean;
  hasCn2: boolean;
  invented: boolean;
  createdAt: Date;
  createdById: string | null;
  createdByName: string | null;
}

export function toWeatherDataset(row: WeatherDatasetRow): WeatherDataset {
  return {
    id: row.id,
    name: row.name,
    notes: row.notes,
    siteId: row.siteId,
    siteName: row.siteName,
    visibilityDefinition: row.visibilityDefinition,
    sourceUnit: row.sourceUnit,
    sourceFileName: row.sourceFileName,
    recordCount: row.recordCount,
    missingVisibilityCount: row.missingVisibilityCount,
    firstObservedAt: row.firstObservedAt?.toISOString() ?? null,
    lastObservedAt: row.lastObservedAt?.toISOString() ?? null,
    measured: { rainRate: row.hasRainRate, snowRate: row.hasSnowRate, temperature: row.hasTemperature, cn2: row.hasCn2 },
    invented: row.invented,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdById && row.createdByName ? { id: row.createdById, displayName: row.createdByName } : null,
  };
}

/** An import as the service's query reads it. */
export interface WeatherImportRow {
  id: string;
  state: WeatherImportRowState;
  name: string;
  fileName: string;
  byteCount: number;
  bytesRead: number;
  rowsRead: number;
  attempt: number;
  result: WeatherImportResult | null;
  error: WeatherImportJob['error'];
  createdAt: Date;
  updatedAt: Date;
}

export const importStatusUrl = (importId: string) => `/api/weather-datasets/imports/${importId}`;

export function toWeatherImportJob(row: WeatherImportRow): WeatherImportJob {
  const state = row.state === 'uploading' ? 'queued' : row.state;
  // reading the file is most of the work; the last tenth is the write of the rows
  const progress = state === 'succeeded' ? 1 : row.byteCount > 0 ? Math.min(0.9, (0.9 * row.bytesRead) / row.byteCount) : 0;
  return {
    jobId: row.id,
    state,
    statusUrl: importStatusUrl(row.id),
    name: row.name,
    fileName: row.fileName,
    bytesTotal: row.byteCount,
    bytesRead: Math.min(row.bytesRead, row.byteCount),
    rowsRead: row.rowsRead,
    progress,
    attempt: row.attempt,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    result: row.result,
    error: row.error,
  };
}
