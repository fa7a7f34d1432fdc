/**
 * Contract between the reference check cases in fixtures/reference/check-values.json and the
 * engine. Each domain file in this folder maps a case `method` to a function that feeds the case
 * inputs (SI units, keys as in the JSON) to the engine and returns the engine's values under the
 * same keys as the case's `expected` object.
 */
export type ReferenceValue = number | boolean | string | null;

// Inputs are read from JSON, so they are loosely typed on purpose.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type ReferenceInputs = Record<string, any>;

export type ReferenceAdapter = (inputs: ReferenceInputs, caseId: string) => Record<string, ReferenceValue>;

export type ReferenceAdapters = Record<string, ReferenceAdapter>;

/**
 * Expected keys (written `method.key`, or `method` for a whole method) that the engine deliberately
 * does not compute, each with the reason. The reference test fails on any expected key that is
 * neither computed nor listed here.
 */
export type NotCovered = Record<string, string>;
