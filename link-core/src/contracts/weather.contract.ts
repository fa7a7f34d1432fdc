/**
 * Weather data sets and the availability of a revision over them: the multipart upload of a site's
 * visibility history (CSV or gzip CSV) with its column mapping, the import job that reads it, the
 * data sets, and the availability analysis (METHODS.md §11). The api validates with these schemas;
 * the ui's mapping step, upload and availability page read them.
 */
import { z } from 'zod';
import { VisibilityClimatologySchema } from '../schemas/availability.schema.js';
import { VISIBILITY_DEFINITIONS, type VisibilityDefinition } from '../schemas/link-design.schema.js';
import { UserRefSchema } from './auth.contract.js';
import { IsoDateTimeSchema, textField } from './common.contract.js';
import { ErrorBodySchema } from './error.contract.js';
import { MAX_VARIANTS_PER_REVISION } from './variants.contract.js';

/** What one upload may hold: 50 MB on the wire (gzip counts compressed) and 2 million rows. */
export const WEATHER_UPLOAD_LIMITS = {
  maxBytes: 50 * 1024 * 1024,
  maxRows: 2_000_000,
  /** row errors listed in an answer; the count covers them all */
  maxListedRowErrors: 1000,
} as const;

/** Hours of a year in the availability figures (365.25 days, as link-core's availability routines count). */
export const HOURS_PER_YEAR = 8766;

/** Units a visibility column may be in. */
export const VISIBILITY_UNITS = ['m', 'km', 'mi', 'ft'] as const;
export type VisibilityUnit = (typeof VISIBILITY_UNITS)[number];
/** Metres per unit; `mi` is the statute mile (1609.344 m, exact by definition), `ft` the international foot (0.3048 m). */
export const METRES_PER_VISIBILITY_UNIT: Record<VisibilityUnit, number> = { m: 1, km: 1000, mi: 1609.344, ft: 0.3048 };
export const VISIBILITY_UNIT_LABELS: Record<VisibilityUnit, string> = { m: 'metres (m)', km: 'kilometres (km)', mi: 'statute miles (mi)', ft: 'feet (ft)' };
export const VISIBILITY_DEFINITION_LABELS: Record<VisibilityDefinition, string> = {
  'contrast-2-percent': '2 % contrast (visual range)',
  'mor-5-percent': '5 % contrast, MOR (airport sensors, METAR and SYNOP)',
};

/** What happens to the rows that cannot be read: refuse the whole file, or import the others. */
export const ROW_ERROR_POLICIES = ['reject', 'skip'] as const;
export type RowErrorPolicy = (typeof ROW_ERROR_POLICIES)[number];

/** The optional measured quantities, their mapping field and their unit. */
export const WEATHER_OPTIONAL_COLUMNS = {
  rainRateColumn: { quantity: 'rainRate', label: 'Rain rate', unit: 'mm/h' },
  snowRateColumn: { quantity: 'snowRate', label: 'Snow rate (water equivalent)', unit: 'mm/h' },
  temperatureColumn: { quantity: 'temperature', label: 'Air temperature', unit: '°C' },
  cn2Column: { quantity: 'cn2', label: 'Cn²', unit: 'm^-2/3' },
} as const;
export type OptionalWeatherColumn = keyof typeof WEATHER_OPTIONAL_COLUMNS;

const columnName = textField({ min: 1, max: 200 });
const enumField = <const Values extends readonly [string, ...string[]]>(values: Values) =>
  z.enum(values, { error: (issue) => (issue.input === undefined ? 'is required' : `must be one of ${values.join(', ')}`) });

/**
 * Which column of the file holds what, by header name. Timestamps are ISO 8601 (`2024-03-01T06:00Z`,
 * `2024-03-01 06:00:00+01:00`); one without a zone is read as UTC.
 */
export const WeatherColumnMappingSchema = z
  .strictObject({
    timestampColumn: columnName,
    visibilityColumn: columnName,
    visibilityUnit: enumField(VISIBILITY_UNITS),
    visibilityDefinition: enumField(VISIBILITY_DEFINITIONS),
    /** rain rate [mm/h] */
    rainRateColumn: columnName.optional(),
    /** snow rate, water equivalent [mm/h] */
    snowRateColumn: columnName.optional(),
    /** air temperature [°C] */
    temperatureColumn: columnName.optional(),
    /** refractive-index structure parameter Cn² [m^-2/3] */
    cn2Column: columnName.optional(),
  })
  .superRefine((mapping, context) => {
    const seen = new Map<string, string>();
    for (const field of ['timestampColumn', 'visibilityColumn', 'rainRateColumn', 'snowRateColumn', 'temperatureColumn', 'cn2Column'] as const) {
      const column = mapping[field];
      if (column === undefined) continue;
      const other = seen.get(column);
      if (other) context.addIssue({ code: 'custom', path: [field], message: `is the column already chosen for ${other}` });
      else seen.set(column, field);
    }
  });
