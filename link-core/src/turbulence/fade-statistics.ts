/**
 * Irradiance statistics of a scintillating link: gamma-gamma and log-normal CDF, pdf and lower
 * quantile, and the fade margin F = −10·log10(I_T/⟨I⟩) with P(I < I_T) = p.
 *
 * The gamma-gamma CDF is evaluated exactly, without the cancellation of the 1F2 series, from the
 * product form I = X·Y, X ~ Gamma(m, 1/m), Y ~ Gamma(a, 1/a), m = max(α, β), a = min(α, β):
 *   F(x) = ∫ f_lnX(s) · P(a, a·x·e^(−s)) ds,
 * integrated with the trapezoid rule in s = ln X. The integrand is smooth and log-concave (a product
 * of a log-gamma density and a log-gamma CDF), so the rule converges geometrically and the grid can
 * stop when the integrand has fallen 15 decades below its peak. The same pass yields x·f(x) and
 * x²·f′(x), so the quantile uses Halley's method on ln F(e^t) = ln p from a Cornish–Fisher start
 * (exact cumulants of ln I from polygamma functions): one pass for weak or aperture-averaged
 * scintillation, two or three in strong turbulence.
 * The 1F2 series (METHODS.md §6.9) is kept beside it as an independent cross-check.
 */
import erfc from '@stdlib/math-base-special-erfc';
import gamma from '@stdlib/math-base-special-gamma';
import gammaincinv from '@stdlib/math-base-special-gammaincinv';
import gammaln from '@stdlib/math-base-special-gammaln';
import { requireOpenUnitInterval, requirePositive } from '../numeric/input-guards.js';
import { DB_PER_NATURAL_LOG_POWER } from '../units/constants.js';
import { standardNormalQuantile } from '../numeric/normal.js';
import { digamma, pentagamma, tetragamma, trigamma } from '../numeric/polygamma.js';

/**
 * Above this value of min(α, β) the gamma-gamma fade margin uses the log-normal law with the same
 * scintillation index (σ_I² < ~0.005; the difference is ≪ 0.01 dB), as the project's reference
 * computations do (METHODS.md §6.9).
 * Below it a smooth blend towards the gamma-gamma law begins (GAMMA_GAMMA_LOGNORMAL_BLEND_START).
 */
export const GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT = 500;

/**
 * From this min(α, β) up to GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT the gamma-gamma and log-normal
 * thresholds are blended smoothly (the laws differ by 0.01–0.03 dB there: a hard switch would show
 * as a step in a sweep and could trap a solver).
 */
export const GAMMA_GAMMA_LOGNORMAL_BLEND_START = 250;

/**
 * What one quadrature pass finds. Each caller owns one (a quantile search reuses its own across
 * passes), so nothing is carried from one call of the module to the next.
 */
interface QuadraturePass {
  /** F(x) */
  cdf: number;
  /** x·f(x) */
  slope: number;
  /** x²·f′(x) */
  curvature: number;
  /** node s = ln X where the integrand peaked (the next pass starts there) */
  peakS: number;
  /** nodes evaluated */
  nodes: number;
}

function newQuadraturePass(): QuadraturePass {
  return { cdf: 0, slope: 0, curvature: 0, peakS: 0, nodes: 0 };
}

const RELATIVE_CUTOFF = 1e-15;
const MAX_NODES_PER_SIDE = 4000;

/**
 * One trapezoid pass at x for shapes m ≥ a (lnGammaM = lnΓ(m), lnGammaA = lnΓ(a)), starting at s0.
 * Writes its findings into `out`.
 */
