// What the explorer is asked to plot: one input (a line) or two (a heat map), each with its span,
// number of samples and spacing, as the form holds them (text) and as the sweep needs them (SI).
import { z } from 'zod';
import { designFieldRange, type LinkDesignInput } from '@beamwright/link-core';
import { EXPLORE_FIELDS, EXPLORE_FIELD_IDS, defaultAxisSpan } from '@/features/explore/explore-fields';
import type { SweepAxis } from '@/features/explore/sweep-compute';

/** Most budgets one heat map may ask for (200 × 100, the size the benchmark measures). */
export const MAX_GRID_CELLS = 20_000;
export const MAX_LINE_POINTS = 400;

const numberText = z
  .string()
  .trim()
  .min(1, 'is required')
  .refine((text) => Number.isFinite(Number(text)), 'must be a number')
  .transform(Number);

const axisSchema = z
  .object({
    field: z.enum(EXPLORE_FIELD_IDS),
    from: numberText,
    to: numberText,
    points: numberText.pipe(z.number().int('must be a whole number').min(2, 'must be at least 2').max(MAX_LINE_POINTS, `must be at most ${MAX_LINE_POINTS}`)),
    spacing: z.enum(['linear', 'log']),
  })
  .superRefine((axis, context) => {
    if (axis.from === axis.to) context.addIssue({ code: 'custom', path: ['to'], message: 'must differ from the first value' });
    if (axis.spacing === 'log') {
      if (axis.from <= 0) context.addIssue({ code: 'custom', path: ['from'], message: 'must be above 0 on a logarithmic scale' });
      if (axis.to <= 0) context.addIssue({ code: 'custom', path: ['to'], message: 'must be above 0 on a logarithmic scale' });
    }
    // the design schema's own bounds, in the unit the form shows
    const { lower, upper, lowerExclusive } = designFieldRange(axis.field);
    const factor = EXPLORE_FIELDS[axis.field].factor;
    const unit = EXPLORE_FIELDS[axis.field].unit;
    const shown = (value: number) => `${Number((value / factor).toPrecision(4))} ${unit}`;
    for (const end of ['from', 'to'] as const) {
      if (axis.spacing === 'log' && axis[end] <= 0) continue; // already said above
      const si = axis[end] * factor;
      if (si > upper) context.addIssue({ code: 'custom', path: [end], message: `must be at most ${shown(upper)}` });
      else if (lowerExclusive ? si <= lower : si < lower) context.addIssue({ code: 'custom', path: [end], message: `must be ${lowerExclusive ? 'above' : 'at least'} ${shown(lower)}` });
    }
  });

export const exploreSettingsSchema = z
  .object({ mode: z.enum(['line', 'grid']), x: axisSchema, y: axisSchema })
  .superRefine((settings, context) => {
    if (settings.mode !== 'grid') return;
    if (settings.x.field === settings.y.field) context.addIssue({ code: 'custom', path: ['y', 'field'], message: 'must differ from the horizontal input' });
    if (settings.x.points * settings.y.points > MAX_GRID_CELLS) {
      context.addIssue({ code: 'custom', path: ['y', 'points'], message: `makes more than ${MAX_GRID_CELLS.toLocaleString('en')} budgets with the horizontal samples` });
    }
  });

export type ExploreSettingsText = z.input<typeof exploreSettingsSchema>;
export type ExploreSettings = z.output<typeof exploreSettingsSchema>;

/** The form's labels, also used to word its messages ("From must be a number"). */
export const EXPLORE_LABELS: Record<string, string> = {
  'x.field': 'Horizontal input',
  'x.from': 'From',
  'x.to': 'To',
  'x.points': 'Samples',
  'y.field': 'Vertical input',
  'y.from': 'From',
  'y.to': 'To',
  'y.points': 'Samples',
};

function axisText(design: LinkDesignInput, field: (typeof EXPLORE_FIELD_IDS)[number], points: number) {
  const span = defaultAxisSpan(design, field);
  return { field, from: String(span.from), to: String(span.to), points: String(points), spacing: span.spacing };
}

/** A first view: margin against path length, and path length × visibility for the heat map. */
export function defaultExploreSettings(design: LinkDesignInput): ExploreSettingsText {
  return { mode: 'line', x: axisText(design, 'rangeM', 121), y: axisText(design, 'atmosphere.visibilityM', 40) };
}

/** The same axis with a new input and that input's default span. */
export function axisForField(design: LinkDesignInput, field: (typeof EXPLORE_FIELD_IDS)[number], points: string) {
  return { ...axisText(design, field, Number(points) || 40), points };
}

export function toSweepAxis(axis: ExploreSettings['x']): SweepAxis {
  const factor = EXPLORE_FIELDS[axis.field].factor;
  return { field: axis.field, fromSi: axis.from * factor, toSi: axis.to * factor, points: axis.points, spacing: axis.spacing };
}
