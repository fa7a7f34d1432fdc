/**
 * Exact pointing loss of a Gaussian beam on a finite annular aperture under a Rician pointing
 * error (static offset ν plus circular jitter σ per axis, both in metres at the receiver). Losses
 * are relative to the centred capture C(0), so they can be negative: where the central obscuration
 * is about the size of the beam, an offset moves power onto the annulus and the term is a gain.
 */
import { logCentredAnnularCapture, logMeanAnnularCapture, logOffsetAnnularCapture } from '../capture/capture.js';
import { marcumQ1, marcumQ1Complement, noncentralChiSquare2SfFast } from '../numeric/marcum-q.js';
import { findRootBrent } from '../numeric/root-finding.js';
import { DB_PER_NATURAL_LOG_POWER } from '../units/constants.js';
import { rayleighThresholdOverSigma } from './pointing.js';
import { besselI0Scaled } from '../numeric/bessel.js';
import { normalQuantileOf } from '../numeric/normal.js';

/**
 * Mean pointing loss, −10·log10(E[C(R)]/C(0)), with C the exact annular capture and R the Rician
 * radial error. Plain-number form for the budget (no validation).
 *
 * @param beamRadiusM W, 1/e² beam radius at the receiver [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @param jitterSigmaPerAxisM σ [m], ≥ 0
 * @param staticOffsetM ν [m], ≥ 0
 * @returns loss [dB]; negative (a gain) when offsets put more power on an obscured aperture
 * @see derived: the beam profile and the jitter convolve into one Gaussian of per-axis variance
 *   W²/4 + σ², whose annular probability is a difference of Marcum Q1 functions (Marcum J.I., 1960;
 *   Rice S.O., 1945); model of Farid A.A., Hranilovic S., J. Lightwave Technol. 25(7), 1702–1710 (2007).
 */
export function exactMeanPointingLossDb(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number, jitterSigmaPerAxisM: number, staticOffsetM: number): number {
  if (jitterSigmaPerAxisM === 0 && staticOffsetM === 0) return 0;
  const logMean = logMeanAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, jitterSigmaPerAxisM, staticOffsetM);
  return -DB_PER_NATURAL_LOG_POWER * (logMean - logCentredAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM)) + 0;
}

/**
 * Radius r_p exceeded with probability p by the Rician radial error: Q1(ν/σ, r_p/σ) = p, solved by
 * safeguarded Newton steps on ln Q1 (slope from the Rice density) to 1e-13 relative (the Rayleigh closed form σ·√(−2 ln p) when ν = 0; ν
 * itself when σ = 0).
 *
 * @param jitterSigmaPerAxisM σ [m or rad], ≥ 0
 * @param staticOffsetM ν [same unit], ≥ 0
 * @param outageProbability p in (0, 1)
 * @returns r_p [same unit]
 * @see Marcum J.I., IRE Trans. Inf. Theory IT-6(2), 59–267 (1960).
 */
export function ricianOutageRadius(jitterSigmaPerAxisM: number, staticOffsetM: number, outageProbability: number): number {
  if (jitterSigmaPerAxisM === 0) return staticOffsetM;
  const offset = staticOffsetM / jitterSigmaPerAxisM;
  const rayleigh = rayleighThresholdOverSigma(outageProbability);
  if (offset === 0) return rayleigh * jitterSigmaPerAxisM;
  // Bracket: R is stochastically larger than without bias (r_p ≥ √(−2 ln p)); P(R > ν + t) ≥
  // P(X₁ > t) gives r_p ≥ ν − Φ⁻¹(p); and |ν + X| ≤ ν + |X| gives r_p ≤ ν + √(−2 ln p) (σ units).
  const lower = Math.max(rayleigh, offset - normalQuantileOf(outageProbability));
  const upper = offset + rayleigh;
  // Start at the midpoint, or for a large bias at its Gaussian limit ν − Φ⁻¹(p) + 1/(2ν) (σ units),
  // which is already close: one or two Newton steps then reach the root.
  const gaussianLimit = offset - normalQuantileOf(outageProbability) + 0.5 / offset;
  const start = offset > 10 && gaussianLimit > lower && gaussianLimit < upper ? gaussianLimit : 0.5 * (lower + upper);
  return ricianOutageRadiusOverSigmaWithin(offset, outageProbability, lower, upper, start) * jitterSigmaPerAxisM;
}