function quadraturePass(out: QuadraturePass, x: number, m: number, a: number, lnGammaM: number, lnGammaA: number, s0: number): void {
  const h = Math.min(0.25, 0.7 / Math.sqrt(m + a));
  const logDensityConstant = m * Math.log(m) - lnGammaM;
  const logAx = Math.log(a * x);
  let cdfSum = 0;
  let slopeSum = 0;
  let curvatureSum = 0;
  let peak = 0;
  let peakS = s0;
  let nodes = 0;
  for (let direction = 1; direction >= -1; direction -= 2) {
    let j = direction === 1 ? 0 : -1;
    let previous = Infinity;
    for (let count = 0; count < MAX_NODES_PER_SIDE; count++, j += direction) {
      const s = s0 + j * h;
      const es = Math.exp(s);
      const logDensity = logDensityConstant + m * s - m * es;
      const y = (a * x) / es;
      const logE = logDensity + a * (logAx - s) - y - lnGammaA;
      const e = Math.exp(logE); // f_lnX(s)·y^a·e^(−y)/Γ(a)
      let cdfTerm: number;
      if (y < a + 1) {
        // P(a, y) = y^a e^(−y)/Γ(a+1) · Σ y^n/((a+1)…(a+n))
        let term = 1;
        let sum = 1;
        let denominator = a;
        for (let n = 0; n < 2000; n++) {
          denominator += 1;
          term *= y / denominator;
          sum += term;
          if (term < sum * 1e-14) break;
        }
        cdfTerm = (e / a) * sum;
      } else {
        // Q(a, y) by the modified Lentz continued fraction; P = 1 − Q.
        const tiny = 1e-300;
        let b = y + 1 - a;
        let c = 1 / tiny;
        let d = 1 / b;
        let fraction = d;
        for (let i = 1; i < 2000; i++) {
          const an = -i * (i - a);
          b += 2;
          d = an * d + b;
          if (Math.abs(d) < tiny) d = tiny;
          c = b + an / c;
          if (Math.abs(c) < tiny) c = tiny;
          d = 1 / d;
          const delta = d * c;
          fraction *= delta;
          if (Math.abs(delta - 1) < 1e-14) break;
        }
        cdfTerm = Math.exp(logDensity) - e * fraction;
      }
      nodes++;
      cdfSum += cdfTerm;
      slopeSum += e;
      curvatureSum += e * (a - 1 - y);
      const size = cdfTerm > e ? cdfTerm : e;
      if (size > peak) {
        peak = size;
        peakS = s;
      }
      if (size < RELATIVE_CUTOFF * peak && size <= previous) break;
      // Underflow beyond the right tail of the density (X = e^s > e): nothing more to find that way.
      if (size === 0 && direction === 1 && s > 1) break;
      previous = size;
    }
  }
  out.cdf = h * cdfSum;
  out.slope = h * slopeSum;
  out.curvature = h * curvatureSum;
  out.peakS = peakS;
  out.nodes = nodes;
}

/** Predicted centre of the integrand in s = ln X for threshold ln x (normal approximation of ln X and ln Y). */
function startingCentre(logX: number, m: number, a: number): number {
  const meanX = -0.5 / m;
  const meanY = -0.5 / a;
  const varianceX = 1 / m;
  const varianceY = 1 / a;
  const centre = meanX + (varianceX / (varianceX + varianceY)) * (logX - meanX - meanY);
  return Math.max(Math.min(centre, 2), logX - 5);
}

function validateShapes(alpha: number, beta: number): void {
  // Infinity is allowed: an infinite shape is a non-fluctuating factor (e.g. zero Rytov variance).
  if (!(alpha > 0)) throw new RangeError(`alpha: must be greater than 0 (got ${String(alpha)})`);
  if (!(beta > 0)) throw new RangeError(`beta: must be greater than 0 (got ${String(beta)})`);
}

