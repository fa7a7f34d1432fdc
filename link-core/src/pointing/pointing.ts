/**
 * Pointing error at the receiver plane: a static offset ν plus zero-mean circular Gaussian jitter of
 * per-axis standard deviation σ (both lateral, in metres at the receiver: angle × range). The radial
 * error R is Rayleigh (ν = 0) or Rician (ν > 0): P(R > r) = Q1(ν/σ, r/σ).
 */
import { marcumQ1 } from '../numeric/marcum-q.js';
import { findRootBrent } from '../numeric/root-finding.js';
import { DB_PER_NATURAL_LOG_POWER } from '../units/constants.js';
import { faridHranilovicCapture } from '../capture/capture.js';

/** Input of {@link pointingOutageProbability}. */
export interface PointingOutageInput {
  /** Per-axis jitter standard deviation σ at the receiver [m], ≥ 0. */
  jitterSigmaPerAxisM: number;
  /** Static (bias) offset ν at the receiver [m], ≥ 0 (default 0). */
  staticOffsetM?: number;
  /** Allowed radial error r [m], ≥ 0. */
  thresholdRadiusM: number;
}

/**
 * Probability that the radial pointing error exceeds a threshold radius:
 * exp(−r²/(2σ²)) without bias (Rayleigh), Q1(ν/σ, r/σ) with bias (Rician).
 *
 * @param input σ [m] ≥ 0, ν [m] ≥ 0, r [m] ≥ 0
 * @returns probability in [0, 1]; with σ = 0 the error is deterministic (1 if ν > r, else 0)
 * @throws RangeError naming the field when an input is negative or not finite
 * @see Marcum J.I., IRE Trans. Inf. Theory IT-6(2), 59–267 (1960) (Q1);
 *   Rice S.O., "Mathematical analysis of random noise", Bell Syst. Tech. J. 24, 46–156 (1945) (Rician pdf).
 */
export function pointingOutageProbability(input: PointingOutageInput): number {
  const sigma = input.jitterSigmaPerAxisM;
  const offset = input.staticOffsetM ?? 0;
  const threshold = input.thresholdRadiusM;
  if (!(sigma >= 0) || !Number.isFinite(sigma)) throw new RangeError('jitterSigmaPerAxisM must be a finite number ≥ 0');
  if (!(offset >= 0) || !Number.isFinite(offset)) throw new RangeError('staticOffsetM must be a finite number ≥ 0');
  if (!(threshold >= 0) || !Number.isFinite(threshold)) throw new RangeError('thresholdRadiusM must be a finite number ≥ 0');
  if (sigma === 0) return offset > threshold ? 1 : 0;
  return marcumQ1(offset / sigma, threshold / sigma);
}

/**
 * Threshold radius over σ exceeded with probability p by Rayleigh jitter: sqrt(−2 ln p)
 * (3.035 at 1e-2, 3.717 at 1e-3, 5.257 at 1e-6).
 *
 * @param outageProbability p in (0, 1)
 * @returns r/σ (dimensionless), > 0
 * @see inverse of the Rayleigh survival function exp(−r²/(2σ²)).
 */
export function rayleighThresholdOverSigma(outageProbability: number): number {
  return Math.sqrt(-2 * Math.log(outageProbability));
}

/**
 * Threshold radius over σ exceeded with probability p by a Rician radial error with offset ν/σ:
 * solves Q1(ν/σ, r/σ) = p by Brent's method on ln Q1 (closed form when ν = 0).
 *
 * @param input outageProbability p in (0, 1), staticOffsetOverSigma ν/σ ≥ 0 (default 0)
 * @returns r/σ (dimensionless)
 * @throws RangeError naming the field when out of range
 * @see Marcum (1960); e.g. ν/σ = 2, p = 1e-3 gives 5.241.
 */
