// The form's working copy of a design: the text the engineer typed for every quantity, plus the
// choices. Turning it into a LinkDesignInput parses each text with link-core's parseQuantity and
// validates the result with the shared LinkDesignSchema, so every problem lands next to its field.
import { LinkDesignSchema, convertBeamWidth, formatZodIssues, wattsToDbm, type LinkDesignInput } from '@beamwright/link-core';
import { parseQuantity } from '@beamwright/link-core/units';
import {
  QUANTITY_FIELDS,
  QUANTITY_FIELD_IDS,
  type QuantityField,
  type QuantityFieldId,
  type WidthDefinition,
} from '@/features/link-design/design-fields';

export type WidthExtent = 'radius' | 'diameter';
export type AngleExtent = 'half' | 'full';

export interface DesignDraft {
  text: Record<QuantityFieldId, string>;
  beamSize: { extent: WidthExtent; definition: WidthDefinition };
  divergence: { extent: AngleExtent; definition: WidthDefinition };
  atmosphereModel: string;
  visibilityDefinition: string;
  /** 'gaussian-beam' or 'spherical-wave'; '' when the design leaves it to the engine (the Gaussian beam) */
  turbulenceModel: string;
  scintillationInclude: boolean;
}

export type FieldErrors = Partial<Record<string, string>>;

export interface DraftEvaluation {
  /** the validated design (defaults applied), or null while any field has a problem */
  design: LinkDesignInput | null;
  /** field id -> message, already starting with the field's label */
  errors: FieldErrors;
}

const UNIT_IN_METRES_OR_RADIANS: Record<string, number> = {
  km: 1e3,
  m: 1,
  mm: 1e-3,
  nm: 1e-9,
  mrad: 1e-3,
  'µrad': 1e-6,
};

const extentOf = (extent: WidthExtent | AngleExtent) => (extent === 'diameter' || extent === 'full' ? 'diameter' : 'radius');

/** A datasheet width or angle -> the schema's 1/e² radius or half-angle (link-core's Gaussian conversion). */
export function toOneOverESquaredRadius(value: number, extent: WidthExtent | AngleExtent, definition: WidthDefinition): number {
  return convertBeamWidth({ value, definition, extent: extentOf(extent) }, { definition: '1/e2', extent: 'radius' });
}

// Six significant figures: enough to give back what was typed, without binary noise.
function writeNumber(value: number): string {
  return String(Number(value.toPrecision(6)));
}

/** The text a form field shows for a value in SI (or dB/dBm): in the field's display unit, trimmed. */
export function writeQuantity(field: QuantityField, value: number): string {
  switch (field.kind) {
    case 'power':
      return `${writeNumber(value)} dBm`;
    case 'decibel':
      return `${writeNumber(value)} dB`;
    case 'length':
    case 'angle': {
      const unit = field.id === 'rangeM' && value < 1000 ? 'm' : field.unit;
      return `${writeNumber(value / UNIT_IN_METRES_OR_RADIANS[unit]!)} ${unit}`;
    }
    default:
      return writeNumber(value);
  }
}

function readPath(source: unknown, path: string): unknown {
  let current: unknown = source;
  for (const key of path.split('.')) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<string, unknown>)[key];
  }
  return current;
}

function writePath(target: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split('.');
  let current = target;
  for (const key of keys.slice(0, -1)) {
    if (current[key] === null || typeof current[key] !== 'object') current[key] = {};
    current = current[key] as Record<string, unknown>;
  }
  const last = keys[keys.length - 1]!;
  if (value === undefined) delete current[last];
  else current[last] = value;
}

/** The form's text for a stored design (SI values written in each field's usual unit). */
export function draftFromDesign(design: LinkDesignInput): DesignDraft {
  const text = {} as Record<QuantityFieldId, string>;
  for (const id of QUANTITY_FIELD_IDS) {
    const value = readPath(design, id);
    text[id] = typeof value === 'number' && Number.isFinite(value) ? writeQuantity(QUANTITY_FIELDS[id], value) : '';
  }
  // Defaults of the schema are shown, so the engineer sees what the budget assumes.
  if (text['transmitter.m2'] === '') text['transmitter.m2'] = '1';
  if (text['receiver.obscurationRatio'] === '') text['receiver.obscurationRatio'] = '0';
  if (text['scintillation.probability'] === '') text['scintillation.probability'] = '0.001';
  if (text.systemMarginDb === '') text.systemMarginDb = '0 dB';
  return {
    text,
    beamSize: { extent: 'radius', definition: '1/e2' },
    divergence: { extent: 'half', definition: '1/e2' },
    atmosphereModel: design.atmosphere?.model ?? 'kim',
    visibilityDefinition: design.atmosphere?.visibilityDefinition ?? 'contrast-2-percent',
    turbulenceModel: design.atmosphere?.turbulenceModel ?? '',
    scintillationInclude: design.scintillation?.include ?? true,
  };
}