/**
 * Gamma-gamma cumulative distribution F(x) = P(I/⟨I⟩ < x), by the product-form quadrature.
 *
 * @param x normalised irradiance I/⟨I⟩ ≥ 0
 * @param alpha large-scale parameter α > 0
 * @param beta small-scale parameter β > 0
 * @returns F(x) in [0, 1], relative accuracy ~1e-10 in the lower tail
 * @see Al-Habash M.A., Andrews L.C., Phillips R.L., "Mathematical model for the irradiance
 *   probability density function of a laser beam propagating through turbulent media", Optical
 *   Engineering 40(8), 1554–1562 (2001) (I = X·Y with gamma-distributed X, Y).
 */
export function gammaGammaCdf(x: number, alpha: number, beta: number): number {
  validateShapes(alpha, beta);
  if (!(x >= 0)) throw new RangeError(`x: must be 0 or more (got ${x})`);
  if (x === 0) return 0;
  if (x === Infinity) return 1;
  const m = Math.max(alpha, beta);
  const a = Math.min(alpha, beta);
  const pass = newQuadraturePass();
  quadraturePass(pass, x, m, a, gammaln(m), gammaln(a), startingCentre(Math.log(x), m, a));
  return Math.min(pass.cdf, 1);
}

/**
 * Gamma-gamma probability density f(x) = 2(αβ)^((α+β)/2)/(Γ(α)Γ(β)) · x^((α+β)/2−1) · K_(α−β)(2·sqrt(αβx)),
 * evaluated by the same product-form quadrature (no Bessel function needed).
 *
 * @param x normalised irradiance I/⟨I⟩ > 0
 * @param alpha α > 0
 * @param beta β > 0
 * @returns f(x) [per unit of I/⟨I⟩], ≥ 0
 * @see Al-Habash, Andrews & Phillips, Opt. Eng. 40(8), 1554–1562 (2001), eq. 13 [equation number from memory].
 */
export function gammaGammaPdf(x: number, alpha: number, beta: number): number {
  validateShapes(alpha, beta);
  requirePositive('x', x);
  const m = Math.max(alpha, beta);
  const a = Math.min(alpha, beta);
  const pass = newQuadraturePass();
  quadraturePass(pass, x, m, a, gammaln(m), gammaln(a), startingCentre(Math.log(x), m, a));
  return pass.slope / x;
}

/**
 * Gamma-gamma CDF by the 1F2 series (METHODS.md §6.9), written term by term:
 * F(x) = π/(sin(π(α−β))Γ(α)Γ(β)) Σ_n [ z^(n+β)/((n+β)·n!·Γ(n+β−α+1)) − z^(n+α)/((n+α)·n!·Γ(n+α−β+1)) ], z = αβx.
 * Exact but cancels badly for large z (loses about 2·sqrt(z)/ln 10 digits) and needs α − β away from
 * an integer: use it as a cross-check for small z, not in general.
 *
 * @param x normalised irradiance ≥ 0
 * @param alpha α > 0
 * @param beta β > 0, with α − β not an integer
 * @returns F(x)
 * @see Al-Habash, Andrews & Phillips (2001); Meijer-G to 1F2 reduction (Luke Y.L., "The Special
 *   Functions and Their Approximations", Academic Press 1969, §5.2) [from memory].
 */
export function gammaGammaCdfSeries(x: number, alpha: number, beta: number): number {
  validateShapes(alpha, beta);
  const z = alpha * beta * x;
  if (z === 0) return 0;
  const seriesPart = (first: number, second: number): number => {
    // Σ z^(n+first) / ((n+first)·n!·Γ(n+first−second+1))
    let term = Math.pow(z, first) / gamma(first - second + 1);
    let sum = term / first;
    for (let n = 0; n < 5000; n++) {
      term *= z / ((n + 1) * (n + first - second + 1));
      const add = term / (n + 1 + first);
      sum += add;
      if (Math.abs(add) < 1e-17 * Math.abs(sum) && n > z) break;
    }
    return sum;
  };
  const prefactor = Math.PI / (Math.sin(Math.PI * (alpha - beta)) * gamma(alpha) * gamma(beta));
  return prefactor * (seriesPart(beta, alpha) - seriesPart(alpha, beta));
}