export function requiredThresholdOverSigma(input: { outageProbability: number; staticOffsetOverSigma?: number }): number {
  const p = input.outageProbability;
  const nu = input.staticOffsetOverSigma ?? 0;
  if (!(p > 0 && p < 1)) throw new RangeError('outageProbability must be in (0, 1)');
  if (!(nu >= 0) || !Number.isFinite(nu)) throw new RangeError('staticOffsetOverSigma must be a finite number ≥ 0');
  if (nu === 0) return rayleighThresholdOverSigma(p);
  const logP = Math.log(p);
  // Q1 falls from 1 at r = 0; r = ν + sqrt(−2 ln p) + 2 is past the root (the Rician tail is lighter
  // than a Rayleigh tail shifted by ν).
  const upper = nu + rayleighThresholdOverSigma(p) + 2;
  return findRootBrent((b) => Math.log(marcumQ1(nu, b)) - logP, 0, upper, { xTolerance: 1e-13 * upper });
}

/**
 * Mean relative power for a small receiver under Rician pointing error:
 * E[exp(−2R²/w²)] = exp(−2ν²/(w² + 4σ²)) / (1 + 4σ²/w²). Plain-number closed form for the budget.
 *
 * @param beamRadiusM w, 1/e² beam radius at the receiver [m], > 0
 * @param jitterSigmaPerAxisM σ [m], ≥ 0
 * @param staticOffsetM ν [m], ≥ 0
 * @returns mean relative power in (0, 1]
 * @see derived (Gaussian integral of exp(−2R²/w²) against the offset circular Gaussian), checked by
 *   quadrature in the project's reference cases PT-05; small-receiver limit of Farid & Hranilovic (2007).
 */
export function meanPointingRelativePower(beamRadiusM: number, jitterSigmaPerAxisM: number, staticOffsetM: number): number {
  const wSquared = beamRadiusM * beamRadiusM;
  const spread = 4 * jitterSigmaPerAxisM * jitterSigmaPerAxisM;
  return Math.exp((-2 * staticOffsetM * staticOffsetM) / (wSquared + spread)) / (1 + spread / wSquared);
}

/**
 * Mean pointing loss for a small receiver, −10·log10 of {@link meanPointingRelativePower}, computed
 * without exponentials: [2ν²/(w² + 4σ²) + ln(1 + 4σ²/w²)]·10/ln 10.
 *
 * @param beamRadiusM w [m], > 0
 * @param jitterSigmaPerAxisM σ [m], ≥ 0
 * @param staticOffsetM ν [m], ≥ 0
 * @returns loss [dB], ≥ 0
 * @see as {@link meanPointingRelativePower}.
 */
export function meanPointingLossDb(beamRadiusM: number, jitterSigmaPerAxisM: number, staticOffsetM: number): number {
  const wSquared = beamRadiusM * beamRadiusM;
  const spread = 4 * jitterSigmaPerAxisM * jitterSigmaPerAxisM;
  return DB_PER_NATURAL_LOG_POWER * ((2 * staticOffsetM * staticOffsetM) / (wSquared + spread) + Math.log1p(spread / wSquared));
}

/**
 * Instantaneous pointing loss of a small receiver at radial offset r: −10·log10(exp(−2r²/w²)) = 8.686·(r/w)².
 *
 * @param offsetM r [m], ≥ 0
 * @param beamRadiusM w [m], > 0
 * @returns loss [dB], ≥ 0
 * @see Gaussian intensity profile, Siegman (1986), eq. 17.5.
 */
export function pointingLossDb(offsetM: number, beamRadiusM: number): number {
  const ratio = offsetM / beamRadiusM;
  return 2 * DB_PER_NATURAL_LOG_POWER * ratio * ratio;
}

/**
 * Pointing loss from the ratio of the pointing error angle to the 1/e² half-angle divergence:
 * 8.686·(θ_err/θ_half)² dB (an error equal to the half-angle costs 8.69 dB).
 *
 * @param errorOverHalfAngle θ_err/θ_half (dimensionless), ≥ 0
 * @returns loss [dB]
 * @see far-field Gaussian profile, Siegman (1986), eq. 17.5.
 */
export function angularPointingLossDb(errorOverHalfAngle: number): number {
  return 2 * DB_PER_NATURAL_LOG_POWER * errorOverHalfAngle * errorOverHalfAngle;
}

