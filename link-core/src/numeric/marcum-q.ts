/**
 * Noncentral chi-square distribution with two degrees of freedom and the first-order Marcum Q
 * function, which describe a 2-D circular Gaussian (per-axis standard deviation σ) offset by ν:
 * the radius R of such a point is Rician, and P(R > r) = Q1(ν/σ, r/σ).
 */
import gammainc from '@stdlib/math-base-special-gammainc';
import gammaln from '@stdlib/math-base-special-gammaln';
import { besselI0Scaled } from './bessel.js';
import { integrate } from './quadrature.js';

/** Both tails of the noncentral chi-square (2 degrees of freedom) at one point. */
export interface NoncentralChiSquareTails {
  /** P(X ≤ x), in [0, 1]. */
  cdf: number;
  /** P(X > x), in [0, 1]; computed directly (not as 1 − cdf) when it is the smaller tail. */
  sf: number;
}

// Poisson-weighted sum of regularized incomplete gamma functions P(j+1, y) or Q(j+1, y), with weights
// e^(−μ) μ^j / j!, walked outwards from the Poisson mode so that no weight underflows prematurely.
function poissonMixture(mu: number, y: number, upper: boolean): number {
  if (mu === 0) return upper ? Math.exp(-y) : -Math.expm1(-y);
  const mode = Math.floor(mu);
  const modeWeight = Math.exp(-mu + mode * Math.log(mu) - gammaln(mode + 1));
  const gammaTail = (j: number): number => gammainc(y, j + 1, true, upper);
  let sum = modeWeight * gammaTail(mode);
  // Upwards: weights fall geometrically once j > μ; P(j+1, y) falls with j, Q(j+1, y) rises (≤ 1).
  let weight = modeWeight;
  for (let j = mode + 1; j < mode + 100000; j++) {
    weight *= mu / j;
    const term = weight * gammaTail(j);
    sum += term;
    const ratio = mu / (j + 1);
    const tailBound = upper ? (weight * ratio) / (1 - ratio) : term;
    if (tailBound <= 1e-17 * sum || weight === 0) break;
  }
  // Downwards: P(j+1, y) rises as j falls (≤ 1), Q(j+1, y) falls.
  weight = modeWeight;
  for (let j = mode - 1; j >= 0; j--) {
    weight *= (j + 1) / mu;
    const term = weight * gammaTail(j);
    sum += term;
    const ratio = j / mu;
    const tailBound = upper ? term : (weight * ratio) / (1 - ratio);
    if (tailBound <= 1e-17 * sum || weight === 0) break;
  }
  return sum;
}

/** Above this μ + y the fast series' starting weights e^(−μ), e^(−y) leave the normal doubles. */
const FAST_SERIES_EXPONENT_LIMIT = 650;

// 1/i for the series' first terms: a multiplication is cheaper than a division in the hot loop.
const RECIPROCALS = Float64Array.from({ length: 256 }, (_, i) => (i === 0 ? 0 : 1 / i));

/**
 * The smaller tail of the noncentral chi-square (2 degrees of freedom) for μ = λ/2 > 0 and
 * y = x/2 > 0 with μ + y ≤ 650: P(X ≤ x) when y < μ + 1, P(X > x) otherwise, by sums of positive
 * terms only:
 *   cdf = Σ_{i≥1} Pois(i; y)·P(N_μ ≤ i − 1),  sf = Σ_{j≥0} Pois(j; μ)·P(N_y ≤ j).
 * One exp, no special function; relative precision near machine epsilon down to ~1e-280.
 */