/**
 * Allocation-free lower quantile of the gamma-gamma law: the normalised threshold x = I_T/⟨I⟩ with
 * F(x) = p. Halley's method on ln F(e^t) = ln p with a bracket safeguard; typically 2–3 quadrature
 * passes. For min(α, β) ≥ 500 the log-normal quantile with the same σ_I² is returned, blended smoothly from 250.
 *
 * @param alpha α > 0
 * @param beta β > 0
 * @param probability p in (0, 1)
 * @returns I_T/⟨I⟩ > 0
 * @see Al-Habash, Andrews & Phillips (2001); Halley's method (common practice).
 */
export function gammaGammaQuantile(alpha: number, beta: number, probability: number): number {
  return gammaGammaQuantileSearch(alpha, beta, probability, HALLEY_STOP_STEP).threshold;
}

/** A gamma-gamma quantile with the work its search took (diagnostics for tests and benchmarks). */
export interface GammaGammaQuantileSearch {
  /** I_T/⟨I⟩ with F(I_T/⟨I⟩) = p, > 0 */
  threshold: number;
  /** quadrature passes the search took (0 where the log-normal law or a gamma law answers in closed form) */
  passes: number;
  /**
   * ln x0 the search started from (Cornish–Fisher estimate; NaN without a search)
   * @see Cornish E.A., Fisher R.A., "Moments and cumulants in the specification of distributions",
   *   Revue de l'Institut International de Statistique 5, 307–320 (1937).
   */
  startLogThreshold: number;
  /** nodes of the last quadrature pass (0 without a pass) */
  lastPassNodes: number;
}

/**
 * Most quadrature passes one quantile may take. Measured: at most 3 over shapes 0.5 … 500 and
 * p = 1e-100 … 0.5 (fade-tail.test.ts asserts ≤ 12 there); a pass costs microseconds, well under a
 * millisecond even far in the tail.
 */
const MAX_QUANTILE_PASSES = 60;

/** Largest |Φ⁻¹(p)| for which the quantile search starts from the Cornish–Fisher expansion. */
const CORNISH_FISHER_MAX_Z = 6;

/**
 * Halley converges cubically (error after a step ≈ K·step³ with K of order one for ln F against ln x),
 * so a step below 2e-3 in ln x leaves an error of order 1e-8 (≈ 4e-8 dB): the search stops there.
 * The unit tests check this against a fully converged search over a grid of α, β and p.
 */
const HALLEY_STOP_STEP = 2e-3;

/**
 * Gamma-gamma quantile with an explicit stopping step in ln x (internal; the tests use a tiny step
 * to obtain a fully converged reference).
 *
 * @param alpha α > 0
 * @param beta β > 0
 * @param probability p in (0, 1)
 * @param stopStep stop once a Halley step in ln x is below this size (e.g. 2e-3; 1e-13 for full convergence)
 * @returns I_T/⟨I⟩ > 0
 * @see Al-Habash, Andrews & Phillips (2001); Halley's method (common practice).
 */
export function gammaGammaQuantileWithStop(alpha: number, beta: number, probability: number, stopStep: number): number {
  return gammaGammaQuantileSearch(alpha, beta, probability, stopStep).threshold;
}

/**
 * The gamma-gamma quantile search itself, returning the threshold with its diagnostics (the
 * functions above return only the threshold).
 *
 * @param alpha α > 0
 * @param beta β > 0
 * @param probability p in (0, 1)
 * @param stopStep stop once a Halley step in ln x is below this size (default 2e-3, as the fade margin uses)
 * @returns the threshold I_T/⟨I⟩ and the passes, start and nodes of the search
 * @see Al-Habash, Andrews & Phillips (2001); Halley's method (common practice).
 */