export type WeatherColumnMapping = z.output<typeof WeatherColumnMappingSchema>;

const datasetFields = {
  name: textField({ min: 1, max: 200 }),
  notes: textField({ max: 4000, multiline: true }).default(''),
  onRowErrors: enumField(ROW_ERROR_POLICIES).default('reject'),
};

/** The upload as a form holds it (the ui's mapping step): the mapping as an object. */
export const WeatherDatasetUploadSchema = z.strictObject({
  ...datasetFields,
  siteId: z.uuid({ error: 'must be a site id (UUID)' }).optional(),
  mapping: WeatherColumnMappingSchema,
});
export type WeatherDatasetUpload = z.input<typeof WeatherDatasetUploadSchema>;

/**
 * The text fields of `POST /api/weather-datasets` (multipart/form-data, beside the `file` part):
 * `mapping` is the JSON text of {@link WeatherColumnMappingSchema}; an empty `siteId` means none.
 */
export const WeatherDatasetUploadFieldsSchema = z.strictObject({
  ...datasetFields,
  siteId: z.preprocess((value) => (value === '' ? undefined : value), z.uuid({ error: 'must be a site id (UUID)' }).optional()),
  mapping: z
    .string({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be the JSON text of the column mapping') })
    .transform((text, context) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        context.addIssue({ code: 'custom', message: 'must be the JSON text of the column mapping (it is not valid JSON)' });
        return z.NEVER;
      }
    })
    .pipe(WeatherColumnMappingSchema),
});

/** A row the import could not read: its line in the file (1 is the header), the column and why. */
export const WeatherRowErrorSchema = z.object({
  line: z.number().int().min(1),
  /** header name of the column; null when the row as a whole is wrong (e.g. too few fields) */
  column: z.string().nullable(),
  message: z.string(),
});
export type WeatherRowError = z.infer<typeof WeatherRowErrorSchema>;

/** The outcome of an import that stored a data set (201, or the `result` of a finished job). */
export const WeatherImportResultSchema = z.object({
  /** the new data set */
  id: z.uuid(),
  rowsImported: z.number().int().min(0),
  /** the rows left out (with `onRowErrors: 'skip'`), at most maxListedRowErrors of them */
  rowErrors: z.array(WeatherRowErrorSchema),
  rowErrorCount: z.number().int().min(0),
  /** rows whose visibility was empty or a missing-value marker ("NA", "M", "////"…): kept, counted as missing data */
  missingVisibilityCount: z.number().int().min(0),
});
export type WeatherImportResult = z.infer<typeof WeatherImportResultSchema>;

/** 422: rows could not be read and `onRowErrors` was `reject`; nothing was stored. */
export const WeatherRowErrorsBodySchema = ErrorBodySchema.extend({
  rowErrors: z.array(WeatherRowErrorSchema),
  rowErrorCount: z.number().int().min(0),
});
export type WeatherRowErrorsBody = z.infer<typeof WeatherRowErrorsBodySchema>;

export const WEATHER_IMPORT_STATES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export type WeatherImportState = (typeof WEATHER_IMPORT_STATES)[number];

/**
 * An import job (202, and `GET /api/weather-datasets/imports/:jobId`). It ends `succeeded` with the
 * 201 body in `result`, or `failed` / `cancelled` with the error the request would have answered
 * (422 with row errors, 413 too many rows, 415 not CSV…) in `error`.
 */
export const WeatherImportJobSchema = z.object({
  jobId: z.uuid(),
  state: z.enum(WEATHER_IMPORT_STATES),
  /** where to poll this job */
  statusUrl: z.string(),
  name: z.string(),
  fileName: z.string(),
  /** bytes of the uploaded file (compressed, for gzip) and how many the import has read so far */
  bytesTotal: z.number().int().min(0),
  bytesRead: z.number().int().min(0),
  rowsRead: z.number().int().min(0),
  /** 0 … 1: reading the file is most of the work; 1 once the rows are written */
  progress: z.number().min(0).max(1),
  /** 1 for the first run; a retry after an interrupted run counts up */
  attempt: z.number().int().min(0),
  createdAt: IsoDateTimeSchema,
  updatedAt: IsoDateTimeSchema,
  result: WeatherImportResultSchema.nullable(),
  error: ErrorBodySchema.extend({ rowErrors: z.array(WeatherRowErrorSchema).optional(), rowErrorCount: z.number().int().optional() }).nullable(),
});
export type WeatherImportJob = z.infer<typeof WeatherImportJobSchema>;