function smallerTailSeries(mu: number, y: number): number {
  // Both Poisson weights carry the common factor e^(−μ−y): sum without it (the sums stay below
  // e^(μ+y) ≤ e^650, inside the doubles) and apply it once at the end.
  const scale = Math.exp(-mu - y);
  if (y < mu + 1) {
    // cdf: Σ_{i≥1} Pois(i; y)·F_μ(i − 1). Term ratio ≤ ρ_i = y(1 + μ/i)/(i + 1), so once ρ < 1
    // the rest is below term·ρ/(1 − ρ).
    let poissonMu = 1;
    let cdfMu = 1;
    let poissonY = 1;
    let sum = 0;
    for (let i = 1; i < 100000; i++) {
      const inverse = i < RECIPROCALS.length ? RECIPROCALS[i]! : 1 / i;
      poissonY *= y * inverse;
      const term = poissonY * cdfMu;
      sum += term;
      // ρ < 1 and term·ρ ≤ 1e-17·(1 − ρ)·sum, multiplied out by i(i + 1) (no division)
      const growth = y * (i + mu);
      const room = i * (i + 1) - growth;
      if (room > 0 && term * growth <= 1e-17 * room * sum) break;
      poissonMu *= mu * inverse;
      cdfMu += poissonMu;
    }
    return sum * scale;
  }
  // sf: Σ_{j≥0} Pois(j; μ)·F_y(j). Term ratio ≤ ρ_j = μ(1 + y/(j+1))/(j+1), so once ρ < 1 the rest
  // is below term·ρ/(1 − ρ).
  let poissonMu = 1;
  let poissonY = 1;
  let cdfY = 1;
  let sum = 1;
  for (let j = 1; j < 100000; j++) {
    const inverse = j < RECIPROCALS.length ? RECIPROCALS[j]! : 1 / j;
    poissonMu *= mu * inverse;
    poissonY *= y * inverse;
    cdfY += poissonY;
    const term = poissonMu * cdfY;
    sum += term;
    // ρ < 1 and term·ρ ≤ 1e-17·(1 − ρ)·sum, multiplied out by (j + 1)² (no division)
    const growth = mu * (j + 1 + y);
    const room = (j + 1) * (j + 1) - growth;
    if (room > 0 && term * growth <= 1e-17 * room * sum) break;
  }
  return sum * scale;
}

/**
 * P(X ≤ x) of the noncentral chi-square with 2 degrees of freedom, by the positive-term series of
 * {@link noncentralChiSquare2TailsFast}: full relative precision when it is the smaller tail
 * (x/2 < λ/2 + 1), 1 minus the survival function otherwise. A plain number (nothing allocated);
 * NaN for λ/2 + x/2 > 650, where the caller falls back.
 *
 * @param x evaluation point, ≥ 0
 * @param noncentrality λ ≥ 0
 * @returns P(X ≤ x) in [0, 1], or NaN outside the fast domain
 * @see Johnson, Kotz & Balakrishnan (1995), ch. 29 (Poisson mixture); the reordering is derived.
 */
export function noncentralChiSquare2CdfFast(x: number, noncentrality: number): number {
  const mu = noncentrality / 2;
  const y = x / 2;
  if (y === 0) return 0;
  if (mu === 0) return -Math.expm1(-y);
  if (!(mu + y <= FAST_SERIES_EXPONENT_LIMIT)) return Number.NaN;
  const smaller = smallerTailSeries(mu, y);
  return y < mu + 1 ? smaller : 1 - smaller;
}

/**
 * P(X > x) of the noncentral chi-square with 2 degrees of freedom: Q1(√λ, √x). The counterpart of
 * {@link noncentralChiSquare2CdfFast} (full relative precision when it is the smaller tail).
 *
 * @param x evaluation point, ≥ 0
 * @param noncentrality λ ≥ 0
 * @returns P(X > x) in [0, 1], or NaN outside the fast domain
 * @see Johnson, Kotz & Balakrishnan (1995), ch. 29; Marcum (1960).
 */
export function noncentralChiSquare2SfFast(x: number, noncentrality: number): number {
  const mu = noncentrality / 2;
  const y = x / 2;
  if (y === 0) return 1;
  if (mu === 0) return Math.exp(-y);
  if (!(mu + y <= FAST_SERIES_EXPONENT_LIMIT)) return Number.NaN;
  const smaller = smallerTailSeries(mu, y);
  return y < mu + 1 ? 1 - smaller : smaller;
}

