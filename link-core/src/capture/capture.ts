/**
 * Geometric capture of a Gaussian beam (1/e² radius w at the receiver) by a circular receive
 * aperture of radius a, centred or laterally offset by r0. The normalised intensity is a circular
 * 2-D Gaussian with per-axis standard deviation w/2, so the captured fraction is a noncentral
 * chi-square (2 degrees of freedom) probability.
 */
import erf from '@stdlib/math-base-special-erf';
import { besselI0Scaled } from '../numeric/bessel.js';
import { logNoncentralChiSquare2TailsScaled, marcumQ1Complement, noncentralChiSquare2CdfFast, noncentralChiSquare2SfFast } from '../numeric/marcum-q.js';
import { integrate } from '../numeric/quadrature.js';
import { findRootBrent } from '../numeric/root-finding.js';
import { fractionToLossDb } from '../units/decibels.js';

/**
 * Fraction of a centred Gaussian beam captured by a circular aperture: 1 − exp(−2a²/w²).
 * Plain-number form for hot loops (no validation); exact for r ≪ w through expm1.
 *
 * @param beamRadiusM 1/e² beam radius at the receiver [m], > 0
 * @param apertureRadiusM receive aperture radius [m], ≥ 0
 * @returns captured fraction in [0, 1]
 * @see Siegman A.E., "Lasers" (1986), §17.1 (encircled power of a TEM00 beam).
 */
export function centredCaptureFraction(beamRadiusM: number, apertureRadiusM: number): number {
  const ratio = apertureRadiusM / beamRadiusM;
  return -Math.expm1(-2 * ratio * ratio);
}

/**
 * Fraction captured by an annular aperture (outer radius a, central obscuration radius b), beam centred:
 * exp(−2b²/w²) − exp(−2a²/w²).
 *
 * @param beamRadiusM w [m], > 0
 * @param apertureRadiusM a [m], ≥ b
 * @param obscurationRadiusM b [m], ≥ 0
 * @returns fraction in [0, 1]
 * @see Siegman (1986), §17.1.
 */
export function annularCaptureFraction(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number): number {
  return centredCaptureFraction(beamRadiusM, apertureRadiusM) - centredCaptureFraction(beamRadiusM, obscurationRadiusM);
}

/**
 * The same centred annular fraction written as exp(−2b²/w²)·(1 − exp(−2(a² − b²)/w²)): no
 * cancellation where the obscuration is about the size of the beam or larger, which the plain
 * difference of {@link annularCaptureFraction} suffers. Units and ranges as there.
 */
export function annularCaptureFractionStable(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number): number {
  const inverseSquare = 2 / (beamRadiusM * beamRadiusM);
  const openFraction = -Math.expm1(-inverseSquare * (apertureRadiusM - obscurationRadiusM) * (apertureRadiusM + obscurationRadiusM));
  return obscurationRadiusM === 0 ? openFraction : Math.exp(-inverseSquare * obscurationRadiusM * obscurationRadiusM) * openFraction;
}

/**
 * Exact fraction of a Gaussian beam captured by a circular aperture whose centre is offset by r0
 * from the beam axis: η = 1 − Q1(2r0/w, 2a/w) = F_χ'²(4a²/w²; 2, 4r0²/w²). Plain-number form.
 *
 * @param beamRadiusM w [m], > 0
 * @param apertureRadiusM a [m], ≥ 0
 * @param offsetM lateral offset r0 [m], ≥ 0
 * @returns fraction in [0, 1], non-increasing in r0
 * @see Farid A.A., Hranilovic S., "Outage capacity optimization for free-space optical links with
 *   pointing errors", J. Lightwave Technol. 25(7), 1702–1710 (2007), integral of the offset Gaussian over the aperture (equation number not verified);
 *   Marcum J.I. (1960) for Q1.
 */
