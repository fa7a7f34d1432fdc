/**
 * The Gaussian-beam (beam-wave) turbulence model of the budget: the launched beam's output-plane
 * parameters Θ, Λ at the receiver, its long-term radius W_LT (spreading, with beam wander inside
 * it), the rms beam wander for information, and the aperture-averaged beam-wave scintillation
 * (on and off the beam axis) with the gamma-gamma fade margin. The budget's hot path uses the
 * plain-number forms (long-term radius, wander); the object forms return a new object per call.
 */
import { gaussianBeamRytovRatio } from './gaussian-beam-scintillation.js';
import { fadeMarginGammaGammaDb } from './fade-statistics.js';

/** Numbers of the beam wave at the receiver. */
export interface BeamWaveAtReceiver {
  /** Θ = Θ0/(Θ0² + Λ0²): 0 spherical-wave-like, 1 plane-wave-like. */
  theta: number;
  /** Λ = Λ0/(Θ0² + Λ0²), the output-plane Fresnel ratio. */
  lambda: number;
  /** Plane-wave Rytov variance σ_R² = 1.23·Cn²·k^(7/6)·L^(11/6). */
  planeRytovVariance: number;
  /** Long-term 1/e² radius W_LT [m] (≥ W; W when Cn² = 0). */
  longTermBeamRadiusM: number;
  /** Radial rms beam wander √⟨r_c²⟩ [m], for information (contained in W_LT). */
  beamWanderRmsM: number;
}

/** Exponent of the smooth maximum that joins the weak and strong long-term spreads. */
export const LONG_TERM_SPREAD_BRIDGE_EXPONENT = 6;
const STRONG_OVER_WEAK_SIXTH = Math.pow(1.63 / 1.33, LONG_TERM_SPREAD_BRIDGE_EXPONENT);

/**
 * 2F1(1/3, 1; 4; z) for z ≤ 1 (the beam-wander factor), by Euler's integral
 * 3∫0^1 (1 − t)²(1 − z t)^(−1/3) dt done in closed form, or its series near z = 0 where the closed
 * form cancels.
 */
function wanderHypergeometric(z: number): number {
  if (Math.abs(z) < 0.1) {
    // Σ (1/3)_n (1)_n/((4)_n n!) zⁿ = Σ (1/3)_n/(4)_n zⁿ
    let term = 1;
    let sum = 1;
    for (let n = 0; n < 40; n++) {
      term *= ((1 / 3 + n) / (4 + n)) * z;
      sum += term;
      if (Math.abs(term) < 1e-17 * sum) break;
    }
    return sum;
  }
  // With s = 1 − z t and c = 1 − z: 3/z³ · ∫_c^1 (s − c)² s^(−1/3) ds.
  const c = 1 - z;
  const antiderivative = (s: number): number => {
    const cube = Math.cbrt(s);
    const s23 = cube * cube;
    return s23 * ((3 / 8) * s * s - (6 / 5) * c * s + (3 / 2) * c * c);
  };
  // the antiderivative at s = 1 needs no root
  const atOne = 3 / 8 - (6 / 5) * c + (3 / 2) * c * c;
  return (3 / (z * z * z)) * (atOne - antiderivative(c));
}

