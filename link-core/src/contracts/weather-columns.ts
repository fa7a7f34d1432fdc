/**
 * Reading the cells of a weather file, shared by the api's import and the ui's mapping step so the
 * preview says what the import will do: the delimiter, the column guess, ISO 8601 timestamps,
 * numbers, missing-value markers and the checks each quantity must pass. Pure functions.
 */
import {
  METRES_PER_VISIBILITY_UNIT,
  WEATHER_OPTIONAL_COLUMNS,
  type OptionalWeatherColumn,
  type VisibilityUnit,
  type WeatherColumnMapping,
} from './weather.contract.js';
import type { VisibilityDefinition } from '../schemas/link-design.schema.js';

/** Delimiters a weather file may use, most common first. */
export const WEATHER_DELIMITERS = [',', ';', '\t', '|'] as const;
export type WeatherDelimiter = (typeof WEATHER_DELIMITERS)[number];

/**
 * Cells that mean "no reading" in weather exports (common practice): empty, NA/N/A, NaN, null,
 * a lone M (METAR's missing), -, and slashes (SYNOP's unavailable groups).
 */
export function isMissingValue(text: string): boolean {
  const value = text.trim().toLowerCase();
  return value === '' || value === 'na' || value === 'n/a' || value === 'nan' || value === 'null' || value === 'm' || value === '-' || /^\/+$/.test(value);
}

/**
 * The delimiter of a file from its header line: the candidate found most often outside quotes
 * (a comma when none is found).
 */
export function detectDelimiter(headerLine: string): WeatherDelimiter {
  const counts = new Map<WeatherDelimiter, number>(WEATHER_DELIMITERS.map((delimiter) => [delimiter, 0]));
  let quoted = false;
  for (const character of headerLine) {
    if (character === '"') quoted = !quoted;
    else if (!quoted && counts.has(character as WeatherDelimiter)) counts.set(character as WeatherDelimiter, counts.get(character as WeatherDelimiter)! + 1);
  }
  let best: WeatherDelimiter = ',';
  for (const delimiter of WEATHER_DELIMITERS) if (counts.get(delimiter)! > counts.get(best)!) best = delimiter;
  return best;
}

export type CellReading<Value> = { ok: true; value: Value } | { ok: false; message: string };

// date, then optional time (T or space), then an optional zone
const ISO_TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;

/**
 * An ISO 8601 timestamp as milliseconds since the epoch: `2024-03-01`, `2024-03-01T06:00`,
 * `2024-03-01 06:00:00.5`, with `Z` or an offset (`+01:00`, `+0100`, `+01`). Without a zone the
 * time is read as UTC. Years 1900 … 2100.
 */
export function parseObservationTime(text: string): CellReading<number> {
  const match = ISO_TIMESTAMP.exec(text.trim());
  if (!match) return { ok: false, message: `"${shorten(text)}" is not an ISO 8601 date and time (e.g. 2024-03-01T06:00Z)` };
  const [, year, month, day, hour = '0', minute = '0', second = '0', fraction = '', zone] = match;
  const y = Number(year);
  const mo = Number(month);
  const d = Number(day);
  const h = Number(hour);
  const mi = Number(minute);
  const s = Number(second);
  if (y < 1900 || y > 2100) return { ok: false, message: `the year ${y} is outside 1900 … 2100` };
  const daysInMonth = mo >= 1 && mo <= 12 ? new Date(Date.UTC(y, mo, 0)).getUTCDate() : 0;
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth) return { ok: false, message: `${year}-${month}-${day} is not a date` };
  if (h > 24 || mi > 59 || s > 59 || (h === 24 && (mi > 0 || s > 0))) return { ok: false, message: `${hour}:${minute}:${second} is not a time of day` };
  let offsetMinutes = 0;
  if (zone && zone.toUpperCase() !== 'Z') {
    const digits = zone.slice(1).replace(':', '');
    const zoneHours = Number(digits.slice(0, 2));
    const zoneMinutes = digits.length > 2 ? Number(digits.slice(2, 4)) : 0;
    if (zoneHours > 14 || zoneMinutes > 59) return { ok: false, message: `the zone offset ${zone} is not valid` };
    offsetMinutes = (zone.startsWith('-') ? -1 : 1) * (zoneHours * 60 + zoneMinutes);
  }
  const milliseconds = fraction ? Math.round(Number(`0.${fraction}`) * 1000) : 0;
  return { ok: true, value: Date.UTC(y, mo - 1, d, h, mi, s, milliseconds) - offsetMinutes * 60_000 };
}

const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * A decimal number with a point as the separator (`1500`, `0.8`, `1.2e-14`); a missing-value
 * marker reads as null. A comma decimal (`1,5`) is refused rather than guessed: `10,000` could be
 * ten or ten thousand.
 */