/**
 * r_p/σ solved inside a bracket [lower, upper] (σ units) that holds it, from a start inside it:
 * Newton on ln Q1(a, r) − ln p (slope −f_Rice(r)/Q1), kept inside the bracket by bisection, to
 * 1e-13 relative. A narrow bracket with a close start (a table, see {@link ricianOutageRadiusTable})
 * needs one or two steps.
 *
 * @param offsetOverSigma ν/σ, > 0
 * @param outageProbability p in (0, 1)
 * @param lower a radius over σ with Q1(ν/σ, lower) ≥ p
 * @param upper a radius over σ with Q1(ν/σ, upper) ≤ p
 * @param start the first iterate, in [lower, upper]
 * @returns r_p/σ
 * @see Marcum J.I., IRE Trans. Inf. Theory IT-6(2), 59–267 (1960).
 */
export function ricianOutageRadiusOverSigmaWithin(offsetOverSigma: number, outageProbability: number, lower: number, upper: number, start: number): number {
  const logP = Math.log(outageProbability);
  const noncentrality = offsetOverSigma * offsetOverSigma;
  let low = lower * (1 - 1e-12);
  let high = upper * (1 + 1e-12);
  let r = start;
  for (let i = 0; i < 100; i++) {
    // the allocation-free series where it applies, the general Q1 (quadrature for large offsets) elsewhere
    const sf = noncentralChiSquare2SfFast(r * r, noncentrality);
    const residual = Math.log(sf === sf ? sf : marcumQ1(offsetOverSigma, r)) - logP;
    if (residual > 0) low = r;
    else high = r;
    const density = r * Math.exp(-0.5 * (r - offsetOverSigma) * (r - offsetOverSigma)) * besselI0Scaled(offsetOverSigma * r);
    const slope = -density / Math.exp(residual + logP);
    let next = r - residual / slope;
    // A Newton step this small is the root (it may land on the bracket's end, which r just became:
    // test before the bisection fallback, which would otherwise halve the whole bracket again).
    if (Math.abs(next - r) <= 1e-13 * r) return next;
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    if (Math.abs(next - r) <= 1e-13 * r || high - low <= 1e-13 * high) return next;
    r = next;
  }
  return r;
}

/** r_p/σ tabulated against ν/σ at a fixed probability (see {@link ricianOutageRadiusTable}). */
export interface RicianOutageRadiusTable {
  /** the probability p the radii are exceeded with */
  outageProbability: number;
  /** spacing of ν/σ between entries */
  offsetStep: number;
  /** r_p/σ at ν/σ = i·offsetStep, i = 0 … length − 1, each solved to 1e-13 relative */
  radiiOverSigma: Float64Array;
}

/**
 * The radius exceeded with probability p by a Rician error, r_p/σ, at evenly spaced offsets ν/σ.
 * Q1(a, b) increases with a for b > 0 (a larger offset moves the whole distribution outwards), so
 * r_p/σ increases with ν/σ and [radii[i], radii[i + 1]] brackets r_p/σ for every ν/σ between the
 * two entries' offsets: a rigorous bracket from one lookup, and with the linear interpolation a
 * start within about step²/10 of the root.
 *
 * @param outageProbability p in (0, 1)
 * @param offsetStep spacing of ν/σ, > 0
 * @param count number of entries, ≥ 2
 * @returns the table
 * @see Marcum J.I. (1960); monotonicity of Q1 in its first argument (e.g. Simon M.K., Alouini M.-S.,
 *   "Digital Communication over Fading Channels", 2nd ed., Wiley (2005), §4.2) [from memory].
 */
export function ricianOutageRadiusTable(outageProbability: number, offsetStep: number, count: number): RicianOutageRadiusTable {
  const radiiOverSigma = new Float64Array(count);
  const rayleigh = rayleighThresholdOverSigma(outageProbability);
  const normal = -normalQuantileOf(outageProbability);
  radiiOverSigma[0] = rayleigh;
  for (let i = 1; i < count; i++) {
    const offset = i * offsetStep;
    // r_p grows with the offset: the previous entry is a lower bound, and the straight line
    // through the previous two a start within about step² of the root (one or two Newton steps).
    const previous = radiiOverSigma[i - 1]!;
    const lower = Math.max(previous, offset + normal);
    const upper = offset + rayleigh;
    const extrapolated = i > 1 ? 2 * previous - radiiOverSigma[i - 2]! : previous + 0.5 * offsetStep;
    radiiOverSigma[i] = ricianOutageRadiusOverSigmaWithin(offset, outageProbability, lower, upper, Math.min(Math.max(extrapolated, lower), upper));
  }
  return { outageProbability, offsetStep, radiiOverSigma };
}

