/**
 * On-axis scintillation of a Gaussian beam (collimated, focused or divergent) in the Andrews &
 * Phillips output-plane parameters Θ, Λ: the longitudinal Rytov variance σ_B² and the all-regime
 * on-axis scintillation index.
 */
import { requireNonNegative } from '../numeric/input-guards.js';
import { integrate } from '../numeric/quadrature.js';
import { GAMMA_MINUS_FIVE_SIXTHS, kolmogorovKernelReal } from '../numeric/complex-math.js';

// 2F1(a, b; c; z) with a = −5/6, b = 11/6, c = 17/6 and its 1 − z connection coefficients.
const A = -5 / 6;
const B = 11 / 6;
const C = 17 / 6;
// Γ values for the connection formula (from Γ(1/6) = 5.566316001780235, Γ(5/6) = 1.128787029908126 and recurrences).
const GAMMA_ONE_SIXTH = 5.566316001780235;
const GAMMA_FIVE_SIXTHS = 1.128787029908126;
const gammaOf = {
  // Γ(17/6) = (11/6)(5/6)Γ(5/6)
  c: (11 / 6) * (5 / 6) * GAMMA_FIVE_SIXTHS,
  // Γ(c − a − b) = Γ(11/6) = (5/6)Γ(5/6)
  cMinusAMinusB: (5 / 6) * GAMMA_FIVE_SIXTHS,
  // Γ(c − a) = Γ(11/3) = (8/3)(5/3)(2/3)Γ(2/3)
  cMinusA: (8 / 3) * (5 / 3) * (2 / 3) * 1.3541179394264005,
  // Γ(c − b) = Γ(1) = 1
  cMinusB: 1,
  // Γ(a + b − c) = Γ(−11/6) = Γ(1/6)/((−11/6)(−5/6))
  aPlusBMinusC: GAMMA_ONE_SIXTH / ((-11 / 6) * (-5 / 6)),
  // Γ(a) = Γ(−5/6)
  a: GAMMA_MINUS_FIVE_SIXTHS,
  // Γ(b) = Γ(11/6)
  b: (5 / 6) * GAMMA_FIVE_SIXTHS,
};
const CONNECTION_FIRST = (gammaOf.c * gammaOf.cMinusAMinusB) / (gammaOf.cMinusA * gammaOf.cMinusB);
const CONNECTION_SECOND = (gammaOf.c * gammaOf.aPlusBMinusC) / (gammaOf.a * gammaOf.b);

/** Complex Gauss series Σ (a)_n (b)_n/((c)_n n!) zⁿ for |z| < 1; returns [re, im]. */
function hypergeometricSeries(a: number, b: number, c: number, zRe: number, zIm: number): [number, number] {
  let termRe = 1;
  let termIm = 0;
  let sumRe = 1;
  let sumIm = 0;
  for (let n = 0; n < 5000; n++) {
    const factor = ((a + n) * (b + n)) / ((c + n) * (n + 1));
    const nextRe = factor * (termRe * zRe - termIm * zIm);
    const nextIm = factor * (termRe * zIm + termIm * zRe);
    termRe = nextRe;
    termIm = nextIm;
    sumRe += termRe;
    sumIm += termIm;
    // |term| < 1e-17·|sum| in squares (Math.hypot is several times slower, and nothing here overflows)
    if (termRe * termRe + termIm * termIm < 1e-34 * (sumRe * sumRe + sumIm * sumIm)) break;
  }
  return [sumRe, sumIm];
}

/** 2F1(−5/6, 11/6; 17/6; z) for min(|z|, |1 − z|) ≤ 0.8, by the series or the 1 − z connection formula. */
function hypergeometricRytov(zRe: number, zIm: number): [number, number] | undefined {
  if (Math.hypot(zRe, zIm) <= 0.8) return hypergeometricSeries(A, B, C, zRe, zIm);
  const wRe = 1 - zRe;
  const wIm = -zIm;
  if (Math.hypot(wRe, wIm) > 0.8) return undefined;
  const [f1Re, f1Im] = hypergeometricSeries(A, B, A + B - C + 1, wRe, wIm);
  const [f2Re, f2Im] = hypergeometricSeries(C - A, C - B, C - A - B + 1, wRe, wIm);
  // (1 − z)^(c − a − b), principal branch
  const exponent = C - A - B;
  const modulus = Math.pow(Math.hypot(wRe, wIm), exponent);
  const angle = exponent * Math.atan2(wIm, wRe);
  const pRe = modulus * Math.cos(angle);
  const pIm = modulus * Math.sin(angle);
  return [CONNECTION_FIRST * f1Re + CONNECTION_SECOND * (pRe * f2Re - pIm * f2Im), CONNECTION_FIRST * f1Im + CONNECTION_SECOND * (pRe * f2Im + pIm * f2Re)];
}

// i^(5/6) = cos(5π/12) + i sin(5π/12)
const I_POWER_FIVE_SIXTHS_RE = Math.cos((5 * Math.PI) / 12);
const I_POWER_FIVE_SIXTHS_IM = Math.sin((5 * Math.PI) / 12);

/** (4π²·0.033/1.23): prefactor of the normalised Rytov integral. */
const INTEGRAL_PREFACTOR = (4 * Math.PI * Math.PI * 0.033) / 1.23;

/**
 * Ratio between the hypergeometric form (constants 3.86 and 11/16) and the integral form (constants
 * 0.033 and 1.23) of σ_B²/σ_R²: both evaluate the same integral, with differently rounded constants.
 * It follows from the Λ^(5/6) terms: 3.86·(11/16) against −(4π²·0.033/1.23)·Γ(−5/6)·(3/8).
 */
