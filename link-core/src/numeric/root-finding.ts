/**
 * Bracketing root finder (Brent's method: inverse quadratic interpolation, secant and bisection).
 */

/** Options of {@link findRootBrent}. */
export interface RootFindingOptions {
  /** Absolute tolerance on x (default 1e-14·max(1, |x|) is used when omitted). */
  xTolerance?: number;
  /** Maximum iterations (default 200). */
  maxIterations?: number;
}

/**
 * Finds x in [lower, upper] with f(x) = 0, given f(lower) and f(upper) of opposite signs
 * (or one of them zero). Converges superlinearly and never leaves the bracket.
 *
 * @param f continuous function of one variable
 * @param lower bracket end (any unit)
 * @param upper other bracket end
 * @returns the root, in the unit of the bracket
 * @throws RangeError when the bracket does not change sign
 * @see Brent R.P., "Algorithms for Minimization without Derivatives", Prentice-Hall (1973), ch. 4.
 */
export function findRootBrent(f: (x: number) => number, lower: number, upper: number, options: RootFindingOptions = {}): number {
  const maxIterations = options.maxIterations ?? 200;
  let a = lower;
  let b = upper;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(fa * fb < 0)) throw new RangeError(`findRootBrent: f(${lower}) and f(${upper}) do not bracket a root`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tolerance = options.xTolerance ?? 2 * Number.EPSILON * Math.max(1, Math.abs(b));
    const half = 0.5 * (c - b);
    if (Math.abs(half) <= tolerance || fb === 0) return b;
    if (Math.abs(e) >= tolerance && Math.abs(fa) > Math.abs(fb)) {
      // Interpolate: secant when only two points are distinct, inverse quadratic otherwise.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * half * q - Math.abs(tolerance * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = d;
      }
    } else {
      d = half;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tolerance ? d : half > 0 ? tolerance : -tolerance;
    fb = f(b);
  }
  return b;
}