export function offsetCaptureFraction(beamRadiusM: number, apertureRadiusM: number, offsetM: number): number {
  if (offsetM === 0) return centredCaptureFraction(beamRadiusM, apertureRadiusM);
  return marcumQ1Complement((2 * Math.abs(offsetM)) / beamRadiusM, (2 * apertureRadiusM) / beamRadiusM);
}

/** Input of {@link captureFraction}. */
export interface CaptureFractionInput {
  /** 1/e² beam radius at the receiver [m], > 0. */
  beamRadiusM: number;
  /** Receive aperture radius [m], ≥ 0. */
  apertureRadiusM: number;
  /** Lateral offset of the aperture centre from the beam axis [m], ≥ 0 (default 0). */
  offsetM?: number;
}

/**
 * Fraction of a Gaussian beam's power captured by a circular receive aperture, exact for any offset
 * (closed form 1 − exp(−2a²/w²) when centred; noncentral chi-square CDF otherwise).
 *
 * @param input beamRadiusM [m] > 0, apertureRadiusM [m] ≥ 0, offsetM [m] ≥ 0 (default 0)
 * @returns captured fraction in [0, 1]
 * @throws RangeError naming the field when an input is not finite or out of range
 * @see Farid & Hranilovic (2007), offset-capture integral; Siegman (1986), §17.1.
 */
export function captureFraction(input: CaptureFractionInput): number {
  const offsetM = input.offsetM ?? 0;
  if (!(input.beamRadiusM > 0) || !Number.isFinite(input.beamRadiusM)) throw new RangeError('beamRadiusM must be a finite number > 0');
  if (!(input.apertureRadiusM >= 0) || !Number.isFinite(input.apertureRadiusM)) throw new RangeError('apertureRadiusM must be a finite number ≥ 0');
  if (!(offsetM >= 0) || !Number.isFinite(offsetM)) throw new RangeError('offsetM must be a finite number ≥ 0');
  return offsetCaptureFraction(input.beamRadiusM, input.apertureRadiusM, offsetM);
}

/**
 * Geometric loss of a capture fraction, −10·log10(η).
 * @param fraction captured fraction in (0, 1]
 * @returns loss [dB], ≥ 0
 * @see common practice (definition of a loss in dB).
 */
export function geometricLossDb(fraction: number): number {
  return fractionToLossDb(fraction);
}

/**
 * Small-aperture centred approximation η ≈ 2a²/w² (exceeds 1 for a > w/√2: it is only meaningful for a ≪ w).
 * @param beamRadiusM w [m], > 0
 * @param apertureRadiusM a [m], ≥ 0
 * @returns 2a²/w² (dimensionless)
 * @see first-order expansion of 1 − exp(−2a²/w²) (derived).
 */
export function smallApertureCaptureApproximation(beamRadiusM: number, apertureRadiusM: number): number {
  const ratio = apertureRadiusM / beamRadiusM;
  return 2 * ratio * ratio;
}

/** Parameters of the Farid & Hranilovic pointing-loss model. */
export interface FaridHranilovicCapture {
  /** A0 = erf(v)², the captured fraction at zero offset in this model. */
  peakFraction: number;
  /** Equivalent beam radius w_eq [m]: η(r0) ≈ A0·exp(−2r0²/w_eq²). */
  equivalentBeamRadiusM: number;
}

/**
 * Farid & Hranilovic's Gaussian approximation of the offset capture fraction:
 * v = sqrt(π)·a/(sqrt(2)·w), A0 = erf(v)², w_eq² = w²·sqrt(π)·erf(v)/(2v·e^(−v²)),
 * η(r0) ≈ A0·exp(−2r0²/w_eq²). Accurate for a ≪ w (0.01 % at a/w = 0.025, 0.7 % at a/w = 0.67).
 *
 * @param beamRadiusM w [m], > 0
 * @param apertureRadiusM a [m], > 0
 * @returns A0 (dimensionless, in (0, 1)) and w_eq [m]
 * @see Farid A.A., Hranilovic S., J. Lightwave Technol. 25(7), 1702–1710 (2007), Gaussian approximation of the pointing-loss factor h_p (equation numbers not verified).
 */