/**
 * The beam wave at the receiver for a beam launched with 1/e² radius W0 at the aperture, a
 * phase-front curvature from the datasheet divergence (collimated when the divergence is at or
 * below the diffraction limit) and beam quality M².
 *
 * - Θ0 = 1 − L/F0 = 1 + L·√(θ² − θd²)/W0 and Λ0 = θd·L/W0 = 2M²L/(kW0²): M² enters through the
 *   embedded-Gaussian diffraction angle θd = M²λ/(πW0), so that W0²(Θ0² + Λ0²) is the free-space W²
 *   of the launch (Siegman's M² substitution λ → M²λ).
 * - W_LT = W·√(1 + T): weak T_w = 1.33·σ_R²·Λ^(5/6), strong T_s = 1.63·σ_R^(12/5)·Λ, joined by the
 *   smooth maximum T = (T_w⁶ + T_s⁶)^(1/6) (our bridge: each form where it is the larger, which is
 *   its own regime; continuous with all derivatives, at most 12 % above either where they cross).
 * - ⟨r_c²⟩ = 2.42·Cn²·L³·W0^(−1/3)·2F1(1/3, 1; 4; 1 − |Θ0|) (weak turbulence, infinite outer scale).
 *
 * @param wavelengthM λ [m], > 0
 * @param apertureBeamRadiusM W0 [m], > 0
 * @param halfAngleDivergenceRad datasheet half-angle θ [rad], ≥ 0
 * @param m2 M² ≥ 1
 * @param rangeM L [m], > 0
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @param beamRadiusM free-space W(L) [m] (as computed by the launch)
 * @param withWander whether to compute the wander (0 otherwise; the margin without scintillation does not need it)
 * @returns the beam's numbers (a new object)
 * @see Andrews L.C., Phillips R.L., "Laser Beam Propagation through Random Media", 2nd ed., SPIE
 *   Press (2005): ch. 4 (Θ0, Λ0, Θ, Λ), ch. 6 (long-term spread, weak 1.33 and strong 1.63; beam
 *   wander with the 2F1 factor) [equation numbers and coefficients from memory; the 1.33 is checked
 *   against our own integration of the Kolmogorov-spectrum integral in beam-wave.test.ts];
 *   Siegman A.E., "New developments in laser resonators", Proc. SPIE 1224 (1990) (M² embedded Gaussian).
 */
export function beamWaveAtReceiverFast(
  wavelengthM: number,
  apertureBeamRadiusM: number,
  halfAngleDivergenceRad: number,
  m2: number,
  rangeM: number,
  cn2: number,
  beamRadiusM: number,
  withWander: boolean,
): BeamWaveAtReceiver {
  const theta0 = launchTheta0(wavelengthM, apertureBeamRadiusM, halfAngleDivergenceRad, m2, rangeM);
  const lambda0 = launchLambda0(wavelengthM, apertureBeamRadiusM, m2, rangeM);
  const norm = theta0 * theta0 + lambda0 * lambda0;
  const lambda = lambda0 / norm;
  const planeRytovVariance = cn2 === 0 ? 0 : planeRytovVarianceOfPath(cn2, wavelengthM, rangeM);
  return {
    theta: theta0 / norm,
    lambda,
    planeRytovVariance,
    longTermBeamRadiusM: cn2 === 0 ? beamRadiusM : beamRadiusM * Math.sqrt(1 + longTermSpread(planeRytovVariance, lambda)),
    beamWanderRmsM: withWander && cn2 !== 0 ? beamWanderRmsOfLaunch(cn2, apertureBeamRadiusM, rangeM, theta0) : 0,
  };
}

/** Θ0 = 1 − L/F0 of the launched beam: 1 + L·√(θ² − θd²)/W0 when defocused, 1 when collimated. */
function launchTheta0(wavelengthM: number, apertureBeamRadiusM: number, halfAngleDivergenceRad: number, m2: number, rangeM: number): number {
  const diffractionRad = (m2 * wavelengthM) / (Math.PI * apertureBeamRadiusM);
  const excess = halfAngleDivergenceRad * halfAngleDivergenceRad - diffractionRad * diffractionRad;
  return excess > 0 ? 1 + (rangeM * Math.sqrt(excess)) / apertureBeamRadiusM : 1;
}

/** Λ0 = θd·L/W0 = 2M²L/(kW0²) of the launched beam. */
function launchLambda0(wavelengthM: number, apertureBeamRadiusM: number, m2: number, rangeM: number): number {
  return (((m2 * wavelengthM) / (Math.PI * apertureBeamRadiusM)) * rangeM) / apertureBeamRadiusM;
}

/**
 * σ_R² = 1.23·Cn²·k^(7/6)·L^(11/6), written as k·L²·(k/L)^(1/6) with the sixth root as
 * cbrt(sqrt(·)) (cheaper than Math.pow on the hot path).
 */
function planeRytovVarianceOfPath(cn2: number, wavelengthM: number, rangeM: number): number {
  const k = (2 * Math.PI) / wavelengthM;
  return 1.23 * cn2 * k * rangeM * rangeM * Math.cbrt(Math.sqrt(k / rangeM));
}

