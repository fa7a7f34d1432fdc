/**
 * The organisation's equipment catalogue: transmitter and receiver models with the datasheet
 * figures a design needs, in SI units (metres, radians) with powers in dBm and losses in dB.
 * Datasheets state beam sizes and divergences in several conventions, so each figure carries its
 * definition; the planner converts to the design's 1/e² radius and half-angle.
 */
import { z } from 'zod';
import { IsoDateTimeSchema, numberField, textField } from './common.contract.js';

/** Width conventions found on datasheets: 1/e² (13.5 %) intensity, 1/e (36.8 %) intensity, FWHM (50 %). */
export const BEAM_WIDTH_DEFINITIONS = ['1/e2', '1/e', 'fwhm'] as const;
export const BeamWidthDefinitionSchema = z.enum(BEAM_WIDTH_DEFINITIONS, { error: `must be one of ${BEAM_WIDTH_DEFINITIONS.join(', ')}` });
export type BeamWidthDefinition = z.infer<typeof BeamWidthDefinitionSchema>;

export const DIVERGENCE_ANGLES = ['full', 'half'] as const;

export const EQUIPMENT_KINDS = ['transmitter', 'receiver'] as const;
export const EquipmentKindSchema = z.enum(EQUIPMENT_KINDS, { error: 'must be transmitter or receiver' });
export type EquipmentKind = z.infer<typeof EquipmentKindSchema>;

/** Beam size at the exit aperture: either the 1/e² radius directly, or a diameter with its definition. */
export const TransmitterBeamSizeSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('waist-radius'),
      /** 1/e² beam radius at the transmit aperture [m] */
      waistRadiusM: numberField({ min: 1e-6, max: 1 }),
    }),
    z.strictObject({
      kind: z.literal('exit-diameter'),
      /** beam diameter at the exit aperture [m], in `definition` */
      diameterM: numberField({ min: 1e-6, max: 2 }),
      definition: BeamWidthDefinitionSchema,
    }),
  ],
  { error: 'must be { kind: "waist-radius", waistRadiusM } or { kind: "exit-diameter", diameterM, definition }' },
);
export type TransmitterBeamSize = z.infer<typeof TransmitterBeamSizeSchema>;

export const DivergenceSpecSchema = z.strictObject({
  /** the datasheet angle [rad] */
  angleRad: numberField({ min: 1e-7, max: 0.2 }),
  /** whether the figure is the full cone angle or the half-angle */
  angle: z.enum(DIVERGENCE_ANGLES, { error: 'must be full or half' }),
  /** the width definition the angle is measured at */
  definition: BeamWidthDefinitionSchema,
});
export type DivergenceSpec = z.infer<typeof DivergenceSpecSchema>;

export const TransmitterSpecSchema = z.strictObject({
  /** vacuum wavelength [m] */
  wavelengthM: numberField({ min: 200e-9, max: 20e-6 }),
  /** average optical output power [dBm] */
  powerDbm: numberField({ min: -40, max: 50 }),
  beamSize: TransmitterBeamSizeSchema,
  /** far-field divergence as the datasheet gives it; absent = diffraction-limited */
  divergence: DivergenceSpecSchema.optional(),
  /** beam propagation ratio M² (ISO 11146-1) */
  m2: numberField({ min: 1, max: 100 }).default(1),
  /** transmit optics and window loss [dB] */
  opticsLossDb: numberField({ min: 0, max: 30 }),
});
export type TransmitterSpec = z.infer<typeof TransmitterSpecSchema>;

export const ReceiverSpecSchema = z
  .strictObject({
    /** clear receive aperture diameter [m] */
    apertureDiameterM: numberField({ min: 1e-4, max: 2 }),
    /** central obscuration as a ratio of diameters, in [0, 1) */
    obscurationRatio: numberField({ min: 0, max: 0.99 }).default(0),
    /** receive optics and window loss [dB] */
    opticsLossDb: numberField({ min: 0, max: 30 }),
    /** sensitivity (minimum mean optical power) at `dataRateBps` [dBm] */
    sensitivityDbm: numberField({ min: -90, max: 20 }),
    /** data rate the sensitivity applies to [bit/s] */
    dataRateBps: numberField({ min: 1, max: 1e12 }),
    /** maximum mean optical power before saturation [dBm] */
    overloadDbm: numberField({ min: -90, max: 40 }).optional(),
    /** half-angle field of view [rad] */
    fieldOfViewRad: numberField({ min: 1e-6, max: 0.5 }).optional(),
  })
  .refine((spec) => spec.overloadDbm === undefined || spec.overloadDbm > spec.sensitivityDbm, {
    message: 'must be greater than the sensitivity',
    path: ['overloadDbm'],
  });