function mathjsUnit(unit: string): string {
  return unit.replace('µ', 'u');
}

function parseField(field: QuantityField, text: string): { ok: true; value: number | undefined } | { ok: false; reason: string } {
  if (text.trim() === '') return field.optional ? { ok: true, value: undefined } : { ok: false, reason: 'is required' };
  const parsed = parseQuantity(text, field.kind, {
    defaultUnit: field.unit === '' ? undefined : mathjsUnit(field.unit),
    allowNegative: field.kind === 'decibel',
    allowZero: field.kind !== 'power',
  });
  if (!parsed.ok) return { ok: false, reason: parsed.reason };
  // Powers are parsed to watts; the schema holds them in dBm.
  const value = field.kind === 'power' ? wattsToDbm(parsed.valueSi) : parsed.valueSi;
  return { ok: true, value };
}

function sentence(label: string, reason: string): string {
  return `${label} ${reason}`;
}

export type FieldReading = { ok: true; value: number | undefined } | { ok: false; reason: string };

/** Each quantity field read into the schema's unit (1/e² radius and half-angle included). */
export function readDraftValues(draft: DesignDraft): Record<QuantityFieldId, FieldReading> {
  const readings = {} as Record<QuantityFieldId, FieldReading>;
  for (const id of QUANTITY_FIELD_IDS) {
    const parsed = parseField(QUANTITY_FIELDS[id], draft.text[id]);
    if (parsed.ok && parsed.value !== undefined) {
      if (id === 'transmitter.waistRadiusM') {
        parsed.value = toOneOverESquaredRadius(parsed.value, draft.beamSize.extent, draft.beamSize.definition);
      } else if (id === 'transmitter.halfAngleDivergenceRad') {
        parsed.value = toOneOverESquaredRadius(parsed.value, draft.divergence.extent, draft.divergence.definition);
      }
    }
    readings[id] = parsed;
  }
  return readings;
}

/**
 * Parses and validates the draft. `base` is the design the draft started from: fields the form does
 * not know about are carried over unchanged, so nothing stored is dropped by an edit.
 */
export function evaluateDraft(draft: DesignDraft, base: LinkDesignInput | null): DraftEvaluation {
  const candidate: Record<string, unknown> = base ? (structuredClone(base) as unknown as Record<string, unknown>) : {};
  const errors: FieldErrors = {};
  const readings = readDraftValues(draft);

  for (const id of QUANTITY_FIELD_IDS) {
    const reading = readings[id];
    if (!reading.ok) {
      errors[id] = sentence(QUANTITY_FIELDS[id].label, reading.reason);
      writePath(candidate, id, undefined);
    } else {
      writePath(candidate, id, reading.value);
    }
  }
  writePath(candidate, 'atmosphere.model', draft.atmosphereModel);
  writePath(candidate, 'atmosphere.visibilityDefinition', draft.visibilityDefinition);
  // an untouched choice stays absent, so reading a design back changes nothing
  if (draft.turbulenceModel !== '') writePath(candidate, 'atmosphere.turbulenceModel', draft.turbulenceModel);
  writePath(candidate, 'scintillation.include', draft.scintillationInclude);

  const result = LinkDesignSchema.safeParse(candidate);
  if (!result.success) {
    for (const issue of formatZodIssues(result.error)) {
      if (errors[issue.path]) continue; // the parse problem says more than "is required"
      const label = (QUANTITY_FIELDS as Record<string, QuantityField | undefined>)[issue.path]?.label;
      errors[issue.path] = label ? sentence(label, issue.message) : `${issue.path || 'Design'}: ${issue.message}`;
    }
  }
  if (Object.keys(errors).length > 0 || !result.success) return { design: null, errors };
  return { design: result.data, errors };
}
