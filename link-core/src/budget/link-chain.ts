/**
 * The arithmetic of the link budget (METHODS.md §10.1), allocation-light and without validation, shared by
 * evaluateLink, maxRangeM, the availability routines and the chart samplers. A design is first
 * resolved into plain numbers (defaults applied with `??`, no zod parse), then the chain is
 * evaluated for any range and specific attenuation.
 */
import { alNaboulsiFogExtinctionPerKm } from '../atmosphere/fog-and-precipitation.js';
import { VISIBILITY_2_PERCENT_PER_MOR, visibility2PercentForAttenuationKm, visibilityExtinctionPerKmFast } from '../atmosphere/visibility-attenuation.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { annularCaptureFractionStable, logMeanAnnularCapture } from '../capture/capture.js';
import { exactOutagePointingLossAtRadiusDb, ricianOutageRadius } from '../pointing/exact-pointing.js';
import { LINK_DESIGN_DEFAULTS, type AtmosphereModel, type LinkDesignInput } from '../schemas/link-design.schema.js';
import { apertureAveragedFadeMarginDb, apertureAveragedScintillationIndexFast } from '../turbulence/scintillation.js';
import { normalQuantileOf } from '../numeric/normal.js';
import { rytovVarianceFast } from '../turbulence/rytov.js';
import { beamWaveAtReceiverFast, beamWaveScintillationFast, type BeamWaveAtReceiver } from '../turbulence/beam-wave.js';
import { DB_PER_NATURAL_LOG_POWER as DB_PER_NEPER_POWER } from '../units/constants.js';


/** A design reduced to the numbers the chain needs, defaults applied. */
export interface ResolvedDesign {
  rangeM: number;
  wavelengthM: number;
  powerDbm: number;
  apertureBeamRadiusM: number;
  /** datasheet half-angle [rad]; 0 when absent (collimated) */
  halfAngleDivergenceRad: number;
  m2: number;
  transmitOpticsLossDb: number;
  apertureDiameterM: number;
  obscurationRatio: number;
  sensitivityDbm: number;
  receiveOpticsLossDb: number;
  overloadDbm: number | undefined;
  fieldOfViewRad: number | undefined;
  jitterSigmaPerAxisRad: number;
  staticErrorRad: number;
  /**
   * outage-based pointing: the angular error exceeded with the outage probability [rad] (range-free,
   * since bias and jitter both scale with L); NaN for the mean-loss model
   */
  pointingOutageAngleRad: number;
  /** the design's pointing outage probability; NaN for the mean-loss model */
  pointingOutageProbability: number;
  /** visibility model of the design */
  atmosphereModel: AtmosphereModel;
  /** Kruse's exponent (Kim's otherwise) for the Kim/Kruse family */
  kruse: boolean;
  /**
   * Al Naboulsi fog: the numerator c of β = c/V [1/km·km] at this wavelength (0 for Kim/Kruse), so
   * that γ = 4.343·c/V and its inverse is closed form
   */
  fogNumeratorPerKm: number;
  /** 2 % contrast visibility [km] after any MOR conversion */
  visibility2PercentKm: number;
  morInput: boolean;
  cn2: number;
  /** Gaussian-beam turbulence model (long-term spread, beam-wave scintillation); false: spherical wave */
  gaussianBeam: boolean;
  includeScintillation: boolean;
  fadeProbability: number;
  systemMarginDb: number;
}

/**
 * Angular pointing error exceeded with probability p by a Rician error with bias θb and per-axis
 * jitter σθ: the exact root of Q1(θb/σθ, r_p/σθ) = p (range-free: bias and jitter both scale with L).
 * @see Marcum J.I. (1960); ricianOutageRadius.
 */
