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

// Gaussian beams (METHODS.md §1)
export { rayleighRangeM, diffractionHalfAngleRad, beamRadiusFromWaistM, wavefrontRadiusFromWaistM, gouyPhaseRad, gaussianBeam } from './beam/gaussian-beam.js';
export type { GaussianBeamInput, GaussianBeam } from './beam/gaussian-beam.js';
export { gaussianPeakIntensityWPerM2, relativeIntensity, gaussianIntensityWPerM2, encircledPowerFraction } from './beam/intensity.js';
export { andrewsPhillipsBeamParameters, defocusedLaunch, launchBeamRadiusAtRangeM, beamRadiusAtRangeM, linearSpotRadiusM, quadratureSpotRadiusM } from './beam/launch.js';
export type { LaunchedBeamInput, AndrewsPhillipsParameters, DefocusedLaunchInput, DefocusedLaunch, BeamRadiusAtRangeInput } from './beam/launch.js';

// Transmit aperture (METHODS.md §2)
export { truncationGainEfficiency, transmittedFraction, optimumTruncation, uniformApertureGain, truncatedGaussianGain, fraunhoferDistanceM, onAxisFarFieldIrradianceWPerM2, gaussianBeamOnAxisGain, friisPowerRatio, transmitApertureForSpot } from './transmit/truncation.js';
export type { OptimumTruncation, TransmitApertureForSpotInput, TransmitApertureForSpot } from './transmit/truncation.js';

// Receive capture (METHODS.md §3)
export { centredCaptureFraction, annularCaptureFraction, offsetCaptureFraction, captureFraction, geometricLossDb, smallApertureCaptureApproximation, faridHranilovicCapture, faridHranilovicCaptureFraction, topHatCaptureRatio, offsetForRelativeCapture, fieldOfViewCheck, logRicianAnnulusProbability, logCentredAnnularCapture, logOffsetAnnularCapture, logMeanAnnularCapture } from './capture/capture.js';
export { exactMeanPointingLossDb, exactOutagePointingLossDb, ricianOutageRadius, captureFallsFromCentre } from './pointing/exact-pointing.js';
export { jointOutageProbability } from './budget/joint-outage.js';
export type { JointOutage } from './budget/joint-outage.js';
export type { CaptureFractionInput, FaridHranilovicCapture, TopHatCaptureInput, FieldOfViewInput, FieldOfViewCheck } from './capture/capture.js';

// Pointing, jitter and building sway (METHODS.md §4)
export { pointingOutageProbability, rayleighThresholdOverSigma, requiredThresholdOverSigma, meanPointingRelativePower, meanPointingLossDb, pointingLossDb, angularPointingLossDb, offsetForPointingLossM, pointingJitterBudget, pointingLossAtOutageDb, faridHranilovicPointingStatistics, faridHranilovicOutageProbability, combineJitterPerAxis } from './pointing/pointing.js';
export type { PointingOutageInput, PointingJitterBudgetInput, PointingJitterBudget, FaridHranilovicPointingStatistics } from './pointing/pointing.js';
export { buildingFundamentalFrequencyHz, buildingTiltEstimates } from './pointing/building-sway.js';
export type { BuildingTiltInput, BuildingTiltEstimates } from './pointing/building-sway.js';

// Atmospheric attenuation (METHODS.md §5)
export { KOSCHMIEDER_CONSTANT_2_PERCENT, VISIBILITY_REFERENCE_WAVELENGTH_M, VISIBILITY_2_PERCENT_PER_MOR, koschmiederConstant, toContrast2PercentVisibilityM, kimExponent, kruseExponent, visibilityExponent, visibilityExtinctionPerKm, visibilityExtinctionPerKmFast, visibilityAttenuationDbPerKm, visibilityForAttenuationM, visibility2PercentForAttenuationKm } from './atmosphere/visibility-attenuation.js';
export type { VisibilityModel, VisibilityAttenuationInput, VisibilityForAttenuationInput } from './atmosphere/visibility-attenuation.js';
export { alNaboulsiFogExtinctionPerKm, alNaboulsiFogAttenuationDbPerKm, rainAttenuationDbPerKm, snowAttenuationDbPerKm, clearAirAbsorptionDbPerKm, atmosphericPathLoss } from './atmosphere/fog-and-precipitation.js';
export type { FogType, AlNaboulsiFogInput, RainModel, SnowType, AtmosphericPathLoss } from './atmosphere/fog-and-precipitation.js';
export { VISIBILITY_CODE, visibilityCodeClass } from './atmosphere/visibility-code.js';
export type { VisibilityCodeClass } from './atmosphere/visibility-code.js';