/**
 * Radial offset at which the small-receiver pointing loss reaches a given value: w·sqrt(L/8.686).
 *
 * @param beamRadiusM w [m], > 0
 * @param lossDb allowed loss [dB], ≥ 0
 * @returns r [m]
 * @see inverse of {@link pointingLossDb}.
 */
export function offsetForPointingLossM(beamRadiusM: number, lossDb: number): number {
  return beamRadiusM * Math.sqrt(lossDb / (2 * DB_PER_NATURAL_LOG_POWER));
}

/** Input of {@link pointingJitterBudget}. */
export interface PointingJitterBudgetInput {
  /** 1/e² beam radius at the receiver [m], > 0. */
  beamRadiusM: number;
  /** Pointing loss allocated in the budget [dB], > 0. */
  allowedPointingLossDb: number;
  /** Accepted probability of exceeding that loss, in (0, 1). */
  outageProbability: number;
  /** Link range [m], > 0 (to express σ as an angle). */
  rangeM: number;
  /** Static offset at the receiver [m], ≥ 0 (default 0). */
  staticOffsetM?: number;
}

/** Result of {@link pointingJitterBudget}. */
export interface PointingJitterBudget {
  /** Radial offset that produces the allowed loss [m]. */
  allowedOffsetM: number;
  /** Largest per-axis jitter keeping the outage at or below p [m]; 0 when the static offset alone exceeds the allowance. */
  maxSigmaPerAxisM: number;
  /** The same as an angle at the transmitter [rad]. */
  maxSigmaPerAxisRad: number;
}

/**
 * Design inverse: the largest per-axis jitter for which the pointing loss exceeds its allocation
 * with probability at most p. Without bias σ_max = r_allow/sqrt(−2 ln p); with a bias ν,
 * Q1(ν/σ, r_allow/σ) = p is solved for σ.
 *
 * @param input see {@link PointingJitterBudgetInput}
 * @returns allowed offset [m], max σ [m] and [rad]
 * @throws RangeError naming the field when out of range
 * @see Gaussian profile (Siegman 1986, eq. 17.5) with the Rayleigh/Rician tails (Marcum 1960);
 *   e.g. w = 1 m, 3 dB, p = 1e-3 gives σ_max = 0.158 m.
 */
export function pointingJitterBudget(input: PointingJitterBudgetInput): PointingJitterBudget {
  const { beamRadiusM, allowedPointingLossDb, outageProbability, rangeM } = input;
  const offset = input.staticOffsetM ?? 0;
  if (!(beamRadiusM > 0) || !Number.isFinite(beamRadiusM)) throw new RangeError('beamRadiusM must be a finite number > 0');
  if (!(allowedPointingLossDb > 0) || !Number.isFinite(allowedPointingLossDb)) throw new RangeError('allowedPointingLossDb must be a finite number > 0');
  if (!(outageProbability > 0 && outageProbability < 1)) throw new RangeError('outageProbability must be in (0, 1)');
  if (!(rangeM > 0) || !Number.isFinite(rangeM)) throw new RangeError('rangeM must be a finite number > 0');
  if (!(offset >= 0) || !Number.isFinite(offset)) throw new RangeError('staticOffsetM must be a finite number ≥ 0');
  const allowedOffsetM = offsetForPointingLossM(beamRadiusM, allowedPointingLossDb);
  let maxSigma: number;
  if (offset === 0) {
    maxSigma = allowedOffsetM / rayleighThresholdOverSigma(outageProbability);
  } else if (offset >= allowedOffsetM) {
    maxSigma = 0;
  } else {
    // Outage grows with σ: find σ where it equals p, between a tiny σ (outage ≈ 0) and the Rayleigh value at ν = 0 scaled up.
    const logP = Math.log(outageProbability);
    const f = (sigma: number): number => Math.log(Math.max(marcumQ1(offset / sigma, allowedOffsetM / sigma), 1e-300)) - logP;
    const upper = allowedOffsetM / rayleighThresholdOverSigma(outageProbability);
    let lower = upper * 1e-3;
    while (f(lower) > 0 && lower > 1e-12 * upper) lower /= 10;
    maxSigma = findRootBrent(f, lower, upper, { xTolerance: 1e-13 * upper });
  }
  return { allowedOffsetM, maxSigmaPerAxisM: maxSigma, maxSigmaPerAxisRad: maxSigma / rangeM };
}