export function faridHranilovicCapture(beamRadiusM: number, apertureRadiusM: number): FaridHranilovicCapture {
  const v = (Math.sqrt(Math.PI) * apertureRadiusM) / (Math.SQRT2 * beamRadiusM);
  const erfV = erf(v);
  const equivalentSquared = (beamRadiusM * beamRadiusM * Math.sqrt(Math.PI) * erfV) / (2 * v * Math.exp(-v * v));
  return { peakFraction: erfV * erfV, equivalentBeamRadiusM: Math.sqrt(equivalentSquared) };
}

/**
 * Farid & Hranilovic approximate capture fraction at offset r0: A0·exp(−2r0²/w_eq²).
 * @param beamRadiusM w [m], > 0
 * @param apertureRadiusM a [m], > 0
 * @param offsetM r0 [m], ≥ 0
 * @returns approximate fraction in (0, 1)
 * @see Farid & Hranilovic (2007), h_p ≈ A0·exp(−2r²/w_eq²).
 */
export function faridHranilovicCaptureFraction(beamRadiusM: number, apertureRadiusM: number, offsetM: number): number {
  const model = faridHranilovicCapture(beamRadiusM, apertureRadiusM);
  const ratio = offsetM / model.equivalentBeamRadiusM;
  return model.peakFraction * Math.exp(-2 * ratio * ratio);
}

/** Input of {@link topHatCaptureRatio}. */
export interface TopHatCaptureInput {
  /** Transmit beam diameter at the aperture [m], > 0. */
  transmitBeamDiameterM: number;
  /** Full-angle divergence [rad], ≥ 0. */
  fullAngleDivergenceRad: number;
  /** Range [m], ≥ 0. */
  rangeM: number;
  /** Receive aperture diameter [m], > 0. */
  receiveApertureDiameterM: number;
}

/**
 * The "top-hat" (flat-top) geometric ratio of FSO literature, (D_rx/(D_tx + θ_full·L))², capped at 1.
 * It treats the beam as a uniform disc of its 1/e² diameter and is about 3 dB more pessimistic than
 * centred Gaussian capture when a ≪ w: offer it only as a conservative / flat-top option.
 *
 * @param input see {@link TopHatCaptureInput}
 * @returns ratio in (0, 1]
 * @see common practice in FSO link budgets (e.g. Kim I.I., Korevaar E., Proc. SPIE 4530, 84–95 (2001)).
 */
export function topHatCaptureRatio(input: TopHatCaptureInput): number {
  const spotDiameterM = input.transmitBeamDiameterM + input.fullAngleDivergenceRad * input.rangeM;
  const ratio = input.receiveApertureDiameterM / spotDiameterM;
  return Math.min(1, ratio * ratio);
}

/**
 * Offset r0 at which the exact capture falls to a given fraction of its centred value
 * (solved by Brent's method on the noncentral chi-square CDF).
 *
 * @param input beamRadiusM [m] > 0, apertureRadiusM [m] > 0, relativeFraction in (0, 1)
 * @returns r0 [m], ≥ 0
 * @see Farid & Hranilovic (2007), exact capture integral, inverted numerically.
 */
export function offsetForRelativeCapture(input: { beamRadiusM: number; apertureRadiusM: number; relativeFraction: number }): number {
  const { beamRadiusM, apertureRadiusM, relativeFraction } = input;
  if (!(relativeFraction > 0 && relativeFraction < 1)) throw new RangeError('relativeFraction must be in (0, 1)');
  const centred = centredCaptureFraction(beamRadiusM, apertureRadiusM);
  const target = relativeFraction * centred;
  const residual = (offsetM: number): number => Math.log(offsetCaptureFraction(beamRadiusM, apertureRadiusM, offsetM)) - Math.log(target);
  let upper = apertureRadiusM + beamRadiusM;
  while (residual(upper) > 0) upper *= 2;
  return findRootBrent(residual, 0, upper, { xTolerance: 1e-14 * upper });
}