export function parseMeasurement(text: string): CellReading<number | null> {
  if (isMissingValue(text)) return { ok: true, value: null };
  const value = text.trim();
  if (/^[+-]?\d+,\d+$/.test(value)) return { ok: false, message: `"${shorten(text)}" has a comma: write decimals with a point` };
  if (!DECIMAL.test(value)) return { ok: false, message: `"${shorten(text)}" is not a number` };
  const number = Number(value);
  return Number.isFinite(number) ? { ok: true, value: number } : { ok: false, message: `"${shorten(text)}" is not a finite number` };
}

function shorten(text: string): string {
  const trimmed = text.trim();
  return trimmed.length > 40 ? `${trimmed.slice(0, 37)}…` : trimmed;
}

/** Largest visibility accepted [m]: the attenuation models stop at 1000 km, and no sensor reports more. */
export const MAX_VISIBILITY_M = 1_000_000;

/** The bounds each optional quantity must keep (wider than any weather, so only mistakes fail). */
const OPTIONAL_BOUNDS: Record<OptionalWeatherColumn, { min: number; max: number; minExclusive?: boolean }> = {
  rainRateColumn: { min: 0, max: 500 },
  snowRateColumn: { min: 0, max: 200 },
  temperatureColumn: { min: -90, max: 65 },
  cn2Column: { min: 0, max: 1e-10, minExclusive: true },
};

/** One row of a weather file, read and converted: timestamp [ms], visibility [m] or null, the optional quantities. */
export interface WeatherRow {
  observedAtMs: number;
  /** visibility [m] in the mapping's definition; null when the cell held no reading */
  visibilityM: number | null;
  rainRateMmPerH: number | null;
  snowRateMmPerH: number | null;
  temperatureC: number | null;
  cn2: number | null;
}

/** The column index of each mapped field in a file's header, or the mapping fields the header lacks. */
export interface ResolvedWeatherColumns {
  timestamp: number;
  visibility: number;
  optional: Partial<Record<OptionalWeatherColumn, number>>;
  names: string[];
  unit: VisibilityUnit;
  definition: VisibilityDefinition;
}

/** Header cells compared the way the mapping names them: trimmed, a byte-order mark dropped. */
export function normaliseHeader(header: readonly string[]): string[] {
  return header.map((cell, index) => (index === 0 ? cell.replace(/^\uFEFF/, '') : cell).trim().normalize('NFC'));
}

/**
 * Finds each mapped column in the header. Returns the issues (path `mapping.<field>`) for columns the
 * header does not have.
 */
export function resolveWeatherColumns(header: readonly string[], mapping: WeatherColumnMapping): { columns: ResolvedWeatherColumns } | { issues: { path: string; message: string }[] } {
  const names = normaliseHeader(header);
  const issues: { path: string; message: string }[] = [];
  const find = (field: keyof WeatherColumnMapping, column: string): number => {
    const index = names.indexOf(column);
    if (index < 0) issues.push({ path: `mapping.${field}`, message: `names the column "${column}", which is not in the file's header (${names.map((name) => `"${name}"`).join(', ')})` });
    return index;
  };
  const timestamp = find('timestampColumn', mapping.timestampColumn);
  const visibility = find('visibilityColumn', mapping.visibilityColumn);
  const optional: Partial<Record<OptionalWeatherColumn, number>> = {};
  for (const field of Object.keys(WEATHER_OPTIONAL_COLUMNS) as OptionalWeatherColumn[]) {
    const column = mapping[field];
    if (column !== undefined) optional[field] = find(field, column);
  }
  if (issues.length) return { issues };
  return { columns: { timestamp, visibility, optional, names, unit: mapping.visibilityUnit, definition: mapping.visibilityDefinition } };
}

/**
 * Reads one data row with the resolved columns. Every cell that cannot be read gives its own error
 * (column name and reason); the caller adds the line number.
 */