function outageAngleRad(jitterSigmaPerAxisRad: number, staticErrorRad: number, outageProbability: number): number {
  if (jitterSigmaPerAxisRad > 0 && staticErrorRad / jitterSigmaPerAxisRad > LARGE_OFFSET_OVER_SIGMA) {
    // A bias of very many σ: R = |ν + x + i·y| ≈ ν + x + y²/(2ν) − x·y²/(2ν²), whose p-quantile is
    // r_p ≈ ν + σz + σ²/(2ν) − σ³z/(4ν²) with z = −Φ⁻¹(p) (derived: y² at its mean in the third
    // term, its variance σ⁴/(2ν²) widening the normal quantile in the fourth; within 1e-10 of the
    // exact root from 1000σ, budget.test.ts). Written without ν/σ, which overflows for a vanishing jitter.
    const z = -normalQuantileOf(outageProbability);
    const ratio = jitterSigmaPerAxisRad / staticErrorRad;
    return staticErrorRad + jitterSigmaPerAxisRad * (z + ratio / 2 - (z * ratio * ratio) / 4);
  }
  return ricianOutageRadius(jitterSigmaPerAxisRad, staticErrorRad, outageProbability);
}

/** Above this bias/jitter ratio the outage radius uses the Gaussian limit of the Rician tail. */
const LARGE_OFFSET_OVER_SIGMA = 1000;

/**
 * Numerator of Al Naboulsi's fog extinction β = c/V (λ in µm, V in km): advection
 * c = 0.11478λ + 3.8367, radiation c = 0.18126λ² + 0.13709λ + 3.7502; 0 for the other models.
 * @see Al Naboulsi M., Sizun H., de Fornel F., Opt. Eng. 43(2), 319–329 (2004).
 */
function alNaboulsiNumerator(model: AtmosphereModel, wavelengthM: number): number {
  const fogType = model === 'al-naboulsi-advection' ? 'advection' : model === 'al-naboulsi-radiation' ? 'radiation' : undefined;
  // β·V at V = 1 km from the atmosphere module, so the coefficients live in one place.
  return fogType === undefined ? 0 : alNaboulsiFogExtinctionPerKm({ fogType, visibilityM: 1000, wavelengthM });
}

/** Applies the schema defaults with `??` (the hot path never parses). */
export function resolveDesign(design: LinkDesignInput): ResolvedDesign {
  return resolveDesignInto(emptyResolvedDesign(), design);
}

/** A resolved design with every field present (one object shape for the engine's hot paths). */
export function emptyResolvedDesign(): ResolvedDesign {
  return {
    rangeM: 0,
    wavelengthM: 0,
    powerDbm: 0,
    apertureBeamRadiusM: 0,
    halfAngleDivergenceRad: 0,
    m2: 1,
    transmitOpticsLossDb: 0,
    apertureDiameterM: 0,
    obscurationRatio: 0,
    sensitivityDbm: 0,
    receiveOpticsLossDb: 0,
    overloadDbm: undefined,
    fieldOfViewRad: undefined,
    jitterSigmaPerAxisRad: 0,
    staticErrorRad: 0,
    pointingOutageAngleRad: Number.NaN,
    pointingOutageProbability: Number.NaN,
    atmosphereModel: 'kim',
    kruse: false,
    fogNumeratorPerKm: 0,
    visibility2PercentKm: 0,
    morInput: false,
    cn2: 0,
    gaussianBeam: true,
    includeScintillation: false,
    fadeProbability: 0,
    systemMarginDb: 0,
  };
}

/**
 * Resolves a design into an existing object (evaluateLink reuses one, so that the per-call work
 * allocates only the budget it returns).
 */