/**
 * Both tails of the noncentral chi-square (2 degrees of freedom) by sums of positive terms only,
 * with no special function but one exp per argument, for μ + y ≤ 650 (μ = λ/2, y = x/2):
 *   cdf = Σ_{i≥1} Pois(i; y)·P(N_μ ≤ i − 1),  sf = Σ_{j≥0} Pois(j; μ)·P(N_y ≤ j),
 * the Poisson-mixture form with the incomplete gamma of integer order written as a Poisson CDF
 * (P(j+1, y) = P(N_y > j)) and the double sum ordered so that both inner sums grow by additions.
 * The smaller tail is summed (relative precision near machine epsilon, down to ~1e-280); the other
 * is 1 minus it. NaN tails when outside the fast domain (the caller falls back). The hot paths use
 * {@link noncentralChiSquare2CdfFast} and {@link noncentralChiSquare2SfFast}, which return plain numbers.
 *
 * @param x evaluation point, ≥ 0
 * @param noncentrality λ ≥ 0
 * @returns `{ cdf, sf }` (a new object)
 * @see Johnson, Kotz & Balakrishnan (1995), ch. 29 (Poisson mixture); the reordering is derived.
 */
export function noncentralChiSquare2TailsFast(x: number, noncentrality: number): NoncentralChiSquareTails {
  const mu = noncentrality / 2;
  const y = x / 2;
  if (y === 0) return { cdf: 0, sf: 1 };
  if (mu === 0) return { cdf: -Math.expm1(-y), sf: Math.exp(-y) };
  if (!(mu + y <= FAST_SERIES_EXPONENT_LIMIT)) return { cdf: Number.NaN, sf: Number.NaN };
  const smaller = smallerTailSeries(mu, y);
  return y < mu + 1 ? { cdf: smaller, sf: 1 - smaller } : { cdf: 1 - smaller, sf: smaller };
}

/** Log tails of {@link logNoncentralChiSquare2TailsScaled}. */
export interface LogTails {
  /** ln P(X ≤ x) */
  logCdf: number;
  /** ln P(X > x) */
  logSf: number;
}
/** Past this the plain (unscaled) factor of the scaled series would leave the doubles. */
const SCALED_SERIES_PLAIN_LIMIT = 600;
const SCALED_SERIES_TERM_LIMIT = 1e6;
const RESCALE = 1e-250;
const LOG_RESCALE = 250 * Math.LN10;

/**
 * Natural logs of both tails of the noncentral chi-square (2 degrees of freedom), by the same
 * positive-term series as {@link noncentralChiSquare2TailsFast} summed with a running rescale, so
 * that it holds where e^(−μ−y) leaves the doubles (offsets or radii of tens to thousands of σ):
 * the smaller tail keeps full relative precision however small. Needs y ≤ 600 for the cdf branch
 * (y < μ + 1) and μ ≤ 600 for the sf branch, and μ + y ≤ 1e6; NaN tails outside, or −∞ where a
 * plain factor underflowed (the caller integrates instead). Returns a new object.
 * @see Johnson, Kotz & Balakrishnan (1995), ch. 29 (Poisson mixture); the reordering is derived.
 */
