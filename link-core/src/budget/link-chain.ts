/**
 * The arithmetic of the link budget (METHODS.md §10.1), allocation-light and without validation, shared by
 * evaluateLink, maxRangeM, the availability routines and the chart samplers. A design is first
 * resolved into plain numbers (defaults applied with `??`, no zod parse), then the chain is
 * evaluated for any range and specific attenuation.
 */
import { alNaboulsiFogExtinctionPerKm } from '../atmosphere/fog-and-precipitation.js';
import { VISIBILITY_2_PERCENT_PER_MOR, VISIBILITY_REFERENCE_WAVELENGTH_M, visibility2PercentForAttenuationKm, visibilityExtinctionPerKmOfLogWavelength } from '../atmosphere/visibility-attenuation.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { annularCaptureFractionStable, logMeanAnnularCapture } from '../capture/capture.js';
import { exactOutagePointingLossAtRadiusDb, ricianOutageRadius } from '../pointing/exact-pointing.js';
import { LINK_DESIGN_DEFAULTS, type AtmosphereModel, type LinkDesignInput } from '../schemas/link-design.schema.js';
import { apertureAveragedFadeMarginDb, apertureAveragedScintillationIndexFast } from '../turbulence/scintillation.js';
import { normalQuantileOf } from '../numeric/normal.js';
import { rytovVarianceFast } from '../turbulence/rytov.js';
import { beamWanderRmsFastM, beamWaveAtReceiverFast, beamWaveScintillationFast, longTermBeamRadiusFastM } from '../turbulence/beam-wave.js';
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
  /** ln(λ/550 nm), for the wavelength exponent of Kim's and Kruse's models */
  logWavelengthRatio: number;
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
export function outageAngleRad(jitterSigmaPerAxisRad: number, staticErrorRad: number, outageProbability: number): number {
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
export function alNaboulsiNumerator(model: AtmosphereModel, wavelengthM: number): number {
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
    logWavelengthRatio: 0,
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
  target.logWavelengthRatio = Math.log(transmitter.wavelengthM / VISIBILITY_REFERENCE_WAVELENGTH_M);
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
  return specificAttenuationOfModelDbPerKm(design.fogNumeratorPerKm, design.kruse, design.logWavelengthRatio, visibility2PercentKm);
}

/**
 * {@link specificAttenuationDbPerKm} from the model's numbers (the batch kernel's columns).
 * @param fogNumeratorPerKm Al Naboulsi's c(λ) of β = c/V, or 0 for Kim/Kruse
 * @param kruse Kruse's exponent (Kim's otherwise)
 * @param logWavelengthRatio ln(λ/550 nm)
 * @param visibility2PercentKm 2 % visibility [km], > 0
 * @returns γ [dB/km]
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001); Kruse et al. (1962); Al Naboulsi et al. (2004).
 */
export function specificAttenuationOfModelDbPerKm(fogNumeratorPerKm: number, kruse: boolean, logWavelengthRatio: number, visibility2PercentKm: number): number {
  if (fogNumeratorPerKm > 0) return (DB_PER_NEPER_POWER * fogNumeratorPerKm) / visibility2PercentKm;
  return DB_PER_NEPER_POWER * visibilityExtinctionPerKmOfLogWavelength(kruse, visibility2PercentKm, logWavelengthRatio);
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
  /** radial rms beam wander [m]; 0 when spherical-wave or Cn² = 0, or when not asked for */
  beamWanderRmsM: number;
  /** 10·log10(C(0; W)/C(0; W_LT)) [dB]; 0 when spherical-wave or Cn² = 0, negative when a gain; NaN at detail 'margin' */
  turbulenceBeamSpreadLossDb: number;
  /** centred capture C(0; W); NaN at detail 'margin' */
  captureFraction: number;
  /** NaN at detail 'margin' */
  geometricLossDb: number;
  atmosphericLossDb: number;
  /** NaN at detail 'margin' */
  pointingLossDb: number;
  /** the three terms the capture and the pointing make together: L_geo + spread + L_point [dB] (every detail) */
  captureAndPointingLossDb: number;
  receivedPowerDbm: number;
  rytovVarianceSpherical: number;
  scintillationIndex: number;
  scintillationFadeMarginDb: number;
  linkMarginDb: number;
}

/**
 * How much of the chain to compute: `'margin'` the margin, received power, beam radii and fade
 * margin only (the capture and pointing terms are then summed in one logarithm, the rest is NaN);
 * `'terms'` every term as well; `'report'` also the informational beam wander.
 */
export type ChainDetail = 'margin' | 'terms' | 'report';

/** A chain result to write into (each caller owns its own; nothing is shared between calls). */
export function newChainResult(): ChainResult {
  return {
    beamRadiusAtReceiverM: Number.NaN,
    longTermBeamRadiusM: Number.NaN,
    beamWanderRmsM: Number.NaN,
    turbulenceBeamSpreadLossDb: Number.NaN,
    captureFraction: Number.NaN,
    geometricLossDb: Number.NaN,
    atmosphericLossDb: Number.NaN,
    pointingLossDb: Number.NaN,
    captureAndPointingLossDb: Number.NaN,
    receivedPowerDbm: Number.NaN,
    rytovVarianceSpherical: Number.NaN,
    scintillationIndex: Number.NaN,
    scintillationFadeMarginDb: Number.NaN,
    linkMarginDb: Number.NaN,
  };
}

/**
 * Evaluates P_rx = P_tx − L_tx − L_geo − γL − L_point − L_rx and M = P_rx − S − F_scint − M_system
 * into a new result (every term; the beam wander when asked for).
 *
 * @param design resolved design
 * @param rangeM path length [m], > 0
 * @param attenuationDbPerKm specific atmospheric attenuation γ [dB/km], ≥ 0
 * @param includeScintillation whether to subtract the fade margin
 * @param wanderWanted whether to compute the (informational) beam wander when the fade margin is off
 * @returns the chain's numbers (a new object)
 * @see METHODS.md §10.1; the sources of each term are in budget-terms.ts.
 */
export function evaluateChain(design: ResolvedDesign, rangeM: number, attenuationDbPerKm: number, includeScintillation: boolean, wanderWanted = false): ChainResult {
  return evaluateChainInto(newChainResult(), design, rangeM, attenuationDbPerKm, includeScintillation, wanderWanted ? 'report' : 'terms');
}

/**
 * The chain of {@link evaluateChain} written into a result the caller owns, to the detail asked for
 * (the hot paths reuse one result and ask for no more than they read).
 *
 * The capture and pointing terms enter the margin only through their sum, which in mean mode is
 * −10·log10 E[C(R; W_LT)]: the geometric loss at W, the spread 10·log10(C(0; W)/C(0; W_LT)) and the
 * pointing loss −10·log10(E[C]/C(0; W_LT)) telescope. The chain computes the margin from that sum
 * at every detail; `'margin'` skips the split into the three terms (which sum to it to rounding,
 * ~1e-14 dB).
 *
 * @param out the result to write
 * @param design resolved design
 * @param rangeM path length [m], > 0
 * @param attenuationDbPerKm specific atmospheric attenuation γ [dB/km], ≥ 0
 * @param includeScintillation whether to subtract the fade margin
 * @param detail what to compute (see {@link ChainDetail})
 * @returns `out`
 * @see METHODS.md §10.1; the sources of each term are in budget-terms.ts.
 */
export function evaluateChainInto(out: ChainResult, design: ResolvedDesign, rangeM: number, attenuationDbPerKm: number, includeScintillation: boolean, detail: ChainDetail): ChainResult {
  const beamRadiusM = launchBeamRadiusAtRangeM(design.wavelengthM, design.apertureBeamRadiusM, design.halfAngleDivergenceRad, design.m2, rangeM);
  const apertureRadiusM = design.apertureDiameterM / 2;
  const obscurationRadiusM = apertureRadiusM * design.obscurationRatio;
  const jitterM = design.jitterSigmaPerAxisRad * rangeM;
  const biasM = design.staticErrorRad * rangeM;
  const beamWave = design.gaussianBeam && design.cn2 > 0;
  // Gaussian-beam model: the long-term beam (wander inside it) replaces W for capture and pointing.
  const captureBeamRadiusM = beamWave
    ? longTermBeamRadiusFastM(design.wavelengthM, design.apertureBeamRadiusM, design.halfAngleDivergenceRad, design.m2, rangeM, design.cn2, beamRadiusM)
    : beamRadiusM;
  const meanPointing = Number.isNaN(design.pointingOutageAngleRad);
  const atmosphericLossDb = (attenuationDbPerKm * rangeM) / 1000;
  // The capture and pointing terms enter the margin only through their sum, computed the same way at
  // every detail, so that the batch kernel's margins equal evaluateLink's to the last bit: in mean
  // mode −10·log10 E[C(R; W_LT)] (the centred capture loss where there is no error at all), in
  // outage mode the centred capture loss plus the loss at the outage quantile.
  let captureLossDb = Number.NaN;
  let outagePointingLossDb = Number.NaN;
  let captureAndPointingLossDb: number;
  if (meanPointing && !(jitterM === 0 && biasM === 0)) {
    captureAndPointingLossDb = -DB_PER_NEPER_POWER * logMeanAnnularCapture(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM, jitterM, biasM);
  } else {
    captureLossDb = centredGeometricLossDb(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM);
    if (meanPointing) captureAndPointingLossDb = captureLossDb;
    else {
      outagePointingLossDb = exactOutagePointingLossAtRadiusDb(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM, jitterM, biasM, design.pointingOutageProbability, design.pointingOutageAngleRad * rangeM);
      captureAndPointingLossDb = captureLossDb + outagePointingLossDb;
    }
  }
  out.captureAndPointingLossDb = captureAndPointingLossDb;
  if (detail === 'margin') {
    out.geometricLossDb = Number.NaN;
    out.turbulenceBeamSpreadLossDb = Number.NaN;
    out.pointingLossDb = Number.NaN;
    out.captureFraction = Number.NaN;
  } else {
    // The split: geometric loss at W, spread to W_LT, and the pointing term relative to C(0; W_LT)
    // (negative when an offset puts more power on an obscured aperture).
    const geometricLossDb = centredGeometricLossDb(beamRadiusM, apertureRadiusM, obscurationRadiusM);
    if (Number.isNaN(captureLossDb)) captureLossDb = beamWave ? centredGeometricLossDb(captureBeamRadiusM, apertureRadiusM, obscurationRadiusM) : geometricLossDb;
    out.geometricLossDb = geometricLossDb;
    out.turbulenceBeamSpreadLossDb = beamWave ? captureLossDb - geometricLossDb : 0;
    out.pointingLossDb = meanPointing ? (jitterM === 0 && biasM === 0 ? 0 : captureAndPointingLossDb - captureLossDb + 0) : outagePointingLossDb;
    out.captureFraction = annularCaptureFractionStable(beamRadiusM, apertureRadiusM, obscurationRadiusM);
  }
  const receivedPowerDbm = design.powerDbm - design.transmitOpticsLossDb - captureAndPointingLossDb - atmosphericLossDb - design.receiveOpticsLossDb;
  let rytovVarianceSpherical = 0;
  let scintillationIndex = 0;
  let scintillationFadeMarginDb = 0;
  let beamWanderRmsM = 0;
  if (includeScintillation && design.cn2 > 0) {
    if (detail !== 'margin') rytovVarianceSpherical = rytovVarianceFast(design.cn2, design.wavelengthM, rangeM, true);
    if (beamWave) {
      // Beam wave, aperture averaged, off axis by the bias and the wander (turbulence/beam-wave.ts).
      const beam = beamWaveAtReceiverFast(design.wavelengthM, design.apertureBeamRadiusM, design.halfAngleDivergenceRad, design.m2, rangeM, design.cn2, beamRadiusM, true);
      const wave = beamWaveScintillationFast(design.wavelengthM, rangeM, design.apertureDiameterM, design.obscurationRatio, beam, beamRadiusM, biasM, design.fadeProbability);
      beamWanderRmsM = beam.beamWanderRmsM;
      scintillationIndex = wave.scintillationIndex;
      scintillationFadeMarginDb = wave.fadeMarginDb;
    } else {
      // Spherical wave, aperture averaged, gamma-gamma at p (METHODS.md §6.2, §6.6, §6.9): divergent FSO
      // beams have Θ ≈ 0 at the receiver and behave as spherical waves.
      if (detail !== 'margin') scintillationIndex = apertureAveragedScintillationIndexFast(design.wavelengthM, rangeM, design.cn2, design.apertureDiameterM);
      scintillationFadeMarginDb = apertureAveragedFadeMarginDb(design.wavelengthM, rangeM, design.cn2, design.apertureDiameterM, design.fadeProbability);
    }
  } else if (detail === 'report' && beamWave) {
    beamWanderRmsM = beamWanderRmsFastM(design.wavelengthM, design.apertureBeamRadiusM, design.halfAngleDivergenceRad, design.m2, rangeM, design.cn2);
  }
  out.beamRadiusAtReceiverM = beamRadiusM;
  out.longTermBeamRadiusM = captureBeamRadiusM;
  out.beamWanderRmsM = beamWanderRmsM;
  out.atmosphericLossDb = atmosphericLossDb;
  out.receivedPowerDbm = receivedPowerDbm;
  out.rytovVarianceSpherical = rytovVarianceSpherical;
  out.scintillationIndex = scintillationIndex;
  out.scintillationFadeMarginDb = scintillationFadeMarginDb;
  out.linkMarginDb = receivedPowerDbm - design.sensitivityDbm - scintillationFadeMarginDb - design.systemMarginDb;
  return out;
}
