/**
 * @beamwright/link-core/physics — the building blocks of the budget, for a specialist who wants to
 * compute one effect on its own: Gaussian beams and launch, transmit truncation, receive capture,
 * pointing statistics, attenuation, turbulence and fade statistics, receiver sensitivity, the eye-safety
 * pieces and the site-geometry pieces. Each function documents its formula, units, validity and
 * source; METHODS.md gives the section cited beside each group.
 *
 * Not here on purpose: the positional "fast" twins that the budget chain calls in its inner loop and
 * the numerical machinery (quadrature, root finding, scaled Bessel functions, noncentral χ² tails).
 * They are implementation details whose signatures may change with the next optimisation; each has
 * a documented public counterpart here or in the product entry.
 */

// Gaussian beams (METHODS.md §1)
export { rayleighRangeM, diffractionHalfAngleRad, beamRadiusFromWaistM, wavefrontRadiusFromWaistM, gouyPhaseRad, gaussianBeam } from './beam/gaussian-beam.js';
export type { GaussianBeamInput, GaussianBeam } from './beam/gaussian-beam.js';
export { gaussianPeakIntensityWPerM2, relativeIntensity, gaussianIntensityWPerM2, encircledPowerFraction } from './beam/intensity.js';
export { andrewsPhillipsBeamParameters, defocusedLaunch, launchBeamRadiusAtRangeM, beamRadiusAtRangeM, linearSpotRadiusM, quadratureSpotRadiusM } from './beam/launch.js';
export type { LaunchedBeamInput, AndrewsPhillipsParameters, DefocusedLaunchInput, DefocusedLaunch, BeamRadiusAtRangeInput } from './beam/launch.js';

// Transmit aperture (METHODS.md §2)
export { truncationGainEfficiency, transmittedFraction, optimumTruncation, uniformApertureGain, truncatedGaussianGain, fraunhoferDistanceM, onAxisFarFieldIrradianceWPerM2, gaussianBeamOnAxisGain, friisPowerRatio, transmitApertureForSpot } from './transmit/truncation.js';
export type { OptimumTruncation, TransmitApertureForSpotInput, TransmitApertureForSpot } from './transmit/truncation.js';

// Receive capture, exact capture under pointing error (METHODS.md §3)
export { centredCaptureFraction, annularCaptureFraction, offsetCaptureFraction, captureFraction, geometricLossDb, smallApertureCaptureApproximation, faridHranilovicCapture, faridHranilovicCaptureFraction, topHatCaptureRatio, offsetForRelativeCapture, fieldOfViewCheck, logRicianAnnulusProbability, logCentredAnnularCapture, logOffsetAnnularCapture, logMeanAnnularCapture } from './capture/capture.js';
export type { CaptureFractionInput, FaridHranilovicCapture, TopHatCaptureInput, FieldOfViewInput, FieldOfViewCheck } from './capture/capture.js';
export { exactMeanPointingLossDb, exactOutagePointingLossDb, ricianOutageRadius, captureFallsFromCentre } from './pointing/exact-pointing.js';

// Pointing, jitter and building sway (METHODS.md §4)
export { pointingOutageProbability, rayleighThresholdOverSigma, requiredThresholdOverSigma, meanPointingRelativePower, meanPointingLossDb, pointingLossDb, angularPointingLossDb, offsetForPointingLossM, pointingJitterBudget, pointingLossAtOutageDb, faridHranilovicPointingStatistics, faridHranilovicOutageProbability, combineJitterPerAxis } from './pointing/pointing.js';
export type { PointingOutageInput, PointingJitterBudgetInput, PointingJitterBudget, FaridHranilovicPointingStatistics } from './pointing/pointing.js';
export { buildingFundamentalFrequencyHz, buildingTiltEstimates } from './pointing/building-sway.js';
export type { BuildingTiltInput, BuildingTiltEstimates } from './pointing/building-sway.js';

// Atmospheric attenuation (METHODS.md §5)
export { KOSCHMIEDER_CONSTANT_2_PERCENT, VISIBILITY_REFERENCE_WAVELENGTH_M, VISIBILITY_2_PERCENT_PER_MOR, koschmiederConstant, toContrast2PercentVisibilityM, kimExponent, kruseExponent, visibilityExponent, visibilityExtinctionPerKm, visibilityAttenuationDbPerKm, visibilityForAttenuationM, visibility2PercentForAttenuationKm } from './atmosphere/visibility-attenuation.js';
export type { VisibilityModel, VisibilityAttenuationInput, VisibilityForAttenuationInput } from './atmosphere/visibility-attenuation.js';
export { alNaboulsiFogExtinctionPerKm, alNaboulsiFogAttenuationDbPerKm, rainAttenuationDbPerKm, snowAttenuationDbPerKm, clearAirAbsorptionDbPerKm, atmosphericPathLoss } from './atmosphere/fog-and-precipitation.js';
export type { FogType, AlNaboulsiFogInput, RainModel, SnowType, AtmosphericPathLoss } from './atmosphere/fog-and-precipitation.js';