export function readWeatherRow(cells: readonly string[], columns: ResolvedWeatherColumns): { ok: true; row: WeatherRow } | { ok: false; errors: { column: string | null; message: string }[] } {
  if (cells.length !== columns.names.length) {
    return { ok: false, errors: [{ column: null, message: `has ${cells.length} field${cells.length === 1 ? '' : 's'} where the header has ${columns.names.length}` }] };
  }
  const errors: { column: string | null; message: string }[] = [];
  const time = parseObservationTime(cells[columns.timestamp]!);
  if (!time.ok) errors.push({ column: columns.names[columns.timestamp]!, message: time.message });
  let visibilityM: number | null = null;
  const visibility = parseMeasurement(cells[columns.visibility]!);
  if (!visibility.ok) errors.push({ column: columns.names[columns.visibility]!, message: visibility.message });
  else if (visibility.value !== null) {
    const metres = visibility.value * METRES_PER_VISIBILITY_UNIT[columns.unit];
    if (!(metres > 0)) errors.push({ column: columns.names[columns.visibility]!, message: `visibility must be greater than 0 (a 0 from a sensor means "below its lowest step": give that step, e.g. 50 m)` });
    else if (metres > MAX_VISIBILITY_M) errors.push({ column: columns.names[columns.visibility]!, message: `${visibility.value} ${columns.unit} is more than 1000 km` });
    else visibilityM = metres;
  }
  const optional: Record<OptionalWeatherColumn, number | null> = { rainRateColumn: null, snowRateColumn: null, temperatureColumn: null, cn2Column: null };
  for (const [field, index] of Object.entries(columns.optional) as [OptionalWeatherColumn, number][]) {
    const reading = parseMeasurement(cells[index]!);
    const column = columns.names[index]!;
    if (!reading.ok) {
      errors.push({ column, message: reading.message });
      continue;
    }
    if (reading.value === null) continue;
    const bounds = OPTIONAL_BOUNDS[field];
    const { unit, label } = WEATHER_OPTIONAL_COLUMNS[field];
    const belowMin = bounds.minExclusive ? !(reading.value > bounds.min) : reading.value < bounds.min;
    if (belowMin || reading.value > bounds.max) {
      errors.push({ column, message: `${label.toLowerCase()} ${reading.value} ${unit} is outside ${bounds.minExclusive ? 'above ' : ''}${bounds.min} … ${bounds.max} ${unit}` });
    } else optional[field] = reading.value;
  }
  if (errors.length || !time.ok) return { ok: false, errors };
  return {
    ok: true,
    row: {
      observedAtMs: time.value,
      visibilityM,
      rainRateMmPerH: optional.rainRateColumn,
      snowRateMmPerH: optional.snowRateColumn,
      temperatureC: optional.temperatureColumn,
      cn2: optional.cn2Column,
    },
  };
}

/** The mapping fields a file's header and first rows suggest; the user confirms or changes them. */
export type GuessedWeatherMapping = Partial<WeatherColumnMapping>;

const HEADER_HINTS: { field: keyof WeatherColumnMapping; pattern: RegExp }[] = [
  { field: 'timestampColumn', pattern: /time|date|valid|obs|utc|when/i },
  { field: 'visibilityColumn', pattern: /vis|vsby|mor\b|^mor|sicht/i },
  { field: 'rainRateColumn', pattern: /rain|precip|prcp|rr\b/i },
  { field: 'snowRateColumn', pattern: /snow/i },
  { field: 'temperatureColumn', pattern: /temp|tmp|^t$|air_?t|tair|°c/i },
  { field: 'cn2Column', pattern: /cn2|cn\^?2|cn²|c_?n/i },
];

/**
 * Guesses the mapping from the header names and, where the names say nothing, from the first rows:
 * the first column whose cells read as timestamps, a visibility unit from the name (km, mi/SM, ft)
 * or from the size of the figures (a median above 100 reads as metres), MOR unless the name says 2 %.
 *
 * @param header the header cells
 * @param rows the first data rows (cells as text)
 * @returns the fields it could guess
 */
export function guessWeatherMapping(header: readonly string[], rows: readonly (readonly string[])[]): GuessedWeatherMapping {
  const names = normaliseHeader(header);
  const guess: GuessedWeatherMapping = {};
  const taken = new Set<string>();
  for (const { field, pattern } of HEADER_HINTS) {
    const name = names.find((candidate) => !taken.has(candidate) && pattern.test(candidate));
    if (name) {
      (guess as Record<string, string>)[field] = name;
      taken.add(name);
    }
  }
  const columnValues = (index: number) => rows.map((row) => row[index] ?? '').filter((cell) => !isMissingValue(cell));
  if (!guess.timestampColumn) {
    const index = names.findIndex((name, i) => !taken.has(name) && columnValues(i).length > 0 && columnValues(i).every((cell) => parseObservationTime(cell).ok));
    if (index >= 0) {
      guess.timestampColumn = names[index]!;
      taken.add(names[index]!);
    }
  }
  if (guess.visibilityColumn) {
    const name = guess.visibilityColumn;
    if (/\bkm\b|_km|\(km\)|km$/i.test(name)) guess.visibilityUnit = 'km';
    else if (/\bmi\b|_mi|\(mi\)|miles|\bsm\b|_sm|vsby/i.test(name)) guess.visibilityUnit = 'mi';
    else if (/\bft\b|_ft|\(ft\)|feet/i.test(name)) guess.visibilityUnit = 'ft';
    else if (/\bm\b|_m\b|\(m\)|metre|meter/i.test(name)) guess.visibilityUnit = 'm';
    else {
      const values = columnValues(names.indexOf(name))
        .map((cell) => parseMeasurement(cell))
        .flatMap((reading) => (reading.ok && reading.value !== null ? [reading.value] : []))
        .sort((a, b) => a - b);
      if (values.length) guess.visibilityUnit = values[Math.floor(values.length / 2)]! > 100 ? 'm' : 'km';
    }
    guess.visibilityDefinition = /2\s*%|2\s*pct|contrast|visual.?range/i.test(name) ? 'contrast-2-percent' : 'mor-5-percent';
  }
  return guess;
}