export const GAUSSIAN_BEAM_RYTOV_FORM_RATIO = (3.86 * (11 / 16)) / (-INTEGRAL_PREFACTOR * GAMMA_MINUS_FIVE_SIXTHS * (3 / 8));

/**
 * σ_B²/σ_R² by numerical integration of the Rytov integral (Kolmogorov spectrum, constants 0.033 and 1.23):
 * (4π²·0.033/1.23)·∫0^1 Re{Γ(−5/6)[(Λξ²)^(5/6) − (Λξ² − iξ(1 − (1 − Θ)ξ))^(5/6)]} dξ. Valid for any Θ, Λ ≥ 0.
 *
 * @param theta Θ (output-plane curvature parameter; 1 plane wave, 0 spherical wave; negative past a focus)
 * @param lambda Λ ≥ 0 (output-plane Fresnel ratio)
 * @returns σ_B²/σ_R², dimensionless
 * @see Andrews & Phillips (2005), ch. 8 (weak-fluctuation Gaussian-beam scintillation) [derived form].
 */
export function gaussianBeamRytovRatioIntegral(theta: number, lambda: number): number {
  requireNonNegative('lambda', lambda);
  const integrand = (xi: number) => kolmogorovKernelReal(lambda * xi * xi, xi * (1 - (1 - theta) * xi));
  return INTEGRAL_PREFACTOR * integrate(integrand, 0, 1, { relativeTolerance: 1e-12, absoluteTolerance: 1e-16 });
}

/**
 * σ_B²/σ_R² on the beam axis by the exact hypergeometric form
 * 3.86·{Re[i^(5/6)·2F1(−5/6, 11/6; 17/6; (1 − Θ) + iΛ)] − (11/16)Λ^(5/6)}.
 * Collimated and divergent beams (Θ0 ≥ 1) always have min(|z|, |1 − z|) ≤ 0.71 and use the 2F1
 * series or its 1 − z connection formula; for converging beams outside that region the integral form
 * is scaled by {@link GAUSSIAN_BEAM_RYTOV_FORM_RATIO} (the same quantity).
 *
 * @param theta Θ (1 plane wave, 0 spherical wave)
 * @param lambda Λ ≥ 0
 * @returns σ_B²/σ_R², dimensionless (1 plane-wave limit, 0.40 spherical-wave limit)
 * @see Andrews & Phillips (2005), ch. 8 [equation from memory; checked against the integral to ~3e-4,
 *   the rounding of the constants].
 */
export function gaussianBeamRytovRatio(theta: number, lambda: number): number {
  requireNonNegative('lambda', lambda);
  const value = hypergeometricRytov(1 - theta, lambda);
  if (!value) return GAUSSIAN_BEAM_RYTOV_FORM_RATIO * gaussianBeamRytovRatioIntegral(theta, lambda);
  const real = I_POWER_FIVE_SIXTHS_RE * value[0] - I_POWER_FIVE_SIXTHS_IM * value[1];
  return 3.86 * (real - (11 / 16) * Math.pow(lambda, 5 / 6));
}

/**
 * The widely quoted approximation σ_B²/σ_R² ≈ 3.86{0.40[(1+2Θ)² + 4Λ²]^(5/12)·cos[(5/6)·atan((1+2Θ)/(2Λ))] − (11/16)Λ^(5/6)}.
 * Up to ~10 % off the exact form: shown for comparison only.
 *
 * @param theta Θ
 * @param lambda Λ ≥ 0
 * @returns σ_B²/σ_R² (approximate)
 * @see Andrews & Phillips (2005), ch. 8 [from memory].
 */
export function gaussianBeamRytovRatioApproximate(theta: number, lambda: number): number {
  requireNonNegative('lambda', lambda);
  return (
    3.86 *
    (0.4 * Math.pow((1 + 2 * theta) ** 2 + 4 * lambda * lambda, 5 / 12) * Math.cos((5 / 6) * Math.atan2(1 + 2 * theta, 2 * lambda)) -
      (11 / 16) * Math.pow(lambda, 5 / 6))
  );
}

/**
 * On-axis scintillation index of a Gaussian beam in all regimes (point receiver, no beam-wander term):
 * σ_I² = exp[0.49σ_B²/(1 + 0.56(1 + Θ)σ_B^(12/5))^(7/6) + 0.51σ_B²/(1 + 0.69σ_B^(12/5))^(5/6)] − 1.
 * Equals the spherical-wave form at Θ = 0 and is close to the plane-wave form at Θ = 1 (1.12 against 1.11).
 *
 * @param gaussianBeamRytov σ_B² ≥ 0 (σ_R² × {@link gaussianBeamRytovRatio})
 * @param theta Θ
 * @returns σ_I², dimensionless
 * @see Andrews & Phillips (2005), ch. 9 [from memory; verify].
 */
export function gaussianBeamScintillationIndex(gaussianBeamRytov: number, theta: number): number {
  requireNonNegative('gaussianBeamRytov', gaussianBeamRytov);
  const s125 = Math.pow(gaussianBeamRytov, 1.2);
  return Math.expm1(
    (0.49 * gaussianBeamRytov) / Math.pow(1 + 0.56 * (1 + theta) * s125, 7 / 6) + (0.51 * gaussianBeamRytov) / Math.pow(1 + 0.69 * s125, 5 / 6),
  );
}