/** Which optional quantities a data set holds. */
export const WeatherMeasuredSchema = z.object({ rainRate: z.boolean(), snowRate: z.boolean(), temperature: z.boolean(), cn2: z.boolean() });

export const WeatherDatasetSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  notes: z.string(),
  siteId: z.uuid().nullable(),
  siteName: z.string().nullable(),
  /** the definition of the stored visibility figures (they are stored in metres) */
  visibilityDefinition: z.enum(VISIBILITY_DEFINITIONS),
  /** the unit the file gave visibility in; null for generated data */
  sourceUnit: z.enum(VISIBILITY_UNITS).nullable(),
  sourceFileName: z.string().nullable(),
  recordCount: z.number().int().min(0),
  missingVisibilityCount: z.number().int().min(0),
  firstObservedAt: IsoDateTimeSchema.nullable(),
  lastObservedAt: IsoDateTimeSchema.nullable(),
  measured: WeatherMeasuredSchema,
  /** true for the demo's synthetic records: invented, not measured anywhere */
  invented: z.boolean(),
  createdAt: IsoDateTimeSchema,
  createdBy: UserRefSchema.nullable(),
});
export type WeatherDataset = z.infer<typeof WeatherDatasetSchema>;

export const WeatherDatasetListQuerySchema = z.strictObject({
  siteId: z.uuid({ error: 'must be a site id (UUID)' }).optional(),
});
export const WeatherDatasetListResponseSchema = z.object({ items: z.array(WeatherDatasetSchema) });
export type WeatherDatasetListResponse = z.infer<typeof WeatherDatasetListResponseSchema>;

const requiredMarginDb = z.coerce
  .number({ error: 'must be a number of dB' })
  .min(-50, 'must be at least -50 dB')
  .max(100, 'must be at most 100 dB')
  .default(0);

/** A variant of the revision instead of its design: its 0-based position (absent: the revision's own design). */
const variantIndex = z.coerce
  .number({ error: 'must be a whole number' })
  .int('must be a whole number')
  .min(0, 'must be at least 0')
  .max(MAX_VARIANTS_PER_REVISION - 1, `must be at most ${MAX_VARIANTS_PER_REVISION - 1}`)
  .optional();