/**
 * True when the exact annular capture C(r) falls from its centred value as the offset grows (always
 * without obscuration); false where a large obscuration makes C rise first.
 * @param beamRadiusM W [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @returns whether C has its maximum at r = 0
 * @see derived from the sign of C''(0).
 */
export function captureFallsFromCentre(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number): boolean {
  if (obscurationRadiusM === 0) return true;
  // C''(0) ∝ b²·exp(−2b²/W²) − a²·exp(−2a²/W²) (the Laplacian of the beam profile integrated over
  // the annulus, derived): C rises with the offset when the obscuration rim is the brighter one.
  const inverseSquare = 2 / (beamRadiusM * beamRadiusM);
  const rim = (radius: number): number => 2 * Math.log(radius) - inverseSquare * radius * radius;
  return rim(obscurationRadiusM) <= rim(apertureRadiusM);
}

/** Offset of the largest capture, by golden-section search on [0, a + 2W]. */
function offsetOfLargestCapture(logCapture: (offsetM: number) => number, upperM: number): number {
  const inverseGolden = (Math.sqrt(5) - 1) / 2;
  let low = 0;
  let high = upperM;
  let left = high - inverseGolden * (high - low);
  let right = low + inverseGolden * (high - low);
  let leftValue = logCapture(left);
  let rightValue = logCapture(right);
  for (let i = 0; i < 80 && high - low > 1e-12 * upperM; i++) {
    if (leftValue < rightValue) {
      low = left;
      left = right;
      leftValue = rightValue;
      right = low + inverseGolden * (high - low);
      rightValue = logCapture(right);
    } else {
      high = right;
      right = left;
      rightValue = leftValue;
      left = high - inverseGolden * (high - low);
      leftValue = logCapture(left);
    }
  }
  return 0.5 * (low + high);
}

/**
 * ln of the p-quantile of C(R) where C rises from the centre (heavy obscuration): P(C(R) < c) = p
 * with {C < c} = [0, r1) ∪ (r2, ∞) around the offset r* of the largest capture, solved for c.
 */
function logCaptureQuantileRising(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number, jitterSigmaPerAxisM: number, staticOffsetM: number, outageProbability: number): number {
  const logCapture = (offsetM: number): number => logOffsetAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, offsetM);
  const peakOffset = offsetOfLargestCapture(logCapture, apertureRadiusM + 2 * beamRadiusM);
  const logPeak = logCapture(peakOffset);
  const logCentre = logCapture(0);
  const offset = staticOffsetM / jitterSigmaPerAxisM;
  const logP = Math.log(outageProbability);
  const outerOffsetAt = (logLevel: number): number => {
    let step = beamRadiusM;
    while (logCapture(peakOffset + step) > logLevel) step *= 2;
    const upper = peakOffset + step;
    return findRootBrent((r) => logCapture(r) - logLevel, peakOffset, upper, { xTolerance: 1e-14 * upper });
  };
  const logBelow = (logLevel: number): number => {
    const outer = outerOffsetAt(logLevel) / jitterSigmaPerAxisM;
    let probability = marcumQ1(offset, outer);
    if (logLevel > logCentre) {
      const inner = findRootBrent((r) => logCapture(r) - logLevel, 0, peakOffset, { xTolerance: 1e-14 * peakOffset }) / jitterSigmaPerAxisM;
      probability += marcumQ1Complement(offset, inner);
    }
    return Math.log(probability) - logP;
  };
  const high = logPeak - 1e-9 * Math.max(1, Math.abs(logPeak));
  if (logBelow(high) <= 0) return high;
  let low = Math.min(logCentre, logPeak) - 1;
  while (logBelow(low) > 0) low -= 2 * (high - low);
  return findRootBrent(logBelow, low, high, { xTolerance: 1e-13 * Math.max(1, Math.abs(low)) });
}

/**
 * P(C(R) < c) where C rises from the centre (heavy obscuration), for a level c between the centred
 * capture and the capture at r_p: C(0) < c ≤ C(r_p). C rises to a single peak and then falls
 * (derived), so {C < c} = [0, r1) ∪ (r2, ∞) with r1 the one crossing in [0, r_p] and r2 the one
 * beyond r_p: two bracketed roots and two Marcum Q1 values, no search for the peak. Comparing this
 * with p decides whether the p-quantile of C(R) lies below c without solving for the quantile.
 *
 * @param beamRadiusM W [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], > 0
 * @param jitterSigmaPerAxisM σ [m], > 0
 * @param staticOffsetM ν [m], ≥ 0
 * @param logLevel ln c, in (ln C(0), ln C(r_p)]
 * @param outageRadiusM r_p [m], the radius R exceeds with the outage probability
 * @returns P(C(R) < c) in [0, 1]
 * @see Marcum (1960); the two-crossing form is derived.
 */