export function resolveDesignInto(target: ResolvedDesign, design: LinkDesignInput): ResolvedDesign {
  const { transmitter, receiver, pointing, atmosphere } = design;
  const morInput = atmosphere.visibilityDefinition === 'mor-5-percent';
  const model = atmosphere.model ?? LINK_DESIGN_DEFAULTS.atmosphereModel;
  target.rangeM = design.rangeM;
  target.wavelengthM = transmitter.wavelengthM;
  target.powerDbm = transmitter.powerDbm;
  target.apertureBeamRadiusM = transmitter.waistRadiusM;
  target.halfAngleDivergenceRad = transmitter.halfAngleDivergenceRad ?? 0;
  target.m2 = transmitter.m2 ?? LINK_DESIGN_DEFAULTS.m2;
  target.transmitOpticsLossDb = transmitter.opticsLossDb;
  target.apertureDiameterM = receiver.apertureDiameterM;
  target.obscurationRatio = receiver.obscurationRatio ?? LINK_DESIGN_DEFAULTS.obscurationRatio;
  target.sensitivityDbm = receiver.sensitivityDbm;
  target.receiveOpticsLossDb = receiver.opticsLossDb;
  target.overloadDbm = receiver.overloadDbm;
  target.fieldOfViewRad = receiver.fieldOfViewRad;
  target.jitterSigmaPerAxisRad = pointing.jitterSigmaPerAxisRad;
  target.staticErrorRad = pointing.staticErrorRad;
  target.pointingOutageAngleRad =
    pointing.outageProbability === undefined ? Number.NaN : outageAngleRad(pointing.jitterSigmaPerAxisRad, pointing.staticErrorRad, pointing.outageProbability);
  target.pointingOutageProbability = pointing.outageProbability ?? Number.NaN;
  target.atmosphereModel = model;
  target.kruse = model === 'kruse';
  target.fogNumeratorPerKm = model === 'kim' || model === 'kruse' ? 0 : alNaboulsiNumerator(model, transmitter.wavelengthM);
  target.visibility2PercentKm = (morInput ? atmosphere.visibilityM * VISIBILITY_2_PERCENT_PER_MOR : atmosphere.visibilityM) / 1000;
  target.morInput = morInput;
  target.cn2 = atmosphere.cn2;
  target.gaussianBeam = (atmosphere.turbulenceModel ?? LINK_DESIGN_DEFAULTS.turbulenceModel) === 'gaussian-beam';
  target.includeScintillation = design.scintillation?.include ?? LINK_DESIGN_DEFAULTS.scintillationInclude;
  target.fadeProbability = design.scintillation?.probability ?? LINK_DESIGN_DEFAULTS.scintillationProbability;
  target.systemMarginDb = design.systemMarginDb ?? LINK_DESIGN_DEFAULTS.systemMarginDb;
  return target;
}

/**
 * Specific attenuation of the resolved design at a 2 % visibility.
 * @param design resolved design (model and wavelength)
 * @param visibility2PercentKm 2 % visibility [km], > 0
 * @returns γ [dB/km]
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001); Kruse et al. (1962).
 */
export function specificAttenuationDbPerKm(design: ResolvedDesign, visibility2PercentKm: number): number {
  if (design.fogNumeratorPerKm > 0) return (DB_PER_NEPER_POWER * design.fogNumeratorPerKm) / visibility2PercentKm;
  return DB_PER_NEPER_POWER * visibilityExtinctionPerKmFast(design.kruse, visibility2PercentKm, design.wavelengthM);
}

/**
 * Inverse of {@link specificAttenuationDbPerKm}: the 2 % visibility at which γ reaches the given value.
 * Closed form for Al Naboulsi (γ ∝ 1/V); bisection on log V for Kim/Kruse (λ ≥ 550 nm, clamped to 1 m…1000 km).
 * @param design resolved design
 * @param attenuationDbPerKm γ [dB/km], > 0
 * @returns 2 % visibility [km]
 * @see Kim & Korevaar, Proc. SPIE 4530 (2001); Al Naboulsi et al. (2004).
 */
export function visibility2PercentForAttenuationOfDesignKm(design: ResolvedDesign, attenuationDbPerKm: number): number {
  if (design.fogNumeratorPerKm > 0) return (DB_PER_NEPER_POWER * design.fogNumeratorPerKm) / attenuationDbPerKm;
  return visibility2PercentForAttenuationKm(design.kruse, design.wavelengthM, attenuationDbPerKm);
}

/**
 * Geometric loss of a centred Gaussian beam on a circular aperture of radius a with a central
 * obscuration of radius b: −10·log10[exp(−2b²/w²) − exp(−2a²/w²)], evaluated in the log domain as
 * 4.343·2b²/w² − 10·log10(1 − exp(−2(a² − b²)/w²)). It stays finite and accurate where the plain
 * difference cancels or underflows (a beam much smaller than the obscuration is blocked, not lost
 * to NaN).
 *
 * @param beamRadiusM 1/e² beam radius w [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @returns loss [dB], ≥ 0
 * @see Siegman A.E., "Lasers" (1986), §17.1 (encircled power of a TEM00 beam).
 */
