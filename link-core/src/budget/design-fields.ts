/**
 * The numeric fields of a link design that the solvers and sweeps vary, as typed dotted paths; their
 * allowed ranges, read from LinkDesignSchema (one source of truth); the one function that returns a
 * design with one of them changed; and the input checks the solvers, sweeps and comparisons share.
 *
 * `withDesignValue` is the seam a batch kernel replaces: every solver and sweep builds its variations
 * of a design through it and evaluates them through `evaluateLink`, so a kernel that takes the
 * varied field and a column of values can stand in for the loop without changing the callers.
 */
import type { z } from 'zod';
import { formatZodIssues, type FieldIssue } from '../schemas/format-zod-issues.js';
import {
  AtmosphereSchema,
  LinkDesignSchema,
  PointingSchema,
  ReceiverSchema,
  TransmitterSchema,
  type LinkDesignInput,
} from '../schemas/link-design.schema.js';

/** The design fields a solver or a sweep may vary (dotted paths into LinkDesignSchema). */
export const VARIABLE_DESIGN_FIELDS = [
  'rangeM',
  'transmitter.powerDbm',
  'transmitter.waistRadiusM',
  'transmitter.halfAngleDivergenceRad',
  'receiver.apertureDiameterM',
  'pointing.jitterSigmaPerAxisRad',
  'pointing.staticErrorRad',
  'atmosphere.visibilityM',
  'atmosphere.cn2',
] as const;
export type VariableDesignField = (typeof VARIABLE_DESIGN_FIELDS)[number];

/** Unit of each variable field, as the field's name states it. */
export const VARIABLE_DESIGN_FIELD_UNITS: Readonly<Record<VariableDesignField, 'm' | 'dBm' | 'rad' | 'm^(-2/3)'>> = {
  rangeM: 'm',
  'transmitter.powerDbm': 'dBm',
  'transmitter.waistRadiusM': 'm',
  'transmitter.halfAngleDivergenceRad': 'rad',
  'receiver.apertureDiameterM': 'm',
  'pointing.jitterSigmaPerAxisRad': 'rad',
  'pointing.staticErrorRad': 'rad',
  'atmosphere.visibilityM': 'm',
  'atmosphere.cn2': 'm^(-2/3)',
};

/** The schema of one variable field (the number inside any `.optional()`/`.default()`). */
function fieldSchema(field: VariableDesignField): z.ZodNumber {
  switch (field) {
    case 'rangeM':
      return LinkDesignSchema.shape.rangeM;
    case 'transmitter.powerDbm':
      return TransmitterSchema.shape.powerDbm;
    case 'transmitter.waistRadiusM':
      return TransmitterSchema.shape.waistRadiusM;
    case 'transmitter.halfAngleDivergenceRad':
      return TransmitterSchema.shape.halfAngleDivergenceRad.unwrap();
    case 'receiver.apertureDiameterM':
      return ReceiverSchema.shape.apertureDiameterM;
    case 'pointing.jitterSigmaPerAxisRad':
      return PointingSchema.shape.jitterSigmaPerAxisRad;
    case 'pointing.staticErrorRad':
      return PointingSchema.shape.staticErrorRad;
    case 'atmosphere.visibilityM':
      return AtmosphereSchema.shape.visibilityM;
    case 'atmosphere.cn2':
      return AtmosphereSchema.shape.cn2;
  }
}

/** Allowed range of a variable field, as LinkDesignSchema accepts it. */
export interface DesignFieldRange {
  field: VariableDesignField;
  /** smallest accepted value (excluded when `lowerExclusive`) in the field's unit */
  lower: number;
  /** largest accepted value (included) in the field's unit */
  upper: number;
  /** true when `lower` itself is refused (e.g. a divergence must be greater than 0) */
  lowerExclusive: boolean;
  unit: (typeof VARIABLE_DESIGN_FIELD_UNITS)[VariableDesignField];
}

/**
 * The range LinkDesignSchema accepts for a variable field, e.g. 1 m … 100 km for `rangeM` or
 * −40 … 50 dBm for `transmitter.powerDbm`.
 *
 * @param field one of VARIABLE_DESIGN_FIELDS
 * @returns lower and upper bound in the field's unit and whether the lower bound is excluded
 * @see LinkDesignSchema (src/schemas/link-design.schema.ts)
 */
export function designFieldRange(field: VariableDesignField): DesignFieldRange {
  const schema = fieldSchema(field);
  const lower = schema.minValue;
  const upper = schema.maxValue;
  if (lower === null || upper === null) throw new Error(`designFieldRange: ${field} has no bounds in LinkDesignSchema`);
  return { field, lower, upper, lowerExclusive: !schema.safeParse(lower).success, unit: VARIABLE_DESIGN_FIELD_UNITS[field] };
}

/**
 * Throws unless `value` is a value LinkDesignSchema accepts for `field`.
 * @param caller the public function, named first in the message
 * @param label what to call the value in the message (e.g. 'x.from'); the field is named beside it
 * @param field one of VARIABLE_DESIGN_FIELDS
 * @param value the value to check, in the field's unit
 * @throws InvalidInputError naming `label` and the field's own reason ("must be at most 100 km")
 */