export function probabilityOfCaptureBelowRising(
  beamRadiusM: number,
  apertureRadiusM: number,
  obscurationRadiusM: number,
  jitterSigmaPerAxisM: number,
  staticOffsetM: number,
  logLevel: number,
  outageRadiusM: number,
): number {
  const excess = (offsetM: number): number => logOffsetAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, offsetM) - logLevel;
  const inner = findRootBrent(excess, 0, outageRadiusM, { xTolerance: 1e-13 * outageRadiusM });
  let step = beamRadiusM;
  while (excess(outageRadiusM + step) > 0) step *= 2;
  const upper = outageRadiusM + step;
  const outer = findRootBrent(excess, outageRadiusM, upper, { xTolerance: 1e-13 * upper });
  const offset = staticOffsetM / jitterSigmaPerAxisM;
  return marcumQ1Complement(offset, inner / jitterSigmaPerAxisM) + marcumQ1(offset, outer / jitterSigmaPerAxisM);
}

/**
 * Pointing loss exceeded with probability p given the outage radius r_p (see
 * {@link exactOutagePointingLossDb}); the budget computes r_p once per design, range-free.
 */
export function exactOutagePointingLossAtRadiusDb(
  beamRadiusM: number,
  apertureRadiusM: number,
  obscurationRadiusM: number,
  jitterSigmaPerAxisM: number,
  staticOffsetM: number,
  outageProbability: number,
  outageRadiusM: number,
): number {
  if (outageRadiusM === 0) return 0;
  const logCentre = logCentredAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM);
  if (jitterSigmaPerAxisM === 0 || captureFallsFromCentre(beamRadiusM, apertureRadiusM, obscurationRadiusM)) {
    // C falls with the offset: the capture exceeded with probability 1 − p is C(r_p).
    return -DB_PER_NATURAL_LOG_POWER * (logOffsetAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, outageRadiusM) - logCentre) + 0;
  }
  // C rises from the centre, to a single peak at r* (derived). Where C(r_p) ≤ C(0), r_p lies past
  // r* and {C < C(r_p)} = (r_p, ∞): the quantile is still C(r_p), with no search.
  const logAtRadius = logOffsetAnnularCapture(beamRadiusM, apertureRadiusM, obscurationRadiusM, outageRadiusM);
  if (logAtRadius <= logCentre) return -DB_PER_NATURAL_LOG_POWER * (logAtRadius - logCentre) + 0;
  // C is flat to second order at the centre: within 1e-6 W it differs from C(0) by ~1e-12 relative.
  if (outageRadiusM < 1e-6 * beamRadiusM) return 0;
  const logQuantile = logCaptureQuantileRising(beamRadiusM, apertureRadiusM, obscurationRadiusM, jitterSigmaPerAxisM, staticOffsetM, outageProbability);
  return -DB_PER_NATURAL_LOG_POWER * (logQuantile - logCentre) + 0;
}

/**
 * Pointing loss exceeded with probability p: −10·log10(c_p/C(0)) with c_p the p-quantile of the
 * exact annular capture C(R) under the Rician radial error R. Where C falls with the offset this is
 * C(r_p) with r_p the radius exceeded with probability p; where a large obscuration makes C rise
 * first, the quantile is solved over both sides of the peak.
 *
 * @param beamRadiusM W [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @param jitterSigmaPerAxisM σ [m], ≥ 0
 * @param staticOffsetM ν [m], ≥ 0
 * @param outageProbability p in (0, 1)
 * @returns loss [dB]; negative (a gain) when even the p-quantile capture exceeds the centred one
 * @see Marcum (1960); Farid & Hranilovic (2007) (outage under pointing error); quantile derived.
 */
export function exactOutagePointingLossDb(
  beamRadiusM: number,
  apertureRadiusM: number,
  obscurationRadiusM: number,
  jitterSigmaPerAxisM: number,
  staticOffsetM: number,
  outageProbability: number,
): number {
  const radius = ricianOutageRadius(jitterSigmaPerAxisM, staticOffsetM, outageProbability);
  return exactOutagePointingLossAtRadiusDb(beamRadiusM, apertureRadiusM, obscurationRadiusM, jitterSigmaPerAxisM, staticOffsetM, outageProbability, radius);
}