export function gammaGammaQuantileSearch(alpha: number, beta: number, probability: number, stopStep: number = HALLEY_STOP_STEP): GammaGammaQuantileSearch {
  if (Math.min(alpha, beta) > GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT) {
    const scintillationIndex = 1 / alpha + 1 / beta + 1 / (alpha * beta);
    return closedFormQuantile(Math.exp(-fadeMarginLognormalDb(scintillationIndex, probability) / DB_PER_NATURAL_LOG_POWER));
  }
  const m = alpha > beta ? alpha : beta;
  const a = alpha > beta ? beta : alpha;
  // One factor does not fluctuate: I is Gamma(a, 1/a) distributed.
  if (m === Infinity) return closedFormQuantile(gammaincinv(probability, a) / a);
  const lnGammaM = gammaln(m);
  const lnGammaA = gammaln(a);
  // Cornish–Fisher start from the exact cumulants of ln I = ln X + ln Y.
  const mean = digamma(alpha) + digamma(beta) - Math.log(alpha * beta);
  const variance = trigamma(alpha) + trigamma(beta);
  const skewness = (tetragamma(alpha) + tetragamma(beta)) / Math.pow(variance, 1.5);
  const excessKurtosis = (pentagamma(alpha) + pentagamma(beta)) / (variance * variance);
  const zp = standardNormalQuantile(probability);
  const zp2 = zp * zp;
  const cornishFisher =
    zp + ((zp2 - 1) * skewness) / 6 + ((zp2 * zp - 3 * zp) * excessKurtosis) / 24 - ((2 * zp2 * zp - 5 * zp) * skewness * skewness) / 36;
  // Far in the tail (|z| > 6, p < 1e-9) or for very skewed ln I (a shape below about 1) the
  // Cornish–Fisher polynomial runs away (its z² and z³ terms outgrow z): start from the normal
  // approximation of ln I there and let the concave search walk down the power-law tail.
  const trustCornishFisher = Math.abs(zp) <= CORNISH_FISHER_MAX_Z && Math.abs(cornishFisher - zp) <= 0.5 * Math.abs(zp);
  let t = mean + Math.sqrt(variance) * (trustCornishFisher ? cornishFisher : zp);
  if (!Number.isFinite(t)) t = mean + Math.sqrt(variance) * zp;
  // A start at ±Infinity (a quantile of p rounded to 0 or 1) would never move: fall back to the median region.
  if (!Number.isFinite(t)) t = mean;
  const startLogThreshold = t;
  const logP = Math.log(probability);
  let lower = -Infinity;
  let upper = Infinity;
  let centre = startingCentre(t, m, a);
  let passes = 0;
  const pass = newQuadraturePass();
  // ln F(e^t) is concave in t: ln I is the sum of two log-gamma variables, whose densities are
  // log-concave; a convolution of log-concave densities is log-concave, and so is its CDF (Bagnoli
  // M., Bergstrom T., "Log-concave probability and its applications", Economic Theory 26, 445–469
  // (2005) [from memory]). The safeguarded Halley/Newton search therefore converges from any
  // finite start; the cap only bounds the work of one call.
  for (let iteration = 0; iteration < MAX_QUANTILE_PASSES; iteration++) {
    passes++;
    const x = Math.exp(t);
    let f = 0;
    // x = 0 (t below about −745): F is 0 without a pass, which would find no peak to stop at.
    if (x > 0) {
      quadraturePass(pass, x, m, a, lnGammaM, lnGammaA, centre);
      centre = pass.peakS;
      f = pass.cdf;
    }
    if (!(f > 0)) {
      // F underflowed: the root lies above t. Halve the way to the bracket's top, or to the mean of ln I.
      lower = t;
      t = Number.isFinite(upper) ? 0.5 * (t + upper) : Math.max(t + 2, 0.5 * (t + mean));
      continue;
    }
    const phi = Math.log(f) - logP;
    if (phi < 0) lower = t;
    else upper = t;
    const d1 = pass.slope / f;
    const d2 = (pass.slope + pass.curvature) / f - d1 * d1;
    let step = -phi / d1;
    // Halley's correction when it is well conditioned; then the cubic stop rule applies, otherwise
    // (Newton, bisection or a clamped step) only a much smaller step counts as converged.
    let cubic = false;
    const halleyDenominator = d1 - (phi * d2) / (2 * d1);
    if (halleyDenominator > 0.5 * d1 && halleyDenominator < 2 * d1) {
      step = -phi / halleyDenominator;
      cubic = true;
    }
    if (!Number.isFinite(step)) {
      step = phi < 0 ? 1 : -1;
      cubic = false;
    }
    let next = t + step;
    if (next <= lower || next >= upper) {
      next = Number.isFinite(lower) && Number.isFinite(upper) ? 0.5 * (lower + upper) : t + Math.sign(step) * Math.min(Math.abs(step), 3);
      cubic = false;
    }
    if (Math.abs(next - t) < (cubic ? stopStep : Math.min(stopStep, 1e-9))) {
      t = next;
      break;
    }
    t = next;
  }
  return { threshold: Math.exp(t), passes, startLogThreshold, lastPassNodes: pass.nodes };
}