/** Input of {@link fieldOfViewCheck}. */
export interface FieldOfViewInput {
  /** Detector (or field stop) radius r_d [m], > 0. */
  detectorRadiusM: number;
  /** Receiver focal length f [m], > 0. */
  focalLengthM: number;
  /** Angular misalignment of the receiving terminal δ [rad], ≥ 0. */
  tiltRad: number;
  /** Radius of the focused spot on the detector [m], ≥ 0 (default 0). */
  focalSpotRadiusM?: number;
}

/** Result of {@link fieldOfViewCheck}. */
export interface FieldOfViewCheck {
  /** Half-angle field of view r_d/f [rad]. */
  halfAngleFieldOfViewRad: number;
  /** Focal-plane shift of the spot f·δ [m]. */
  focalSpotShiftM: number;
  /** Remaining angular margin (r_d − spot radius)/f − δ [rad]; negative means the signal is lost. */
  angularMarginRad: number;
  /** True when the whole focused spot stays on the detector. */
  withinFieldOfView: boolean;
}

/**
 * Receiver field-of-view check: a tilt δ of the receiving terminal moves the focal spot by f·δ; the
 * signal is lost when f·δ exceeds the detector radius minus the spot radius, whatever the beam size.
 *
 * @param input see {@link FieldOfViewInput}
 * @returns half-angle FOV [rad], spot shift [m], angular margin [rad], verdict
 * @see common practice (paraxial imaging: image height = f·tan δ ≈ f·δ).
 */
export function fieldOfViewCheck(input: FieldOfViewInput): FieldOfViewCheck {
  const spot = input.focalSpotRadiusM ?? 0;
  const shift = input.focalLengthM * input.tiltRad;
  const margin = (input.detectorRadiusM - spot) / input.focalLengthM - input.tiltRad;
  return {
    halfAngleFieldOfViewRad: input.detectorRadiusM / input.focalLengthM,
    focalSpotShiftM: shift,
    angularMarginRad: margin,
    withinFieldOfView: margin >= 0,
  };
}

/**
 * ln P(b < |Y| ≤ a) in units of s by quadrature of the scaled Rice density: exact in every regime
 * (the slow path of {@link logRicianAnnulusProbability}, for offsets or radii of hundreds of s and
 * for probabilities below the doubles).
 */
function logRicianAnnulusByQuadrature(offset: number, inner: number, outer: number): number {
  if (offset === 0) return -0.5 * inner * inner + Math.log(-Math.expm1(-0.5 * (outer - inner) * (outer + inner)));
  // The density t·exp(−(t − α)²/2)·i0e(α t) peaks within ~1 of α (or at the nearer end of the
  // annulus): scale by its Gaussian factor there and integrate the ±40 band that holds the mass.
  const peak = Math.min(Math.max(offset, inner), outer);
  const shift = 0.5 * (peak - offset) * (peak - offset);
  // shift − (t − α)²/2 written as a product: no cancellation when both squares are huge.
  const density = (t: number): number => t * Math.exp(0.5 * (peak - t) * (peak + t - 2 * offset)) * besselI0Scaled(offset * t);
  // Away from α the density falls like exp(−g·d − d²/2) at a distance d from the end of the
  // annulus nearest to α (g = that end's distance from α): keep the d where the exponent reaches 45.
  const gap = Math.abs(peak - offset);
  const reach = 45 / (gap + Math.sqrt(gap * gap + 90));
  const from = Math.max(inner, peak - 2 * reach);
  const to = Math.min(outer, peak + 2 * reach);
  const panels = Math.max(1, Math.ceil((to - from) / Math.min(2, reach)));
  const width = (to - from) / panels;
  let sum = 0;
  for (let i = 0; i < panels; i++) {
    sum += integrate(density, from + i * width, i === panels - 1 ? to : from + (i + 1) * width, { absoluteTolerance: 0, relativeTolerance: 1e-13, maxPanels: 200 });
  }
  return Math.log(sum) - shift;
}