export function logNoncentralChiSquare2TailsScaled(x: number, noncentrality: number): LogTails {
  const mu = noncentrality / 2;
  const y = x / 2;
  if (!(mu + y <= SCALED_SERIES_TERM_LIMIT)) {
    // about √(μy) terms: past this the quadrature is the cheaper path
    return { logCdf: Number.NaN, logSf: Number.NaN };
  }
  if (y < mu + 1) {
    if (!(y <= SCALED_SERIES_PLAIN_LIMIT) || y === 0) {
      return y === 0 ? { logCdf: -Infinity, logSf: 0 } : { logCdf: Number.NaN, logSf: Number.NaN };
    }
    let poissonMu = 1;
    let cdfMu = 1;
    let poissonY = 1;
    let sum = 0;
    let logScale = 0;
    for (let i = 1; i < 1_000_000; i++) {
      poissonY *= y / i;
      const term = poissonY * cdfMu;
      sum += term;
      const growth = y * (i + mu);
      const room = i * (i + 1) - growth;
      if (room > 0 && term * growth <= 1e-17 * room * sum) break;
      poissonMu *= mu / i;
      cdfMu += poissonMu;
      if (cdfMu > 1e250) {
        cdfMu *= RESCALE;
        poissonMu *= RESCALE;
        sum *= RESCALE;
        logScale += LOG_RESCALE;
      }
    }
    const logCdf = Math.log(sum) + logScale - mu - y;
    return { logCdf, logSf: Math.log1p(-Math.exp(logCdf)) };
  }
  if (!(mu <= SCALED_SERIES_PLAIN_LIMIT)) {
    return { logCdf: Number.NaN, logSf: Number.NaN };
  }
  let poissonMu = 1;
  let poissonY = 1;
  let cdfY = 1;
  let sum = 1;
  let logScale = 0;
  for (let j = 1; j < 1_000_000; j++) {
    poissonMu *= mu / j;
    poissonY *= y / j;
    cdfY += poissonY;
    const term = poissonMu * cdfY;
    sum += term;
    const growth = mu * (j + 1 + y);
    const room = (j + 1) * (j + 1) - growth;
    if (room > 0 && term * growth <= 1e-17 * room * sum) break;
    if (cdfY > 1e250) {
      cdfY *= RESCALE;
      poissonY *= RESCALE;
      sum *= RESCALE;
      logScale += LOG_RESCALE;
    }
  }
  const logSf = Math.log(sum) + logScale - mu - y;
  return { logCdf: Math.log1p(-Math.exp(logSf)), logSf };
}

// The Rice density is about 1σ wide: split long intervals into panels of at most 2σ so that no
// narrow peak can fall between the nodes of a single coarse panel.
function integrateInUnitPanels(density: (t: number) => number, lower: number, upper: number): number {
  if (!(upper > lower)) return 0;
  const panels = Math.ceil((upper - lower) / 2);
  const width = (upper - lower) / panels;
  let sum = 0;
  for (let i = 0; i < panels; i++) {
    sum += integrate(density, lower + i * width, i === panels - 1 ? upper : lower + (i + 1) * width, { absoluteTolerance: 0, relativeTolerance: 1e-14 });
  }
  return sum;
}

/**
 * Both tails of the noncentral chi-square distribution with 2 degrees of freedom.
 *
 * Uses the Poisson mixture X ~ χ²(2 + 2J), J ~ Poisson(λ/2):
 * cdf = Σ_j e^(−λ/2)(λ/2)^j/j! · P(j+1, x/2). The smaller tail is summed directly (with the upper
 * regularized gamma for the survival function), so tails down to ~1e-300 keep full relative precision.
 * For λ/2 > 300 the Rice density is integrated numerically instead (same tails, bounded work), and
 * tails certain to be below ~1e-320 are returned as exactly 0 or 1.
 *
 * @param x evaluation point, ≥ 0 (dimensionless)
 * @param noncentrality λ ≥ 0 (dimensionless)
 * @returns `{ cdf, sf }`, each in [0, 1]
 * @see Johnson N.L., Kotz S., Balakrishnan N., "Continuous Univariate Distributions", vol. 2,
 *   2nd ed., Wiley (1995), ch. 29 (Poisson-mixture representation of the noncentral chi-square);
 *   Rice S.O., Bell Syst. Tech. J. 24, 46–156 (1945) (Rice density).
 */
