/**
 * @beamwright/link-core — the product entry of the computation engine: what the api and the ui
 * need to evaluate, size and check a link (the design and budget schemas, the budget, maximum
 * range, samplers, availability, eye safety, site geometry and the units), plus the reference
 * functions whose names earlier releases fixed for outside callers.
 *
 * Other entries: `./physics` (every building block of the budget, for a specialist), `./units`
 * (mathjs-based parsing of typed quantities, kept apart so the UI bundle carries mathjs only where
 * it parses) and `./contracts` (the HTTP API's zod schemas and the shared workflow rules).
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
  PROBABILITY_BOUNDS,
  FADE_PROBABILITY_MESSAGE,
  POINTING_OUTAGE_PROBABILITY_MESSAGE,
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
export { VisibilityClimatologySchema, VisibilityRecordsSchema } from './schemas/availability.schema.js';
export type { VisibilityClimatologyInput, VisibilityRecordsInput } from './schemas/availability.schema.js';
export { formatZodIssues } from './schemas/format-zod-issues.js';
export type { FieldIssue } from './schemas/format-zod-issues.js';

// Units and conversions (mathjs-based parsing of user entry lives in the ./units subpath)
export { widthOverOneOverESquaredRadius, convertBeamWidth, beamWidthDefinitionRatio, fullAngleToHalfAngleRad, halfAngleToFullAngleRad, radiansToDegrees, degreesToRadians } from './units/beam-width.js';
export type { BeamWidthDefinition, BeamWidthExtent, BeamWidth } from './units/beam-width.js';
export { DB_PER_NATURAL_LOG_POWER, WGS84_ELLIPSOID, GRS80_ELLIPSOID, MEAN_EARTH_RADIUS_M, DEFAULT_REFRACTION_COEFFICIENT } from './units/constants.js';
export type { Ellipsoid } from './units/constants.js';
export { ratioToDb, dbToRatio, fractionToLossDb, wattsToDbm, dbmToWatts } from './units/decibels.js';

// Eye safety (METHODS.md §8): indicative only, always shown with its caution
export { DEFAULT_LASER_SAFETY_EDITION, normaliseLaserSafetyEdition, eyeSafetyCaution } from './safety/exposure-limits.js';
export type { LaserSafetyEdition, LaserSafetyEditionInput } from './safety/exposure-limits.js';
export { assessEyeSafety } from './safety/classification.js';
export { eyeSafetyInputOf } from './safety/eye-safety-input.js';
export type { IndicativeLaserClass, LaserClassIndication, EyeSafetyInput, EyeSafetyAssessment } from './safety/classification.js';

// Site geometry (METHODS.md §9)
export { linkGeometry, lineOfSightClearance } from './geometry/link-geometry.js';
export type { Site, LinkGeometryInput, LinkGeometry, PathObstacle, ClearanceBeam, LineOfSightClearanceInput, ObstacleClearance, LineOfSightClearance } from './geometry/link-geometry.js';
export { normaliseAzimuthDeg, geodesicInverse, formatDegreesMinutesSeconds, parseDegreesMinutesSeconds } from './geometry/geodesy.js';
export type { GeodesicInverse } from './geometry/geodesy.js';

// Visibility classes for labels (METHODS.md §5.9)
export { VISIBILITY_CODE, visibilityCodeClass } from './atmosphere/visibility-code.js';
export type { VisibilityCodeClass } from './atmosphere/visibility-code.js';

// Reference functions with names fixed for outside callers since the first engine release; the same
// functions, with the rest of their families, are in `./physics`.
export {
  gaussianBeam,
  captureFraction,
  geometricLossDb,
  optimumTruncation,
  pointingOutageProbability,
  pointingLossDb,
  meanPointingLossDb,
  visibilityAttenuationDbPerKm,
  rytovVariance,
  gammaGammaParameters,
  fadeMarginDb,
  ocularMpeWPerM2,
  nohdM,
  collimatedBeamWander,
  longTermBeamRadius,
} from './physics.js';

// Link budget and availability (METHODS.md §10–§11)
export { evaluateLink, linkMarginAtRangeDb } from './budget/evaluate-link.js';
export { jointOutageProbability } from './budget/joint-outage.js';
export type { JointOutage } from './budget/joint-outage.js';
export { compareEngineVersions, currentEngineFigures, readStoredDesign, GAUSSIAN_BEAM_DEFAULT_SINCE, REQUIRED_LINK_MARGIN_DB } from './budget/engine-version.js';
export type { CurrentEngineFigures } from './budget/engine-version.js';
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

// The worked example design LB-01 (METHODS.md §10.1), shared by the tests of every workspace
export { workedExampleDesign } from './examples/worked-example.js';

// A seeded uniform generator for Monte-Carlo checks and benchmarks (no unseeded randomness)
export { seededUniform } from './numeric/seeded-random.js';

// ---------------------------------------------------------------------------------------------
// Design solvers, wavelength comparison and sweep samplers (METHODS.md §15).
// ---------------------------------------------------------------------------------------------
export { VARIABLE_DESIGN_FIELDS, VARIABLE_DESIGN_FIELD_UNITS, designFieldRange, designValueOf, withDesignValue, InvalidInputError } from './budget/design-fields.js';
export type { VariableDesignField, DesignFieldRange } from './budget/design-fields.js';
export { solveDesign, SolveDesignOptionsSchema, SOLVE_DESIGN_VARIABLES, SOLVE_DESIGN_FIELDS } from './budget/solve-design.js';
export type { SolveDesignOptions, SolveDesignResult, SolveDesignVariable } from './budget/solve-design.js';
export { compareWavelengths, referenceWeather, CompareWavelengthsOptionsSchema, USUAL_FSO_WAVELENGTHS_M, MAX_COMPARED_WAVELENGTHS, REFERENCE_WEATHER_CLASSES } from './budget/wavelength-comparison.js';
export type { CompareWavelengthsOptions, ReferenceWeather, ReferenceWeatherClass, WavelengthComparison, WavelengthComparisonRow } from './budget/wavelength-comparison.js';
export { marginSweep, marginGrid, sweepAxisValues, SweepAxisSchema, SWEEP_SPACINGS, MAX_SWEEP_POINTS, MAX_GRID_POINTS } from './budget/sweeps.js';
export type { SweepAxis, SweepAxisValues, SweepSpacing, MarginSweep, MarginGrid } from './budget/sweeps.js';
// Availability analysis of a site's records or cumulative table: months, outages, margin distribution,
// ranges for a target availability (METHODS.md §11.4–§11.7)
export { analyseRecordsAvailability, analyseClimatologyAvailability, AVAILABILITY_TARGETS } from './budget/availability-analysis.js';
export type {
  RecordsAnalysis,
  RecordsAnalysisOptions,
  ClimatologyAnalysis,
  ClimatologyAnalysisOptions,
  MonthAvailability,
  Outage,
  MarginBin,
  MarginDistribution,
  RangeForAvailability,
  AvailabilityAtRange,
} from './budget/availability-analysis.js';

// --- Batch margin kernel (METHODS.md §10.8): margins of many variations of one design, for sweeps,
// heat maps and solvers, without a budget object per point. Kept together at the end of the entry.
export { evaluateLinkMargins, linkMarginPointDesign, LINK_MARGIN_FIELDS } from './budget/evaluate-link-margins.js';
export type { LinkMarginField, LinkMarginColumns } from './budget/evaluate-link-margins.js';