export type ReceiverSpec = z.infer<typeof ReceiverSpecSchema>;

const commonFields = {
  name: textField({ min: 1, max: 200 }),
  /** maker or supplier as the organisation knows it */
  maker: textField({ max: 200 }).default(''),
  notes: textField({ max: 4000, multiline: true }).default(''),
};

export const CreateEquipmentRequestSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('transmitter'), ...commonFields, spec: TransmitterSpecSchema }),
    z.strictObject({ kind: z.literal('receiver'), ...commonFields, spec: ReceiverSpecSchema }),
  ],
  { error: 'kind must be transmitter or receiver' },
);
export type CreateEquipmentRequest = z.input<typeof CreateEquipmentRequestSchema>;

/** Changes to a model; `spec`, when given, replaces the whole spec and must fit the model's kind. */
export const UpdateEquipmentRequestSchema = z.strictObject({
  name: commonFields.name.optional(),
  maker: textField({ max: 200 }).optional(),
  notes: textField({ max: 4000, multiline: true }).optional(),
  spec: z.unknown().optional(),
  /**
   * true retires the model: it leaves the pickers and the default list but stays readable by id
   * (revisions keep the figures they copied from it); false puts it back in service
   */
  retired: z.boolean({ error: 'must be true or false' }).optional(),
});
export type UpdateEquipmentRequest = z.input<typeof UpdateEquipmentRequestSchema>;

const responseFields = {
  id: z.uuid(),
  name: z.string(),
  maker: z.string(),
  notes: z.string(),
  /** true for the demo's invented models whose figures are typical values, not a real datasheet */
  illustrative: z.boolean(),
  /** when the model was retired; null while it is in service (optional: added in 0.3.0) */
  retiredAt: IsoDateTimeSchema.nullable().optional(),
  createdAt: IsoDateTimeSchema,
  updatedAt: IsoDateTimeSchema,
};

export const EquipmentResponseSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('transmitter'), ...responseFields, spec: TransmitterSpecSchema }),
  z.object({ kind: z.literal('receiver'), ...responseFields, spec: ReceiverSpecSchema }),
]);
export type EquipmentResponse = z.infer<typeof EquipmentResponseSchema>;

export const EquipmentListQuerySchema = z.object({
  kind: EquipmentKindSchema.optional(),
  /** retired models are left out unless this is `true` (the catalogue screen lists them; pickers never do) */
  includeRetired: z.enum(['true', 'false'], { error: 'must be true or false' }).optional(),
});
export const EquipmentListResponseSchema = z.object({ items: z.array(EquipmentResponseSchema) });
export type EquipmentListResponse = z.infer<typeof EquipmentListResponseSchema>;

/**
 * The catalogue's CSV layout: one model a row, `kind` first, then the common fields, then the
 * figures of the spec named by their path in the spec (units in the names, SI as everywhere:
 * `wavelengthM` in metres, `divergence.angleRad` in radians). A row leaves the other kind's columns
 * empty; an empty cell is an absent figure (the schema's default or "not given").
 */
export const EQUIPMENT_CSV_COLUMNS = [
  'kind',
  'name',
  'maker',
  'notes',
  'wavelengthM',
  'powerDbm',
  'beamSize.kind',
  'beamSize.waistRadiusM',
  'beamSize.diameterM',
  'beamSize.definition',
  'divergence.angleRad',
  'divergence.angle',
  'divergence.definition',
  'm2',
  'opticsLossDb',
  'apertureDiameterM',
  'obscurationRatio',
  'sensitivityDbm',
  'dataRateBps',
  'overloadDbm',
  'fieldOfViewRad',
] as const;
export type EquipmentCsvColumn = (typeof EQUIPMENT_CSV_COLUMNS)[number];

const TEXT_COLUMNS: ReadonlySet<string> = new Set(['kind', 'name', 'maker', 'notes', 'beamSize.kind', 'beamSize.definition', 'divergence.angle', 'divergence.definition']);
const TRANSMITTER_ONLY: ReadonlySet<string> = new Set(['wavelengthM', 'powerDbm', 'beamSize.kind', 'beamSize.waistRadiusM', 'beamSize.diameterM', 'beamSize.definition', 'divergence.angleRad', 'divergence.angle', 'divergence.definition', 'm2']);
const RECEIVER_ONLY: ReadonlySet<string> = new Set(['apertureDiameterM', 'obscurationRatio', 'sensitivityDbm', 'dataRateBps', 'overloadDbm', 'fieldOfViewRad']);