export function centredGeometricLossDb(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number): number {
  const inverseSquare = 2 / (beamRadiusM * beamRadiusM);
  const openFraction = -Math.expm1(-inverseSquare * (apertureRadiusM - obscurationRadiusM) * (apertureRadiusM + obscurationRadiusM));
  if (obscurationRadiusM === 0) {
    return -10 * Math.log10(openFraction) + 0; // + 0: no −0 when the whole beam is captured
  }
  const shadowExponent = inverseSquare * obscurationRadiusM * obscurationRadiusM;
  return DB_PER_NEPER_POWER * shadowExponent - 10 * Math.log10(openFraction);
}


/** Numbers of one evaluation of the chain (all losses positive, in dB). */
export interface ChainResult {
  beamRadiusAtReceiverM: number;
  /** long-term beam radius W_LT [m]; W when spherical-wave or Cn² = 0 */
  longTermBeamRadiusM: number;
  /** radial rms beam wander [m]; 0 when spherical-wave or Cn² = 0 */
  beamWanderRmsM: number;
  /** 10·log10(C(0; W)/C(0; W_LT)) [dB]; 0 when spherical-wave or Cn² = 0, negative when a gain */
  turbulenceBeamSpreadLossDb: number;
  captureFraction: number;
  geometricLossDb: number;
  atmosphericLossDb: number;
  pointingLossDb: number;
  receivedPowerDbm: number;
  rytovVarianceSpherical: number;
  scintillationIndex: number;
  scintillationFadeMarginDb: number;
  linkMarginDb: number;
}

// The chain's result is written into one scratch object: the callers read it at once, and the hot
// paths (maxRange, the samplers, evaluateLink) then allocate nothing per evaluation.
const scratch: ChainResult = {
  beamRadiusAtReceiverM: 0,
  longTermBeamRadiusM: 0,
  beamWanderRmsM: 0,
  turbulenceBeamSpreadLossDb: 0,
  captureFraction: 0,
  geometricLossDb: 0,
  atmosphericLossDb: 0,
  pointingLossDb: 0,
  receivedPowerDbm: 0,
  rytovVarianceSpherical: 0,
  scintillationIndex: 0,
  scintillationFadeMarginDb: 0,
  linkMarginDb: 0,
};

/**
 * Evaluates P_rx = P_tx − L_tx − L_geo − γL − L_point − L_rx and M = P_rx − S − F_scint − M_system.
 *
 * @param design resolved design
 * @param rangeM path length [m], > 0
 * @param attenuationDbPerKm specific atmospheric attenuation γ [dB/km], ≥ 0
 * @param includeScintillation whether to subtract the fade margin
 * @param wanderWanted whether to compute the (informational) beam wander when the fade margin is off
 * @returns the chain's numbers, in a shared object that the next call overwrites (copy what you keep)
 * @see METHODS.md §10.1; the sources of each term are in budget-terms.ts.
 */
