/**
 * Building blocks for the link-core schemas: finite numbers with bounds whose error messages name
 * the reason in plain words ("must be greater than 0"). The field itself is named by the issue path
 * (see formatZodIssues), so messages never repeat it.
 */
import { z } from 'zod';

/** Message used for NaN, ±Infinity and non-numbers alike: JSON cannot carry NaN, the UI can. */
export const NOT_FINITE_MESSAGE = 'must be a finite number';
export const REQUIRED_MESSAGE = 'is required';

/**
 * A finite number (zod 4's `z.number()` already rejects NaN and ±Infinity; the message says so).
 * A missing value reads "is required" rather than "must be a finite number".
 */
export function finiteNumber() {
  return z.number({
    error: (issue) => (issue.input === undefined ? REQUIRED_MESSAGE : NOT_FINITE_MESSAGE),
  });
}

interface Bounds {
  /** exclusive lower bound */
  greaterThan?: number;
  /**
   * smallest meaningful value, checked after `greaterThan` (which then stops the checks): a zero
   * reads "must be greater than 0", a tiny positive value "must be at least 1 mm"
   */
  practicalMinimum?: { value: number; text: string };
  /** inclusive lower bound */
  atLeast?: number;
  /** exclusive upper bound */
  lessThan?: number;
  /** inclusive upper bound */
  atMost?: number;
  /** how the bound reads to a user, e.g. "100 km" for 100000 (metres) */
  unitNote?: { lower?: string; upper?: string };
}

/** A finite number within bounds; each violated bound gives its own message. */
export function boundedNumber(bounds: Bounds) {
  let schema = finiteNumber();
  const lowerText = (value: number) => bounds.unitNote?.lower ?? String(value);
  const upperText = (value: number) => bounds.unitNote?.upper ?? String(value);
  if (bounds.greaterThan !== undefined) {
    schema = schema.gt(bounds.greaterThan, { message: `must be greater than ${lowerText(bounds.greaterThan)}`, abort: true });
  }
  if (bounds.practicalMinimum !== undefined) {
    schema = schema.gte(bounds.practicalMinimum.value, `must be at least ${bounds.practicalMinimum.text}`);
  }
  if (bounds.atLeast !== undefined) {
    schema = schema.gte(bounds.atLeast, `must be at least ${lowerText(bounds.atLeast)}`);
  }
  if (bounds.lessThan !== undefined) {
    schema = schema.lt(bounds.lessThan, `must be less than ${upperText(bounds.lessThan)}`);
  }
  if (bounds.atMost !== undefined) {
    schema = schema.lte(bounds.atMost, `must be at most ${upperText(bounds.atMost)}`);
  }
  return schema;
}

/**
 * A probability within the range where the model that uses it means something. One message for
 * both bounds: it states the range and why (e.g. "must be between 1e-9 and 0.5: below 1e-9 …").
 */
export function boundedProbability(bounds: { min: number; max: number; reason: string }) {
  const message = probabilityMessage(bounds);
  return finiteNumber().gte(bounds.min, message).lte(bounds.max, message);
}

/** The message of {@link boundedProbability}, for tests and forms that show it before any input. */
export function probabilityMessage(bounds: { min: number; max: number; reason: string }): string {
  return `must be between ${String(bounds.min)} and ${String(bounds.max)}: ${bounds.reason}`;
}

/** A loss in dB: ≥ 0 (a gain is not a loss) and at most `maxDb`. */
export function lossDb(maxDb: number) {
  return boundedNumber({ atLeast: 0, atMost: maxDb, unitNote: { lower: '0 dB (a loss cannot be negative)', upper: `${maxDb} dB` } });
}