// Turbulence (METHODS.md §6)
export { wavenumberRadPerM, rytovVariance, fresnelZoneM, coherenceRadiusM, friedParameterM, turbulenceRegime } from './turbulence/rytov.js';
export type { WaveModel, RytovVarianceInput, CoherenceInput, TurbulenceRegime } from './turbulence/rytov.js';
export { normalisedApertureSquared, gammaGammaParameters, scintillationIndexAllRegimes, apertureAveragedScintillationIndex, weakApertureAveraging, weakApertureAveragingNumerical, apertureAveragedFadeMarginDb } from './turbulence/scintillation.js';
export type { GammaGammaParameters, GammaGammaParametersInput, WeakApertureAveraging } from './turbulence/scintillation.js';
export { GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT, GAMMA_GAMMA_LOGNORMAL_BLEND_START, gammaGammaCdf, gammaGammaPdf, gammaGammaCdfSeries, gammaGammaQuantile, fadeMarginGammaGammaDb, fadeMarginLognormalDb, fadeMarginDb } from './turbulence/fade-statistics.js';
export type { FadeMarginInput } from './turbulence/fade-statistics.js';
export { GAUSSIAN_BEAM_RYTOV_FORM_RATIO, gaussianBeamRytovRatioIntegral, gaussianBeamRytovRatio, gaussianBeamRytovRatioApproximate, gaussianBeamScintillationIndex } from './turbulence/gaussian-beam-scintillation.js';
export { collimatedBeamWander, longTermBeamRadius } from './turbulence/beam-wander.js';
export type { BeamWander, LongTermBeamRadius } from './turbulence/beam-wander.js';
export { LONG_TERM_SPREAD_BRIDGE_EXPONENT } from './turbulence/beam-wave.js';

// Receiver (METHODS.md §7)
export { PLANCK_CONSTANT_J_S, SPEED_OF_LIGHT_M_PER_S, ELEMENTARY_CHARGE_C, qFactorForBer, berForQFactor, qFactorDb, photonEnergyJ, photonsPerBit, idealResponsivityAPerW, receiverSensitivity, checkReceivedPower } from './receiver/sensitivity.js';
export type { ReceiverSensitivityInput, ReceiverSensitivity, ReceivedPowerVerdict } from './receiver/sensitivity.js';

// Eye-safety pieces (METHODS.md §8): indicative only, always shown with eyeSafetyCaution's text
export { correctionFactorC4, correctionFactorC7, ocularMpeDetails, ocularMpeWPerM2, ocularMpeRadiantExposureJPerM2, limitingApertureDiameterM, mpePowerThroughLimitingApertureW, CLASS_3B_CW_LIMIT_W, classOneAel, classOneAelW } from './safety/exposure-limits.js';
export type { OcularMpeInput, OcularMpeDetails, ClassOneAel } from './safety/exposure-limits.js';
export { BINOCULAR_7X50_GAIN, viewingOpticsGain, nohdM, nohdFarFieldM, exitPeakIrradianceWPerM2 } from './safety/hazard-distance.js';
export type { NohdInput } from './safety/hazard-distance.js';
export { accessiblePowerW, measurementConditions, indicativeLaserClass } from './safety/classification.js';
export type { BeamGrowthModel, AccessiblePowerInput, MeasurementCondition, LaserClassInput } from './safety/classification.js';

// Site-geometry pieces (METHODS.md §9)
export { earthCurvature, surveyingCurvatureRefractionDropM, earthBulgeM, fresnelRadiusM } from './geometry/link-geometry.js';
export type { EarthCurvature } from './geometry/link-geometry.js';
export { geodeticToEcef, enuVector } from './geometry/geodesy.js';
export type { Ecef, Enu } from './geometry/geodesy.js';

// Special functions a specialist may check a result with (METHODS.md §12)
export { marcumQ1, marcumQ1Complement } from './numeric/marcum-q.js';