/** At most this many models in one import (the whole file is read in memory; a catalogue is small). */
export const MAX_EQUIPMENT_CSV_ROWS = 500;

/** A problem of one cell (or of the row, `column` ''), by the file's 1-based line number. */
export const EquipmentCsvRowErrorSchema = z.object({ line: z.number().int().min(1), column: z.string(), reason: z.string() });
export type EquipmentCsvRowError = z.infer<typeof EquipmentCsvRowErrorSchema>;

/** Where a create request's issue path lands in the CSV: `spec.beamSize.diameterM` → `beamSize.diameterM`. */
export function equipmentCsvColumnOf(path: string): string {
  if (path.startsWith('spec.')) return path.slice('spec.'.length);
  return path === 'spec' ? '' : path;
}

/**
 * One CSV record (header → cell text) as a create request, or the cells that cannot be one.
 * Numbers are plain decimals (`1.55e-6` allowed); the request then goes through
 * `CreateEquipmentRequestSchema`, whose issues name the cells by `equipmentCsvColumnOf`.
 */
export function equipmentCsvRecordToRequest(record: Readonly<Record<string, string | undefined>>): { ok: true; request: unknown } | { ok: false; errors: { column: string; reason: string }[] } {
  const errors: { column: string; reason: string }[] = [];
  const kind = record.kind?.trim() ?? '';
  const spec: Record<string, unknown> = {};
  const request: Record<string, unknown> = { kind, spec };
  for (const column of EQUIPMENT_CSV_COLUMNS) {
    const text = record[column]?.trim() ?? '';
    if (column === 'kind' || text === '') continue;
    if ((kind === 'receiver' && TRANSMITTER_ONLY.has(column)) || (kind === 'transmitter' && RECEIVER_ONLY.has(column))) {
      errors.push({ column, reason: `must be empty for a ${kind}` });
      continue;
    }
    let value: unknown = text;
    if (!TEXT_COLUMNS.has(column)) {
      // Number('') and Number(' ') are 0, and Number('0x10') is 16: only decimal notation counts
      value = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text) ? Number(text) : Number.NaN;
      if (!Number.isFinite(value)) {
        errors.push({ column, reason: 'must be a number in decimal notation' });
        continue;
      }
    }
    if (column === 'name' || column === 'maker' || column === 'notes') {
      request[column] = record[column];
      continue;
    }
    const [group, field] = column.split('.') as [string, string | undefined];
    if (field === undefined) spec[group] = value;
    else spec[group] = { ...((spec[group] as Record<string, unknown> | undefined) ?? {}), [field]: value };
  }
  return errors.length > 0 ? { ok: false, errors } : { ok: true, request };
}

/**
 * What an import does when some rows are wrong: `check` imports nothing and reports;
 * `all-or-nothing` (the default) imports every row or, when any row is wrong, none (422);
 * `valid-rows` imports the rows that are right and reports the others. One transaction either way.
 */
export const EQUIPMENT_IMPORT_MODES = ['check', 'all-or-nothing', 'valid-rows'] as const;
export type EquipmentImportMode = (typeof EQUIPMENT_IMPORT_MODES)[number];

export const EquipmentImportRequestSchema = z.strictObject({
  /** the CSV file's text (UTF-8, header row first, comma-separated) */
  csv: z.string({ error: 'is required (the CSV file as text)' }).min(1, 'is empty').max(512 * 1024, 'is longer than 512 KiB'),
  mode: z.enum(EQUIPMENT_IMPORT_MODES, { error: `must be one of ${EQUIPMENT_IMPORT_MODES.join(', ')}` }).default('all-or-nothing'),
});
export type EquipmentImportRequest = z.input<typeof EquipmentImportRequestSchema>;

export const EquipmentImportResultSchema = z.object({
  mode: z.enum(EQUIPMENT_IMPORT_MODES),
  /** data rows read (the header not counted) */
  totalRows: z.number().int().min(0),
  validRows: z.number().int().min(0),
  /** models created by this request (0 for a check or a refused import) */
  imported: z.number().int().min(0),
  errors: z.array(EquipmentCsvRowErrorSchema),
  items: z.array(EquipmentResponseSchema),
});
export type EquipmentImportResult = z.infer<typeof EquipmentImportResultSchema>;
