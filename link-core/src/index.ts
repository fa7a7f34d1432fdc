/**
 * @beamwright/link-core — the only public entry of the computation engine (plus the `./units`
 * subpath for unit parsing, kept apart so that the UI bundle only carries mathjs where it parses).
 * Everything is pure: no I/O, no clock, no randomness; SI units inside, dB and dBm named.
 */
export { LINK_CORE_VERSION } from './version.js';

export {
  LinkDesignSchema,
  TransmitterSchema,
  ReceiverSchema,
  PointingSchema,
  AtmosphereSchema,
  ScintillationSchema,
  LINK_DESIGN_DEFAULTS,
  ATMOSPHERE_MODELS,
  VISIBILITY_DEFINITIONS,
} from './schemas/link-design.schema.js';
export type {
  LinkDesign,
  LinkDesignInput,
  TransmitterDesign,
  ReceiverDesign,
  PointingDesign,
  AtmosphereDesign,
  ScintillationDesign,
  AtmosphereModel,
  VisibilityDefinition,
} from './schemas/link-design.schema.js';
export { LinkBudgetSchema, BudgetTermSchema, BudgetCheckSchema, BUDGET_TERM_KEYS } from './schemas/link-budget.schema.js';
export type { LinkBudget, BudgetTerm, BudgetCheck, BudgetTermKey } from './schemas/link-budget.schema.js';
export { formatZodIssues } from './schemas/format-zod-issues.js';
export type { FieldIssue } from './schemas/format-zod-issues.js';

// Link budget (DOMAIN §8–§10)
export { evaluateLink, linkMarginAtRangeDb } from './budget/evaluate-link.js';
export { maxRange, maxRangeM, MAX_RANGE_SEARCH_M } from './budget/max-range.js';
export type { MaxRangeResult } from './budget/max-range.js';
export { availabilityFromClimatology, availabilityFromRecords, clearAirMarginDb } from './budget/availability.js';
export type {
  AvailabilityOptions,
  ClimatologyAvailability,
  RecordsAvailability,
  RecordsAvailabilityOptions,
  VisibilityClimatology,
  VisibilityRecords,
} from './budget/availability.js';
export { beamEnvelope, marginVsRange, marginVsVisibility } from './budget/samplers.js';
export type { BeamEnvelope, BeamEnvelopeOptions, RangeSweep, RangeSweepOptions, VisibilitySweep, VisibilitySweepOptions } from './budget/samplers.js';
