/**
 * Sweep samplers for the planner's charts (METHODS.md §15.3): the link margin against one design
 * input (a line chart) or two (a heat map), as Float64Arrays with their axis values. They generalise
 * marginVsRange and marginVsVisibility (§10.5) to any field of VARIABLE_DESIGN_FIELDS.
 *
 * Every point is the margin `evaluateLink(withDesignValue(…))` gives, computed by the batch margin
 * kernel in `fillMargins` (same design, one or two fields, columns of values, margins out).
 */
import { z } from 'zod';
import { finiteNumber } from '../schemas/fields.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { evaluateLinkMargins, isLinkMarginPathField } from './evaluate-link-margins.js';
import {
  designValueOf,
  InvalidInputError,
  parseOrThrow,
  requireDesignFieldValue,
  requireValidDesign,
  VARIABLE_DESIGN_FIELDS,
  type VariableDesignField,
} from './design-fields.js';

export const SWEEP_SPACINGS = ['linear', 'log'] as const;
export type SweepSpacing = (typeof SWEEP_SPACINGS)[number];

/** Most samples on one sweep axis. */
export const MAX_SWEEP_POINTS = 2000;
/** Most points in a heat map (rows × columns): 500 × 500. */
export const MAX_GRID_POINTS = 250_000;

/** One axis of a sweep: a design field and the values it takes. */
export const SweepAxisSchema = z
  .strictObject({
    field: z.enum(VARIABLE_DESIGN_FIELDS, { error: `must be one of ${VARIABLE_DESIGN_FIELDS.join(', ')}` }),
    /** first value, in the field's unit; within the field's allowed range */
    from: finiteNumber(),
    /** last value, in the field's unit; within the field's allowed range, ≠ from (may be below it) */
    to: finiteNumber(),
    /** number of samples, ends included: 2 … 2000 */
    points: z.int({ error: 'must be a whole number' }).min(2, 'must be at least 2').max(MAX_SWEEP_POINTS, `must be at most ${MAX_SWEEP_POINTS}`),
    /** 'linear' (default) or 'log' (both ends > 0) */
    spacing: z.enum(SWEEP_SPACINGS, { error: `must be one of ${SWEEP_SPACINGS.join(', ')}` }).default('linear'),
  })
  .superRefine((axis, context) => {
    if (axis.from === axis.to) context.addIssue({ code: 'custom', path: ['to'], message: 'must differ from from' });
    if (axis.spacing === 'log') {
      if (!(axis.from > 0)) context.addIssue({ code: 'custom', path: ['from'], message: 'must be greater than 0 for log spacing' });
      if (!(axis.to > 0)) context.addIssue({ code: 'custom', path: ['to'], message: 'must be greater than 0 for log spacing' });
    }
  });
export type SweepAxis = z.input<typeof SweepAxisSchema>;

/** The values of a sweep axis and the design's own value on it. */
export interface SweepAxisValues {
  field: VariableDesignField;
  spacing: SweepSpacing;
  /** samples from `from` to `to`, ends exact, in the field's unit */
  values: Float64Array;
  /** the design's own value of the field (to mark the current design), null when the field is absent */
  designValue: number | null;
}

/** Result of {@link marginSweep}. */
export interface MarginSweep {
  axis: SweepAxisValues;
  /** link margin [dB] at each axis value, as evaluateLink computes it */
  linkMarginDb: Float64Array;
}

/** Result of {@link marginGrid}. */
export interface MarginGrid {
  /** columns */
  x: SweepAxisValues;
  /** rows */
  y: SweepAxisValues;
  /** link margin [dB], row-major: the value at (x.values[i], y.values[j]) is linkMarginDb[j·nx + i] */
  linkMarginDb: Float64Array;
  /** smallest and largest finite margin in the grid [dB] (for the colour scale); NaN if none is finite */
  minMarginDb: number;
  maxMarginDb: number;
}

function checkedAxis(caller: string, label: string, axis: SweepAxis): z.output<typeof SweepAxisSchema> {
  const parsed = parseOrThrow(caller, SweepAxisSchema, axis, label);
  requireDesignFieldValue(caller, `${label}.from`, parsed.field, parsed.from);
  requireDesignFieldValue(caller, `${label}.to`, parsed.field, parsed.to);
  return parsed;
}

/**
 * The sample values of an axis: `points` values from `from` to `to`, evenly spaced in the value
 * (linear) or in its logarithm (log), ends exact.
 *
 * @param axis field, from, to (field unit), points (2 … 2000), spacing
 * @returns the values and the design-independent axis description (designValue null)
 * @throws InvalidInputError naming the bad axis entry (e.g. `axis.from … must be at most 100 km (as rangeM)`)
 */
export function sweepAxisValues(axis: SweepAxis): SweepAxisValues {
  const parsed = checkedAxis('sweepAxisValues', 'axis', axis);
  return { field: parsed.field, spacing: parsed.spacing, values: axisSamples(parsed), designValue: null };
}

function axisSamples(axis: z.output<typeof SweepAxisSchema>): Float64Array {
  const { from, to, points } = axis;
  const values = new Float64Array(points);
  const logRatio = axis.spacing === 'log' ? Math.log(to / from) : 0;
  for (let i = 0; i < points; i++) {
    const t = i / (points - 1);
    values[i] = i === 0 ? from : i === points - 1 ? to : axis.spacing === 'log' ? from * Math.exp(logRatio * t) : from + (to - from) * t;
  }
  return values;
}