function closedFormQuantile(threshold: number): GammaGammaQuantileSearch {
  return { threshold, passes: 0, startLogThreshold: Number.NaN, lastPassNodes: 0 };
}

/**
 * Allocation-free gamma-gamma fade margin −10·log10(I_T/⟨I⟩) with P(I < I_T) = p; for
 * 250 < min(α, β) < 500 blended smoothly into the log-normal margin that applies above 500.
 *
 * @param alpha α > 0
 * @param beta β > 0
 * @param probability p in (0, 1)
 * @returns fade margin [dB] below the mean irradiance; positive for the small p of link design
 * @see Al-Habash, Andrews & Phillips (2001); METHODS.md §6.9.
 */
export function fadeMarginGammaGammaDb(alpha: number, beta: number, probability: number): number {
  const smallerShape = Math.min(alpha, beta);
  let margin: number;
  if (smallerShape > GAMMA_GAMMA_LOGNORMAL_BLEND_START && smallerShape < GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT) {
    // Between the two shapes the margins of the two laws are blended by a quintic smoothstep in
    // ln min(α, β): no step where the law changes (and a continuous slope and curvature).
    const t = Math.log(smallerShape / GAMMA_GAMMA_LOGNORMAL_BLEND_START) / Math.log(GAMMA_GAMMA_LOGNORMAL_SHAPE_LIMIT / GAMMA_GAMMA_LOGNORMAL_BLEND_START);
    const weight = t * t * t * (10 + t * (6 * t - 15));
    const lognormal = fadeMarginLognormalDb(1 / alpha + 1 / beta + 1 / (alpha * beta), probability);
    margin = (1 - weight) * -10 * Math.log10(gammaGammaQuantile(alpha, beta, probability)) + weight * lognormal;
  } else {
    margin = -10 * Math.log10(gammaGammaQuantile(alpha, beta, probability));
  }
  return margin === 0 ? 0 : margin; // no −0 for a non-fluctuating beam
}

/**
 * Allocation-free log-normal fade margin: with σ² = ln(1 + σ_I²) and ⟨I⟩ = 1,
 * ln I_T = −σ²/2 + σ·Φ⁻¹(p) and F = −4.3429·ln I_T.
 *
 * @param scintillationIndex σ_I² ≥ 0 (dimensionless)
 * @param probability p in (0, 1)
 * @returns fade margin [dB] below the mean; 0 when σ_I² = 0
 * @see Andrews & Phillips (2005), ch. 11–12 (log-normal irradiance) [from memory].
 */