export function requireDesignFieldValue(caller: string, label: string, field: VariableDesignField, value: unknown): void {
  const result = fieldSchema(field).safeParse(value);
  if (!result.success) {
    const message = `${result.error.issues[0]?.message ?? 'is not valid'} (as ${field})`;
    throw new InvalidInputError(caller, [{ path: label, message }]);
  }
}

/**
 * A copy of the design with one field set to `value` (the other sections shared, not copied). The
 * value is not checked: callers check it once against {@link designFieldRange}, not per point.
 *
 * @param design the link design
 * @param field the field to set
 * @param value its new value, in the field's unit (m, dBm, rad, m^(−2/3))
 * @returns the changed design
 */
export function withDesignValue(design: LinkDesignInput, field: VariableDesignField, value: number): LinkDesignInput {
  switch (field) {
    case 'rangeM':
      return { ...design, rangeM: value };
    case 'transmitter.powerDbm':
      return { ...design, transmitter: { ...design.transmitter, powerDbm: value } };
    case 'transmitter.waistRadiusM':
      return { ...design, transmitter: { ...design.transmitter, waistRadiusM: value } };
    case 'transmitter.halfAngleDivergenceRad':
      return { ...design, transmitter: { ...design.transmitter, halfAngleDivergenceRad: value } };
    case 'receiver.apertureDiameterM':
      return { ...design, receiver: { ...design.receiver, apertureDiameterM: value } };
    case 'pointing.jitterSigmaPerAxisRad':
      return { ...design, pointing: { ...design.pointing, jitterSigmaPerAxisRad: value } };
    case 'pointing.staticErrorRad':
      return { ...design, pointing: { ...design.pointing, staticErrorRad: value } };
    case 'atmosphere.visibilityM':
      return { ...design, atmosphere: { ...design.atmosphere, visibilityM: value } };
    case 'atmosphere.cn2':
      return { ...design, atmosphere: { ...design.atmosphere, cn2: value } };
  }
}

/**
 * The design's own value of a variable field, or undefined where the field is optional and absent
 * (a design without a datasheet divergence).
 * @param design the link design
 * @param field one of VARIABLE_DESIGN_FIELDS
 * @returns the value in the field's unit, or undefined
 */
export function designValueOf(design: LinkDesignInput, field: VariableDesignField): number | undefined {
  switch (field) {
    case 'rangeM':
      return design.rangeM;
    case 'transmitter.powerDbm':
      return design.transmitter.powerDbm;
    case 'transmitter.waistRadiusM':
      return design.transmitter.waistRadiusM;
    case 'transmitter.halfAngleDivergenceRad':
      return design.transmitter.halfAngleDivergenceRad;
    case 'receiver.apertureDiameterM':
      return design.receiver.apertureDiameterM;
    case 'pointing.jitterSigmaPerAxisRad':
      return design.pointing.jitterSigmaPerAxisRad;
    case 'pointing.staticErrorRad':
      return design.pointing.staticErrorRad;
    case 'atmosphere.visibilityM':
      return design.atmosphere.visibilityM;
    case 'atmosphere.cn2':
      return design.atmosphere.cn2;
  }
}

/**
 * Bad input to a solver, sweep or comparison: a RangeError whose message names every field and its
 * reason ("solveDesign: design.rangeM: must be at most 100 km"), with the same list as `issues` for
 * an API to answer 400 with field paths.
 */
export class InvalidInputError extends RangeError {
  readonly issues: FieldIssue[];
  constructor(caller: string, issues: FieldIssue[]) {
    super(`${caller}: ${issues.map((issue) => `${issue.path || 'input'}: ${issue.message}`).join('; ')}`);
    this.name = 'InvalidInputError';
    this.issues = issues;
  }
}

/**
 * Parses `value` with `schema` or throws an InvalidInputError whose paths start with `pathPrefix`.
 * @param caller the public function, named first in the message
 * @param pathPrefix prefix of every issue path ('design', or '' for an options object)
 * @returns the parsed value
 */
export function parseOrThrow<Schema extends z.ZodType>(caller: string, schema: Schema, value: unknown, pathPrefix = ''): z.output<Schema> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const issues = formatZodIssues(result.error).map((issue) => ({
    path: pathPrefix === '' ? issue.path : issue.path === '' ? pathPrefix : `${pathPrefix}.${issue.path}`,
    message: issue.message,
  }));
  throw new InvalidInputError(caller, issues);
}

/**
 * Throws an InvalidInputError naming each bad field of the design (paths `design.…`), so a solver
 * never searches on a design the schema refuses.
 * @param caller the public function, named first in the message
 * @param design the design to check
 */
export function requireValidDesign(caller: string, design: unknown): asserts design is LinkDesignInput {
  parseOrThrow(caller, LinkDesignSchema, design, 'design');
}