export function evaluateChain(design: ResolvedDesign, rangeM: number, attenuationDbPerKm: number, includeScintillation: boolean, wanderWanted = false): ChainResult {
  const beamRadiusM = launchBeamRadiusAtRangeM(design.wavelengthM, design.apertureBeamRadiusM, design.halfAngleDivergenceRad, design.m2, rangeM);
  const apertureRadiusM = design.apertureDiameterM / 2;
  const geometricLossDb = centredGeometricLossDb(beamRadiusM, apertureRadiusM, apertureRadiusM * design.obscurationRatio);
  const captureFraction = annularCaptureFractionStable(beamRadiusM, apertureRadiusM, apertureRadiusM * design.obscurationRatio);
  const atmosphericLossDb = (attenuationDbPerKm * rangeM) / 1000;
  const obscurationRadiusM = apertureRadiusM * design.obscurationRatio;
  const jitterM = design.jitterSigmaPerAxisRad * rangeM;
  const biasM = design.staticErrorRad * rangeM;
  // Gaussian-beam model: the long-term beam (wander inside it) replaces W for capture and pointing.
  let captureBeamRadiusM = beamRadiusM;
  let captureLossDb = geometricLossDb;
  let turbulenceBeamSpreadLossDb = 0;
  let beamWanderRmsM = 0;
  let beam: BeamWaveAtReceiver | undefined;
  if (design.gaussianBeam && design.cn2 > 0) {
    beam = beamWaveAtReceiverFast(design.wavelengthM, design.apertureBeamRadiusM, design.halfAngleDivergenceRad, design.m2, rangeM, design.cn2, beamRadiusM, includeScintillation || wanderWanted);
    captureBeamRadiusM = beam.longTermBeamRadiusM;
    beamWanderRmsM = beam.beamWanderRmsM;
    captureLossDb = centredGeometricLossDb(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM);
    turbulenceBeamSpreadLossDb = captureLossDb - geometricLossDb;
  }
  // Exact capture of the annular aperture under the Rician error, relative to the centred capture
  // (negative when an offset puts more power on an obscured aperture). Mean mode:
  // −10·log10(E[C]/C(0)) with 10·log10 C(0) = −captureLossDb already at hand.
  const pointingLossDb = Number.isNaN(design.pointingOutageAngleRad)
    ? jitterM === 0 && biasM === 0
      ? 0
      : -DB_PER_NEPER_POWER * logMeanAnnularCapture(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM, jitterM, biasM) - captureLossDb + 0
    : exactOutagePointingLossAtRadiusDb(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM, jitterM, biasM, design.pointingOutageProbability, design.pointingOutageAngleRad * rangeM);
  const receivedPowerDbm =
    design.powerDbm - design.transmitOpticsLossDb - geometricLossDb - turbulenceBeamSpreadLossDb - atmosphericLossDb - pointingLossDb - design.receiveOpticsLossDb;
  let rytovVarianceSpherical = 0;
  let scintillationIndex = 0;
  let scintillationFadeMarginDb = 0;
  if (includeScintillation && design.cn2 > 0) {
    rytovVarianceSpherical = rytovVarianceFast(design.cn2, design.wavelengthM, rangeM, true);
    if (beam !== undefined) {
      // Beam wave, aperture averaged, off axis by the bias and the wander (turbulence/beam-wave.ts).
      const wave = beamWaveScintillationFast(design.wavelengthM, rangeM, design.apertureDiameterM, design.obscurationRatio, beam, beamRadiusM, biasM, design.fadeProbability);
      scintillationIndex = wave.scintillationIndex;
      scintillationFadeMarginDb = wave.fadeMarginDb;
    } else {
    // Spherical wave, aperture averaged, gamma-gamma at p (METHODS.md §6.2, §6.6, §6.9): divergent FSO
    // beams have Θ ≈ 0 at the receiver and behave as spherical waves.
      scintillationIndex = apertureAveragedScintillationIndexFast(design.wavelengthM, rangeM, design.cn2, design.apertureDiameterM);
      scintillationFadeMarginDb = apertureAveragedFadeMarginDb(design.wavelengthM, rangeM, design.cn2, design.apertureDiameterM, design.fadeProbability);
    }
  }
  scratch.beamRadiusAtReceiverM = beamRadiusM;
  scratch.longTermBeamRadiusM = captureBeamRadiusM;
  scratch.beamWanderRmsM = beamWanderRmsM;
  scratch.turbulenceBeamSpreadLossDb = turbulenceBeamSpreadLossDb;
  scratch.captureFraction = captureFraction;
  scratch.geometricLossDb = geometricLossDb;
  scratch.atmosphericLossDb = atmosphericLossDb;
  scratch.pointingLossDb = pointingLossDb;
  scratch.receivedPowerDbm = receivedPowerDbm;
  scratch.rytovVarianceSpherical = rytovVarianceSpherical;
  scratch.scintillationIndex = scintillationIndex;
  scratch.scintillationFadeMarginDb = scintillationFadeMarginDb;
  scratch.linkMarginDb = receivedPowerDbm - design.sensitivityDbm - scintillationFadeMarginDb - design.systemMarginDb;
  return scratch;
}
