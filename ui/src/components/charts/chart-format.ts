// Shared helpers of the planner's chart options: number text, axis limits and units, and the
// plotted-values shape that every chart's table is built from.
import { MARGIN_VERDICT_TEXT, marginVerdict } from '@/components/ui/margin-verdict';

/** A number with `digits` decimals, a true minus sign and no "−0.00". */
export function round(value: number, digits = 2): string {
  const text = value.toFixed(digits);
  return Number(text) === 0 ? (0).toFixed(digits) : text.replace('-', '\u2212');
}

// The tables give each margin the same worded verdict as the headline and the links list.
export const marginWord = (marginDb: number): string => MARGIN_VERDICT_TEXT[marginVerdict(marginDb)];

/** A round axis limit a little above `value` (1, 2 or 5 times a power of ten). */
export function niceLimit(value: number): number {
  const target = value * 1.1;
  const power = 10 ** Math.floor(Math.log10(target));
  const step = [1, 2, 2.5, 5, 10].find((factor) => factor * power >= target) ?? 10;
  return step * power;
}

export function distanceAxis(maxM: number): { unit: 'km' | 'm'; factor: number } {
  return maxM >= 1000 ? { unit: 'km', factor: 1e-3 } : { unit: 'm', factor: 1 };
}

/**
 * The values a chart plots, in the units of its axes, and the same values as a table: the table
 * under each chart is built from these very points, so it always says what the chart shows.
 */
export interface ChartData {
  columns: string[];
  /** one row per plotted sample; a column is a number (in the unit its heading names) or a word */
  rows: (number | string)[][];
}