/**
 * T = (T_w⁶ + T_s⁶)^(1/6) = T_w·(1 + (T_s/T_w)⁶)^(1/6), (T_s/T_w)⁶ = (1.63/1.33)⁶·σ_R^(12/5)·Λ, with
 * Λ^(5/6) = Λ/Λ^(1/6) and σ_R^(12/5) = exp(1.2·ln σ_R²) (Math.pow costs several times more here).
 */
function longTermSpread(planeRytovVariance: number, lambda: number): number {
  const weak = lambda === 0 ? 0 : (1.33 * planeRytovVariance * lambda) / Math.cbrt(Math.sqrt(lambda));
  return weak === 0 ? 0 : weak * Math.cbrt(Math.sqrt(1 + STRONG_OVER_WEAK_SIXTH * Math.exp(1.2 * Math.log(planeRytovVariance)) * lambda));
}

/** √⟨r_c²⟩ = √(2.42·Cn²·L³·W0^(−1/3)·2F1(1/3, 1; 4; 1 − |Θ0|)) [m]. */
function beamWanderRmsOfLaunch(cn2: number, apertureBeamRadiusM: number, rangeM: number, theta0: number): number {
  return Math.sqrt(2.42 * cn2 * rangeM * rangeM * rangeM * (1 / Math.cbrt(apertureBeamRadiusM)) * wanderHypergeometric(1 - theta0));
}

/**
 * The long-term beam radius W_LT of {@link beamWaveAtReceiverFast} as a plain number (the budget's
 * hot path: nothing allocated).
 *
 * @param wavelengthM λ [m], > 0
 * @param apertureBeamRadiusM W0 [m], > 0
 * @param halfAngleDivergenceRad datasheet half-angle θ [rad], ≥ 0
 * @param m2 M² ≥ 1
 * @param rangeM L [m], > 0
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @param beamRadiusM free-space W(L) [m] (as computed by the launch)
 * @returns W_LT [m], ≥ W; W when Cn² = 0
 * @see {@link beamWaveAtReceiverFast}; Andrews & Phillips (2005), ch. 6.
 */
export function longTermBeamRadiusFastM(
  wavelengthM: number,
  apertureBeamRadiusM: number,
  halfAngleDivergenceRad: number,
  m2: number,
  rangeM: number,
  cn2: number,
  beamRadiusM: number,
): number {
  if (cn2 === 0) return beamRadiusM;
  const theta0 = launchTheta0(wavelengthM, apertureBeamRadiusM, halfAngleDivergenceRad, m2, rangeM);
  const lambda0 = launchLambda0(wavelengthM, apertureBeamRadiusM, m2, rangeM);
  const lambda = lambda0 / (theta0 * theta0 + lambda0 * lambda0);
  return beamRadiusM * Math.sqrt(1 + longTermSpread(planeRytovVarianceOfPath(cn2, wavelengthM, rangeM), lambda));
}

/**
 * The radial rms beam wander of {@link beamWaveAtReceiverFast} as a plain number.
 *
 * @param wavelengthM λ [m], > 0
 * @param apertureBeamRadiusM W0 [m], > 0
 * @param halfAngleDivergenceRad datasheet half-angle θ [rad], ≥ 0
 * @param m2 M² ≥ 1
 * @param rangeM L [m], > 0
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @returns √⟨r_c²⟩ [m], ≥ 0; 0 when Cn² = 0
 * @see {@link beamWaveAtReceiverFast}; Andrews & Phillips (2005), ch. 6.
 */
export function beamWanderRmsFastM(wavelengthM: number, apertureBeamRadiusM: number, halfAngleDivergenceRad: number, m2: number, rangeM: number, cn2: number): number {
  if (cn2 === 0) return 0;
  return beamWanderRmsOfLaunch(cn2, apertureBeamRadiusM, rangeM, launchTheta0(wavelengthM, apertureBeamRadiusM, halfAngleDivergenceRad, m2, rangeM));
}