/**
 * ln P(b < |Y| ≤ a) in units of s from the log tails of the rescaled series (differenced in the
 * log domain); NaN where that series does not apply.
 */
function logRicianAnnulusByScaledSeries(noncentrality: number, inner: number, outer: number): number {
  const outerTails = logNoncentralChiSquare2TailsScaled(outer * outer, noncentrality);
  const outerLogCdf = outerTails.logCdf;
  const outerLogSf = outerTails.logSf;
  if (inner === 0) return outerLogCdf;
  const innerTails = logNoncentralChiSquare2TailsScaled(inner * inner, noncentrality);
  const mean = noncentrality + 2; // the smaller tails sit on either side of y = μ + 1
  if (inner * inner >= mean) return innerTails.logSf + Math.log1p(-Math.exp(outerLogSf - innerTails.logSf));
  if (outer * outer < mean) return outerLogCdf + Math.log1p(-Math.exp(innerTails.logCdf - outerLogCdf));
  return Math.log1p(-Math.exp(innerTails.logCdf) - Math.exp(outerLogSf));
}

/** Below this probability the series' difference is replaced by the log-domain quadrature. */
const SMALLEST_LINEAR_PROBABILITY = 1e-250;

/**
 * Natural log of the probability that a 2-D circular Gaussian point (per-axis deviation s, centre
 * offset ν from the origin) lies in the annulus b < |Y| ≤ a: ln[Q1(ν/s, b/s) − Q1(ν/s, a/s)].
 * This one function gives the exact captured fraction of an offset Gaussian beam (s = W/2,
 * ν = offset) and the mean capture under Rician pointing error (s² = W²/4 + σ²: the beam profile
 * and the jitter convolve into one Gaussian). Plain-number hot-path form, no validation.
 *
 * Fast path: the positive-term Poisson series (noncentralChiSquare2CdfFast, …SfFast) for each radius,
 * differenced on the smaller tails (no cancellation beyond that of the annulus itself). Where the
 * result would leave the doubles (an obscuration far larger than s, or offsets of hundreds of s) it
 * switches to quadrature of the Rice density in the log domain, so the answer stays finite.
 *
 * @param offsetM ν [m], ≥ 0
 * @param sigmaM s [m], > 0
 * @param innerRadiusM b [m], ≥ 0
 * @param outerRadiusM a [m], > b
 * @returns ln P (dimensionless, ≤ 0, finite)
 * @see Rice S.O., Bell Syst. Tech. J. 24, 46–156 (1945) (Rice density); Marcum J.I. (1960) (Q1);
 *   Johnson, Kotz & Balakrishnan (1995), ch. 29 (noncentral chi-square).
 */
export function logRicianAnnulusProbability(offsetM: number, sigmaM: number, innerRadiusM: number, outerRadiusM: number): number {
  const offset = offsetM / sigmaM;
  const inner = innerRadiusM / sigmaM;
  const outer = outerRadiusM / sigmaM;
  if (offset === 0) return -0.5 * inner * inner + Math.log(-Math.expm1(-0.5 * (outer - inner) * (outer + inner)));
  const noncentrality = offset * offset;
  // Difference the smaller tails: survival functions when b lies beyond the bulk (y_b ≥ μ + 1).
  const probability =
    inner === 0
      ? noncentralChiSquare2CdfFast(outer * outer, noncentrality)
      : inner * inner >= noncentrality + 2
        ? noncentralChiSquare2SfFast(inner * inner, noncentrality) - noncentralChiSquare2SfFast(outer * outer, noncentrality)
        : noncentralChiSquare2CdfFast(outer * outer, noncentrality) - noncentralChiSquare2CdfFast(inner * inner, noncentrality);
  if (probability > SMALLEST_LINEAR_PROBABILITY) return Math.log(probability);
  return logRicianAnnulusBeyondTheDoubles(offset, noncentrality, inner, outer);
}