/** `GET /api/links/:id/revisions/:n/availability?datasetId=…&requiredMarginDb=…[&variant=N]` */
export const RevisionAvailabilityQuerySchema = z.strictObject({
  variant: variantIndex,
  datasetId: z.uuid({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be a data set id (UUID)') }),
  /** margin that must remain after the weather loss [dB] (default 0) */
  requiredMarginDb,
});
export type RevisionAvailabilityQuery = z.input<typeof RevisionAvailabilityQuerySchema>;

const nullableNumber = z.number().nullable();

export const AvailabilityRangeSchema = z.object({
  targetAvailability: z.number(),
  status: z.enum(['found', 'not-achievable', 'beyond-search-limit']),
  rangeM: nullableNumber,
  /** the visibility that decides at that range, in the data's definition [m] */
  visibilityM: z.number(),
});

const AvailabilityAtRangeSchema = z.object({ rangeM: z.number(), availability: nullableNumber });

/** How the figures were computed and what they leave out: shown wherever they are. */
export const AvailabilityMethodSchema = z.object({ summary: z.string(), assumptions: z.array(z.string()) });
export type AvailabilityMethod = z.infer<typeof AvailabilityMethodSchema>;

export const RevisionAvailabilitySchema = z.object({
  linkId: z.uuid(),
  revision: z.number().int(),
  /** the variant whose design was analysed; null: the revision's own design (optional: added with variants) */
  variant: z.object({ index: z.number().int(), name: z.string() }).nullable().optional(),
  datasetId: z.uuid(),
  requiredMarginDb: z.number(),
  visibilityDefinition: z.enum(VISIBILITY_DEFINITIONS),
  /** share of the covered hours with the margin at or above the requirement, 0 … 1; null when no record is usable */
  availability: nullableNumber,
  unavailableHours: z.number(),
  coveredHours: z.number(),
  /** unavailability × 8766 h: the expected downtime of a year [h] */
  annualDowntimeH: nullableNumber,
  outageCount: z.number().int(),
  longestOutageH: z.number(),
  /** the visibility below which the link fails, in the data set's definition [m]; null when it fails in any weather */
  minimumVisibilityM: nullableNumber,
  /** margin with no weather loss and no fade margin [dB] */
  clearAirMarginDb: z.number(),
  /** lowest margin left over the records [dB] */
  worstMarginDb: nullableNumber,
  recordCount: z.number().int(),
  usableCount: z.number().int(),
  missingCount: z.number().int(),
  /** calendar months (1 = January, UTC) with records, pooled over the years */
  months: z.array(z.object({ month: z.number().int().min(1).max(12), availability: z.number(), coveredHours: z.number(), unavailableHours: z.number() })),
  longestOutages: z.array(z.object({ startsAt: IsoDateTimeSchema.nullable(), durationH: z.number(), lowestVisibilityM: z.number() })),
  marginDistribution: z.object({
    binWidthDb: z.number(),
    floorDb: z.number(),
    belowHours: z.number(),
    bins: z.array(z.object({ lowerDb: z.number(), upperDb: z.number(), hours: z.number() })),
    exceeded: z.array(z.object({ share: z.number(), marginDb: nullableNumber })),
  }),
  /** the longest paths reaching 99 %, 99.9 % and 99.99 %; null below 550 nm with Kim/Kruse */
  rangesForAvailability: z.array(AvailabilityRangeSchema).nullable(),
  availabilityAgainstRange: z.array(AvailabilityAtRangeSchema).nullable(),
  method: AvailabilityMethodSchema,
});
export type RevisionAvailability = z.infer<typeof RevisionAvailabilitySchema>;

/** `POST /api/links/:id/revisions/:n/availability/climatology`: a typed or pasted cumulative table. */
export const ClimatologyAvailabilityRequestSchema = z.strictObject({
  climatology: VisibilityClimatologySchema,
  /** a variant of the revision instead of its design (0-based position) */
  variant: variantIndex,
  requiredMarginDb: z.number({ error: 'must be a number of dB' }).min(-50, 'must be at least -50 dB').max(100, 'must be at most 100 dB').default(0),
});
export type ClimatologyAvailabilityRequest = z.input<typeof ClimatologyAvailabilityRequestSchema>;

export const ClimatologyAvailabilityResponseSchema = z.object({
  linkId: z.uuid(),
  revision: z.number().int(),
  /** the variant whose design was analysed; null: the revision's own design (optional: added with variants) */
  variant: z.object({ index: z.number().int(), name: z.string() }).nullable().optional(),
  requiredMarginDb: z.number(),
  availability: z.number(),
  unavailability: z.number(),
  /** unavailability × 8766 h [h] */
  annualDowntimeH: z.number(),
  minimumVisibilityM: nullableNumber,
  clearAirMarginDb: z.number(),
  maxSpecificAttenuationDbPerKm: z.number(),
  lookup: z.enum(['interpolated', 'below-table', 'above-table', 'always-down']),
  rangesForAvailability: z.array(AvailabilityRangeSchema),
  availabilityAgainstRange: z.array(AvailabilityAtRangeSchema),
  method: AvailabilityMethodSchema,
});
export type ClimatologyAvailabilityResponse = z.infer<typeof ClimatologyAvailabilityResponseSchema>;

const COMMON_ASSUMPTIONS = [
  'The fade margin for scintillation is left out: dense fog and strong turbulence rarely coincide.',
  'Visibility measured at an airport or weather station is not the visibility on the rooftops of the path: fog there can be thicker or thinner, and arrive at other hours.',
  'MOR (5 %) figures are converted to the 2 % visibility (× 1.306) before the attenuation model is applied.',
  'Only visibility decides here: rain and snow are not counted against the margin.',
];

/** The method and assumptions of the availability from records, as the api answers them and the ui shows them. */
export const RECORDS_AVAILABILITY_METHOD: AvailabilityMethod = {
  summary:
    'Each record counts as up when the margin left after the visibility loss, M0 − γ(V)·L, is at least the required margin, for the hours it stands for; the availability is the share of covered hours that are up (after Kim & Korevaar 2001; link-core METHODS.md §11.3–§11.7).',
  assumptions: [
    ...COMMON_ASSUMPTIONS,
    'A record stands for the time to the next one; a gap over 3 h counts as missing data, neither up nor down. Timestamps without a zone were read as UTC, and months are UTC calendar months.',
  ],
};

/** The method and assumptions of the availability from a cumulative visibility table. */
export const CLIMATOLOGY_AVAILABILITY_METHOD: AvailabilityMethod = {
  summary:
    'The link fails when the visibility falls below V_min, where the visibility loss takes the whole clear-air margin less the required margin; the unavailability is P(V < V_min) read from the table, interpolated linearly in log P against log V (after Kim & Korevaar 2001; link-core METHODS.md §11.2, §11.7).',
  assumptions: [...COMMON_ASSUMPTIONS, 'Below the first level of the table its first segment is extended; above the last level the last probability is kept.'],
};