function describeAxis(design: LinkDesignInput, axis: z.output<typeof SweepAxisSchema>): SweepAxisValues {
  return { field: axis.field, spacing: axis.spacing, values: axisSamples(axis), designValue: designValueOf(design, axis.field) ?? null };
}

/**
 * The inner loop of every sweep: out[j·nx + i] = margin of the design with x = xs[i] (and y = ys[j]),
 * by the batch kernel (METHODS.md §10.8; the same margins as evaluateLink, to the last bit). The
 * kernel reuses the path part between consecutive points that share it, so where only one axis is
 * a path field (range against visibility or power) the points are taken with that axis outer and
 * the margins put back in row-major order.
 */
function fillMargins(design: LinkDesignInput, x: SweepAxisValues, y: SweepAxisValues | undefined, out: Float64Array): void {
  const columns = x.values.length;
  if (y === undefined) {
    evaluateLinkMargins(design, { [x.field]: x.values }, out);
    return;
  }
  const rows = y.values.length;
  const xColumn = new Float64Array(columns * rows);
  const yColumn = new Float64Array(columns * rows);
  const xOuter = isLinkMarginPathField(x.field) && !isLinkMarginPathField(y.field);
  for (let j = 0; j < rows; j++) {
    for (let i = 0; i < columns; i++) {
      const k = xOuter ? i * rows + j : j * columns + i;
      xColumn[k] = x.values[i]!;
      yColumn[k] = y.values[j]!;
    }
  }
  const margins = evaluateLinkMargins(design, { [x.field]: xColumn, [y.field]: yColumn });
  for (let j = 0; j < rows; j++) for (let i = 0; i < columns; i++) out[j * columns + i] = margins[xOuter ? i * rows + j : j * columns + i]!;
}

/**
 * Link margin against one design input, everything else as designed: range, visibility, transmit
 * beam radius, divergence, jitter, bias, Cn², power or receive aperture, linear or log spaced.
 * Points are independent evaluations of the budget (METHODS.md §10.1), so the curve shows every
 * published model step the budget has (METHODS.md §10.6).
 *
 * @param design the link design (validated; a bad field throws naming `design.<path>`)
 * @param axis the field, from/to in the field's unit within its allowed range, points 2 … 2000, spacing
 * @returns the axis values (with the design's own value to mark) and the margins [dB]
 * @throws InvalidInputError naming the bad design field or axis entry
 * @see METHODS.md §15.3; evaluateLink (§10.1).
 * @example marginSweep(design, { field: 'pointing.jitterSigmaPerAxisRad', from: 0, to: 200e-6, points: 41 }).linkMarginDb
 */
export function marginSweep(design: LinkDesignInput, axis: SweepAxis): MarginSweep {
  requireValidDesign('marginSweep', design);
  const parsed = checkedAxis('marginSweep', 'axis', axis);
  const described = describeAxis(design, parsed);
  const linkMarginDb = new Float64Array(described.values.length);
  fillMargins(design, described, undefined, linkMarginDb);
  return { axis: described, linkMarginDb };
}

/**
 * Link margin on a grid of two design inputs (a heat map), everything else as designed; the UI draws
 * the 0 dB and required-margin contours on it and marks the design's own point (`designValue`).
 *
 * @param design the link design (validated)
 * @param axes `x` (columns) and `y` (rows): each as in {@link marginSweep}, two different fields,
 *   at most 250 000 points in all
 * @returns both axes and the margins [dB], row-major (index j·nx + i), with their finite minimum and maximum
 * @throws InvalidInputError naming the bad design field or axis entry (`x.to`, `y.points`…)
 * @see METHODS.md §15.3; evaluateLink (§10.1).
 * @example marginGrid(design, { x: { field: 'rangeM', from: 500, to: 5000, points: 200 }, y: { field: 'atmosphere.visibilityM', from: 200, to: 20000, points: 100, spacing: 'log' } })
 */
export function marginGrid(design: LinkDesignInput, axes: { x: SweepAxis; y: SweepAxis }): MarginGrid {
  requireValidDesign('marginGrid', design);
  const x = checkedAxis('marginGrid', 'x', axes.x);
  const y = checkedAxis('marginGrid', 'y', axes.y);
  if (x.field === y.field) throw new InvalidInputError('marginGrid', [{ path: 'y.field', message: `must differ from x.field (${x.field})` }]);
  if (x.points * y.points > MAX_GRID_POINTS) {
    throw new InvalidInputError('marginGrid', [{ path: 'y.points', message: `x.points × y.points must be at most ${MAX_GRID_POINTS} (got ${x.points * y.points})` }]);
  }
  const xAxis = describeAxis(design, x);
  const yAxis = describeAxis(design, y);
  const linkMarginDb = new Float64Array(x.points * y.points);
  fillMargins(design, xAxis, yAxis, linkMarginDb);
  let minMarginDb = Infinity;
  let maxMarginDb = -Infinity;
  for (const margin of linkMarginDb) {
    if (!Number.isFinite(margin)) continue;
    if (margin < minMarginDb) minMarginDb = margin;
    if (margin > maxMarginDb) maxMarginDb = margin;
  }
  if (minMarginDb > maxMarginDb) minMarginDb = maxMarginDb = Number.NaN;
  return { x: xAxis, y: yAxis, linkMarginDb, minMarginDb, maxMarginDb };
}