export function fadeMarginLognormalDb(scintillationIndex: number, probability: number): number {
  if (scintillationIndex === 0) return 0;
  const logVariance = Math.log1p(scintillationIndex);
  const logThreshold = -logVariance / 2 + Math.sqrt(logVariance) * standardNormalQuantile(probability);
  return -DB_PER_NATURAL_LOG_POWER * logThreshold;
}

/**
 * Log-normal irradiance CDF with ⟨I⟩ = 1: ln I ~ N(−σ²/2, σ²), σ² = ln(1 + σ_I²).
 *
 * @param x normalised irradiance I/⟨I⟩ ≥ 0
 * @param scintillationIndex σ_I² > 0
 * @returns P(I/⟨I⟩ < x) in [0, 1]
 * @see Andrews & Phillips (2005), ch. 11 (log-normal model, weak fluctuations) [from memory].
 */
export function lognormalIrradianceCdf(x: number, scintillationIndex: number): number {
  requirePositive('scintillationIndex', scintillationIndex);
  if (!(x >= 0)) throw new RangeError(`x: must be 0 or more (got ${x})`);
  if (x === 0) return 0;
  const logVariance = Math.log1p(scintillationIndex);
  return 0.5 * erfc(-(Math.log(x) + logVariance / 2) / Math.sqrt(2 * logVariance));
}

/**
 * Log-normal irradiance pdf with ⟨I⟩ = 1.
 *
 * @param x normalised irradiance I/⟨I⟩ > 0
 * @param scintillationIndex σ_I² > 0
 * @returns f(x) ≥ 0
 * @see Andrews & Phillips (2005), ch. 11 [from memory].
 */
export function lognormalIrradiancePdf(x: number, scintillationIndex: number): number {
  requirePositive('x', x);
  requirePositive('scintillationIndex', scintillationIndex);
  const logVariance = Math.log1p(scintillationIndex);
  const u = Math.log(x) + logVariance / 2;
  return Math.exp((-u * u) / (2 * logVariance)) / (x * Math.sqrt(2 * Math.PI * logVariance));
}

/** Input of {@link fadeMarginDb}: gamma-gamma parameters or a log-normal scintillation index. */
export type FadeMarginInput =
  | { model: 'gamma-gamma'; alpha: number; beta: number; probability: number }
  | { model: 'lognormal'; scintillationIndex: number; probability: number };

/**
 * Scintillation fade margin below the mean irradiance for a target fade probability p:
 * F = −10·log10(I_T/⟨I⟩) with P(I < I_T) = p, for the gamma-gamma law (default choice of the
 * project; log-normal with the same σ_I² when min(α, β) > 500) or the log-normal law.
 *
 * @param input `{ model: 'gamma-gamma', alpha > 0, beta > 0, probability in (0, 1) }` or
 *   `{ model: 'lognormal', scintillationIndex ≥ 0, probability in (0, 1) }`
 * @returns fade margin [dB]: positive for p below the median, larger for smaller p
 * @see Al-Habash, Andrews & Phillips, Opt. Eng. 40(8), 1554–1562 (2001); Andrews & Phillips (2005),
 *   ch. 11–12. Show it as an estimate (±2 dB; METHODS.md §6.6).
 */
export function fadeMarginDb(input: FadeMarginInput): number {
  requireOpenUnitInterval('probability', input.probability);
  if (input.model === 'lognormal') {
    if (!(input.scintillationIndex >= 0) || !Number.isFinite(input.scintillationIndex)) {
      throw new RangeError(`scintillationIndex: must be a finite number ≥ 0 (got ${String(input.scintillationIndex)})`);
    }
    return fadeMarginLognormalDb(input.scintillationIndex, input.probability);
  }
  if (input.model !== 'gamma-gamma') throw new RangeError(`model: must be 'gamma-gamma' or 'lognormal' (got ${String((input as { model: unknown }).model)})`);
  validateShapes(input.alpha, input.beta);
  return fadeMarginGammaGammaDb(input.alpha, input.beta, input.probability);
}