/**
 * {@link logRicianAnnulusProbability} where the difference of the tails leaves the doubles: the
 * log-domain series, then the quadrature (kept out of the common path so that it stays small
 * enough for the JIT to compile into its callers).
 */
function logRicianAnnulusBeyondTheDoubles(offset: number, noncentrality: number, inner: number, outer: number): number {
  const logScaled = logRicianAnnulusByScaledSeries(noncentrality, inner, outer);
  // finite unless one of its plain factors underflowed (offsets of thousands of s): integrate then
  if (Number.isFinite(logScaled)) return logScaled;
  return logRicianAnnulusByQuadrature(offset, inner, outer);
}

/**
 * Natural log of the captured fraction of a centred Gaussian beam on an annular aperture,
 * ln[exp(−2b²/W²) − exp(−2a²/W²)] = −2b²/W² + ln(1 − exp(−2(a² − b²)/W²)), finite even where the
 * obscuration hides nearly all of the beam.
 * @param beamRadiusM W [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @returns ln C(0) (≤ 0)
 * @see Siegman A.E., "Lasers" (1986), §17.1.
 */
export function logCentredAnnularCapture(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number): number {
  const inverseSquare = 2 / (beamRadiusM * beamRadiusM);
  return -inverseSquare * obscurationRadiusM * obscurationRadiusM + Math.log(-Math.expm1(-inverseSquare * (apertureRadiusM - obscurationRadiusM) * (apertureRadiusM + obscurationRadiusM)));
}

/**
 * Natural log of the exact captured fraction C(r) of a Gaussian beam (1/e² radius W) whose centre
 * is offset by r from the centre of an annular aperture (b < ρ ≤ a): the beam's intensity is a
 * circular Gaussian of per-axis deviation W/2, so C(r) = Q1(2r/W, 2b/W) − Q1(2r/W, 2a/W).
 * @param beamRadiusM W [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @param offsetM r [m], ≥ 0
 * @returns ln C(r) (≤ 0, finite)
 * @see Farid A.A., Hranilovic S., J. Lightwave Technol. 25(7), 1702–1710 (2007) (offset-capture
 *   integral, here with a central obscuration); Marcum (1960).
 */
export function logOffsetAnnularCapture(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number, offsetM: number): number {
  return logRicianAnnulusProbability(offsetM, beamRadiusM / 2, obscurationRadiusM, apertureRadiusM);
}

/**
 * Natural log of the mean captured fraction E[C(R)] of a Gaussian beam under pointing error with
 * static offset ν and circular jitter σ per axis: the beam (deviation W/2 per axis) and the jitter
 * convolve into one Gaussian of per-axis variance W²/4 + σ², so
 * E[C(R)] = Q1(ν/s, b/s) − Q1(ν/s, a/s), s = √(W²/4 + σ²); closed form for ν = 0.
 * @param beamRadiusM W [m], > 0
 * @param apertureRadiusM a [m], > b
 * @param obscurationRadiusM b [m], ≥ 0
 * @param jitterSigmaPerAxisM σ [m], ≥ 0
 * @param staticOffsetM ν [m], ≥ 0
 * @returns ln E[C(R)] (≤ 0, finite)
 * @see derived (convolution of two circular Gaussians); Rice (1945); Marcum (1960).
 */
export function logMeanAnnularCapture(beamRadiusM: number, apertureRadiusM: number, obscurationRadiusM: number, jitterSigmaPerAxisM: number, staticOffsetM: number): number {
  const s = Math.sqrt(0.25 * beamRadiusM * beamRadiusM + jitterSigmaPerAxisM * jitterSigmaPerAxisM);
  return logRicianAnnulusProbability(staticOffsetM, s, obscurationRadiusM, apertureRadiusM);
}