/**
 * Pointing loss not exceeded with probability 1 − p (small receiver): the loss at the radius that
 * the pointing error exceeds with probability p. Rayleigh closed form when the offset is zero.
 *
 * @param input beamRadiusM [m] > 0, jitterSigmaPerAxisM [m] ≥ 0, staticOffsetM [m] ≥ 0, outageProbability in (0, 1)
 * @returns loss [dB], ≥ 0
 * @see as {@link requiredThresholdOverSigma} and {@link pointingLossDb}.
 */
export function pointingLossAtOutageDb(input: { beamRadiusM: number; jitterSigmaPerAxisM: number; staticOffsetM?: number; outageProbability: number }): number {
  const sigma = input.jitterSigmaPerAxisM;
  const offset = input.staticOffsetM ?? 0;
  if (sigma === 0) return pointingLossDb(offset, input.beamRadiusM);
  const ratio = requiredThresholdOverSigma({ outageProbability: input.outageProbability, staticOffsetOverSigma: offset / sigma });
  return pointingLossDb(ratio * sigma, input.beamRadiusM);
}

/** Result of {@link faridHranilovicPointingStatistics}. */
export interface FaridHranilovicPointingStatistics {
  /** A0, captured fraction at zero offset (model). */
  peakFraction: number;
  /** w_eq [m]. */
  equivalentBeamRadiusM: number;
  /** ξ = w_eq/(2σ). */
  xi: number;
  /** Mean captured fraction A0·ξ²/(1 + ξ²). */
  meanFraction: number;
  /** ξ²/(1 + ξ²). */
  meanFractionOverPeak: number;
}

/**
 * Statistics of the pointing-loss factor h_p = A0·exp(−2R²/w_eq²) under zero-mean jitter σ with a
 * finite aperture: pdf f(h) = ξ² A0^(−ξ²) h^(ξ²−1) on [0, A0], mean A0·ξ²/(1 + ξ²).
 *
 * @param input beamRadiusM [m] > 0, apertureRadiusM [m] > 0, jitterSigmaPerAxisM [m] > 0
 * @returns A0, w_eq [m], ξ, mean fraction and mean over A0
 * @see Farid A.A., Hranilovic S., J. Lightwave Technol. 25(7), 1702–1710 (2007), pdf of h_p
 *   (equation numbers not verified).
 */
export function faridHranilovicPointingStatistics(input: { beamRadiusM: number; apertureRadiusM: number; jitterSigmaPerAxisM: number }): FaridHranilovicPointingStatistics {
  const model = faridHranilovicCapture(input.beamRadiusM, input.apertureRadiusM);
  const xi = model.equivalentBeamRadiusM / (2 * input.jitterSigmaPerAxisM);
  const xiSquared = xi * xi;
  const meanFractionOverPeak = xiSquared / (1 + xiSquared);
  return {
    peakFraction: model.peakFraction,
    equivalentBeamRadiusM: model.equivalentBeamRadiusM,
    xi,
    meanFraction: model.peakFraction * meanFractionOverPeak,
    meanFractionOverPeak,
  };
}

/**
 * Probability that h_p falls below h: P(h_p < h) = (h/A0)^(ξ²).
 *
 * @param xi ξ = w_eq/(2σ), > 0
 * @param thresholdOverPeak h/A0 in [0, 1]
 * @returns probability in [0, 1]
 * @see Farid & Hranilovic (2007), CDF of h_p.
 */
export function faridHranilovicOutageProbability(xi: number, thresholdOverPeak: number): number {
  return Math.pow(thresholdOverPeak, xi * xi);
}

/**
 * Combines independent per-axis jitter sources in quadrature.
 * @param sigmas per-axis standard deviations (same unit, m or rad), each ≥ 0
 * @returns sqrt(Σ σ²) in that unit
 * @see variance of a sum of independent variables.
 */
export function combineJitterPerAxis(sigmas: readonly number[]): number {
  let sum = 0;
  for (const sigma of sigmas) sum += sigma * sigma;
  return Math.sqrt(sum);
}