/**
 * Aperture-averaged beam-wave scintillation index and gamma-gamma fade margin, all regimes, with the
 * receiver off the beam axis by r (static bias and beam wander).
 *
 * - On axis: σ_B² = σ_R²·ratio(Θ, Λ) (exact hypergeometric form of the Gaussian-beam Rytov variance).
 * - Off axis: the weak index gains the radial term 4.42·σ_R²·Λ^(5/6)·r²/W_LT², r² = ν² + ⟨r_c²⟩
 *   (the bias and the wander put the receiver off the instantaneous axis; measured against the
 *   long-term radius that contains the wander).
 * - All regimes and aperture averaging: the large- and small-scale log variances of the
 *   spherical-wave forms with that weak index σ1² = σ_B² + radial term in place of β0² (so the
 *   off-axis part saturates with the rest; ours), 0.56(1 + Θ) in the large-scale saturation term
 *   (Andrews & Phillips' Gaussian-beam form), and the large-scale aperture coefficient taken between
 *   the spherical (0.18, Θ = 0) and plane-wave (0.65, Θ = 1) values linearly in Θ (our
 *   interpolation; exact in both limits). The obscured aperture averages as the disc of equal area
 *   (conservative, ours: an annulus spans more correlation widths than that disc).
 * - Fade margin: gamma-gamma at p from α = 1/(e^(σ_lnX²) − 1), β = 1/(e^(σ_lnY²) − 1).
 *
 * @param wavelengthM λ [m], > 0
 * @param rangeM L [m], > 0
 * @param apertureDiameterM D [m], > 0
 * @param obscurationRatio ε = b/a in [0, 1)
 * @param beam the numbers from {@link beamWaveAtReceiverFast} for this beam and path
 * @param beamRadiusM free-space W [m]
 * @param offAxisOffsetM static bias at the receiver ν [m], ≥ 0
 * @param probability fade probability p in (0, 1), or NaN to skip the margin
 * @returns σ_I²(D) in `scintillationIndex`, the margin [dB] in `fadeMarginDb` and the gamma-gamma
 *   α, β (Infinity without turbulence), in a new object
 * @see Andrews & Phillips (2005), ch. 8 (σ_B², off-axis radial term 4.42σ_R²Λ^(5/6)r²/W²), ch. 9–10
 *   (all-regime and aperture-averaged log variances) [from memory]; Al-Habash, Andrews & Phillips,
 *   Opt. Eng. 40(8), 1554–1562 (2001) (gamma-gamma).
 */
export function beamWaveScintillationFast(
  wavelengthM: number,
  rangeM: number,
  apertureDiameterM: number,
  obscurationRatio: number,
  beam: BeamWaveAtReceiver,
  beamRadiusM: number,
  offAxisOffsetM: number,
  probability: number,
): { scintillationIndex: number; fadeMarginDb: number; alpha: number; beta: number } {
  const rytov = beam.planeRytovVariance;
  if (rytov === 0) return { scintillationIndex: 0, fadeMarginDb: 0, alpha: Infinity, beta: Infinity };
  const onAxis = rytov * gaussianBeamRytovRatio(beam.theta, beam.lambda);
  // Off axis by the bias and the wander, measured against the long-term beam that contains the wander.
  const longTerm = beam.longTermBeamRadiusM;
  const offsetOverBeam = (offAxisOffsetM * offAxisOffsetM + beam.beamWanderRmsM * beam.beamWanderRmsM) / (longTerm * longTerm);
  const weakIndex = onAxis + 4.42 * rytov * Math.pow(beam.lambda, 5 / 6) * offsetOverBeam;
  const apertureD2 = (((2 * Math.PI) / wavelengthM) * apertureDiameterM * apertureDiameterM * (1 - obscurationRatio * obscurationRatio)) / (4 * rangeM);
  const s125 = Math.pow(weakIndex, 1.2);
  const largeDenominator = Math.pow(1 + (0.18 + 0.47 * beam.theta) * apertureD2 + 0.56 * (1 + beam.theta) * s125, 7 / 6);
  const largeScale = (0.49 * weakIndex) / largeDenominator;
  const smallScale = (0.51 * weakIndex * Math.pow(1 + 0.69 * s125, -5 / 6)) / (1 + 0.9 * apertureD2 + 0.62 * apertureD2 * s125);
  const alpha = 1 / Math.expm1(largeScale);
  const beta = 1 / Math.expm1(smallScale);
  return {
    scintillationIndex: Math.expm1(largeScale + smallScale),
    fadeMarginDb: Number.isNaN(probability) ? 0 : fadeMarginGammaGammaDb(alpha, beta, probability),
    alpha,
    beta,
  };
}