// Turbulence (METHODS.md §6)
export { wavenumberRadPerM, rytovVariance, rytovVarianceFast, fresnelZoneM, coherenceRadiusM, friedParameterM, turbulenceRegime } from './turbulence/rytov.js';
export type { WaveModel, RytovVarianceInput, CoherenceInput, TurbulenceRegime } from './turbulence/rytov.js';
export { normalisedApertureSquared, gammaGammaParameters, scintillationIndexAllRegimes, apertureAveragedScintillationIndex, weakApertureAveraging, weakApertureAveragingNumerical, apertureAveragedFadeMarginDb, apertureAveragedScintillationIndexFast } from './turbulence/scintillation.js';
export type { GammaGammaParameters, GammaGammaParametersInput, WeakApertureAveraging } from './turbulence/scintillation.js';
export { GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT, GAMMA_GAMMA_LOGNORMAL_BLEND_START, gammaGammaCdf, gammaGammaPdf, gammaGammaCdfSeries, gammaGammaQuantile, fadeMarginGammaGammaDb, fadeMarginLognormalDb, fadeMarginDb } from './turbulence/fade-statistics.js';
export type { FadeMarginInput } from './turbulence/fade-statistics.js';
export { GAUSSIAN_BEAM_RYTOV_FORM_RATIO, gaussianBeamRytovRatioIntegral, gaussianBeamRytovRatio, gaussianBeamRytovRatioApproximate, gaussianBeamScintillationIndex } from './turbulence/gaussian-beam-scintillation.js';
export { collimatedBeamWander, longTermBeamRadius } from './turbulence/beam-wander.js';
export type { BeamWander, LongTermBeamRadius } from './turbulence/beam-wander.js';
export { beamWaveAtReceiverFast, beamWaveScintillationFast, LONG_TERM_SPREAD_BRIDGE_EXPONENT } from './turbulence/beam-wave.js';
export type { BeamWaveAtReceiver } from './turbulence/beam-wave.js';

// Receiver (METHODS.md §7)
export { PLANCK_CONSTANT_J_S, SPEED_OF_LIGHT_M_PER_S, ELEMENTARY_CHARGE_C, qFactorForBer, berForQFactor, qFactorDb, photonEnergyJ, photonsPerBit, idealResponsivityAPerW, receiverSensitivity, checkReceivedPower } from './receiver/sensitivity.js';
export type { ReceiverSensitivityInput, ReceiverSensitivity, ReceivedPowerVerdict } from './receiver/sensitivity.js';

// Eye safety (METHODS.md §8): indicative only, always shown with its caution
export { DEFAULT_LASER_SAFETY_EDITION, normaliseLaserSafetyEdition, eyeSafetyCaution, correctionFactorC4, correctionFactorC7, ocularMpeDetails, ocularMpeWPerM2, ocularMpeRadiantExposureJPerM2, limitingApertureDiameterM, mpePowerThroughLimitingApertureW, CLASS_3B_CW_LIMIT_W, classOneAel, classOneAelW } from './safety/exposure-limits.js';
export type { LaserSafetyEdition, LaserSafetyEditionInput, OcularMpeInput, OcularMpeDetails, ClassOneAel } from './safety/exposure-limits.js';
export { BINOCULAR_7X50_GAIN, viewingOpticsGain, nohdM, nohdFarFieldM, exitPeakIrradianceWPerM2 } from './safety/hazard-distance.js';
export type { NohdInput } from './safety/hazard-distance.js';
export { accessiblePowerW, measurementConditions, indicativeLaserClass, assessEyeSafety } from './safety/classification.js';
export { eyeSafetyInputOf } from './safety/eye-safety-input.js';
export type { BeamGrowthModel, AccessiblePowerInput, MeasurementCondition, IndicativeLaserClass, LaserClassInput, LaserClassIndication, EyeSafetyInput, EyeSafetyAssessment } from './safety/classification.js';

// Site geometry (METHODS.md §9)
export { linkGeometry, earthCurvature, surveyingCurvatureRefractionDropM, earthBulgeM, fresnelRadiusM, lineOfSightClearance } from './geometry/link-geometry.js';
export type { Site, LinkGeometryInput, LinkGeometry, EarthCurvature, PathObstacle, ClearanceBeam, LineOfSightClearanceInput, ObstacleClearance, LineOfSightClearance } from './geometry/link-geometry.js';
export { normaliseAzimuthDeg, geodesicInverse, geodeticToEcef, enuVector, formatDegreesMinutesSeconds, parseDegreesMinutesSeconds } from './geometry/geodesy.js';
export type { GeodesicInverse, Ecef, Enu } from './geometry/geodesy.js';

// Numerical building blocks
export { noncentralChiSquare2Tails, noncentralChiSquare2TailsFast, marcumQ1, marcumQ1Complement } from './numeric/marcum-q.js';
export type { NoncentralChiSquareTails } from './numeric/marcum-q.js';
export { findRootBrent } from './numeric/root-finding.js';
export type { RootFindingOptions } from './numeric/root-finding.js';
export { integrate } from './numeric/quadrature.js';
export type { QuadratureOptions } from './numeric/quadrature.js';
export { besselI0Scaled } from './numeric/bessel.js';

// Link budget and availability (METHODS.md §10–§11)
export { evaluateLink, linkMarginAtRangeDb } from './budget/evaluate-link.js';
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

// --- Batch margin kernel (METHODS.md §10.8): margins of many variations of one design, for sweeps,
// heat maps and solvers, without a budget object per point. Kept together at the end of the entry.
export { evaluateLinkMargins, linkMarginPointDesign, LINK_MARGIN_FIELDS } from './budget/evaluate-link-margins.js';
export type { LinkMarginField, LinkMarginColumns } from './budget/evaluate-link-margins.js';