export function noncentralChiSquare2Tails(x: number, noncentrality: number): NoncentralChiSquareTails {
  if (!(x >= 0) || !(noncentrality >= 0)) throw new RangeError('noncentralChiSquare2Tails: x and noncentrality must be ≥ 0');
  if (x === 0) return { cdf: 0, sf: 1 };
  if (x === Infinity) return { cdf: 1, sf: 0 };
  const mu = noncentrality / 2;
  const y = x / 2;
  // In Rician terms (offset a = sqrt(λ), radius b = sqrt(x), unit σ), |R − a| ≤ |V| with V a 2-D
  // standard normal, so each tail beyond a distance d from a is below exp(−d²/2): past d² > 1490
  // it underflows a double.
  const distance = Math.sqrt(x) - Math.sqrt(noncentrality);
  if (distance * distance > 1490) return distance > 0 ? { cdf: 1, sf: 0 } : { cdf: 0, sf: 1 };
  const cdfIsSmaller = y < mu + 1; // the mean of X/2 is μ + 1
  if (mu > 300) {
    // Large offsets: the Poisson series would need gamma functions of order > 1000, where
    // @stdlib/math-base-special-gammainc 0.3.1 was found to be wrong (P(1100, 1100) = 0.492 instead
    // of 0.504), and hundreds of terms; integrate the Rice density
    // t·exp(−(t − a)²/2)·i0e(a t) over the ±40σ band that holds all its mass instead.
    const a = Math.sqrt(noncentrality);
    const b = Math.sqrt(x);
    const density = (t: number): number => t * Math.exp(-0.5 * (t - a) * (t - a)) * besselI0Scaled(a * t);
    if (cdfIsSmaller) {
      const cdf = Math.min(1, integrateInUnitPanels(density, Math.max(0, a - 40), b));
      return { cdf, sf: 1 - cdf };
    }
    const sf = Math.min(1, integrateInUnitPanels(density, b, Math.max(a, b) + 40));
    return { cdf: 1 - sf, sf };
  }
  if (mu + y <= FAST_SERIES_EXPONENT_LIMIT) {
    const fast = noncentralChiSquare2TailsFast(x, noncentrality);
    return { cdf: Math.min(1, fast.cdf), sf: Math.min(1, fast.sf) };
  }
  if (cdfIsSmaller) {
    const cdf = Math.min(1, poissonMixture(mu, y, false));
    return { cdf, sf: 1 - cdf };
  }
  const sf = Math.min(1, poissonMixture(mu, y, true));
  return { cdf: 1 - sf, sf };
}

/**
 * First-order Marcum Q function Q1(a, b) = ∫_b^∞ t·exp(−(t² + a²)/2)·I0(a t) dt, the probability
 * that a Rician variable with offset a and unit per-axis deviation exceeds b.
 *
 * @param a offset over σ, ≥ 0 (dimensionless)
 * @param b threshold over σ, ≥ 0 (dimensionless)
 * @returns Q1(a, b) in [0, 1]; exp(−b²/2) when a = 0
 * @see Marcum J.I., "A statistical theory of target detection by pulsed radar", IRE Trans.
 *   Inf. Theory IT-6(2), 59–267 (1960); Q1(a, b) = P(χ'²(2, a²) > b²).
 */
export function marcumQ1(a: number, b: number): number {
  if (!(a >= 0) || !(b >= 0)) throw new RangeError('marcumQ1: arguments must be ≥ 0');
  if (a === 0) return Math.exp(-0.5 * b * b);
  return noncentralChiSquare2Tails(b * b, a * a).sf;
}

/**
 * 1 − Q1(a, b), computed without cancellation when it is small.
 *
 * @param a offset over σ, ≥ 0
 * @param b radius over σ, ≥ 0
 * @returns P(Rician ≤ b) in [0, 1]
 * @see {@link marcumQ1}
 */
export function marcumQ1Complement(a: number, b: number): number {
  if (!(a >= 0) || !(b >= 0)) throw new RangeError('marcumQ1Complement: arguments must be ≥ 0');
  if (a === 0) return -Math.expm1(-0.5 * b * b);
  return noncentralChiSquare2Tails(b * b, a * a).cdf;
}
