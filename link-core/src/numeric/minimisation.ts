/**
 * Bracketed one-dimensional minimisation (Brent's method: golden-section search with parabolic
 * interpolation), for the design solvers' refinements (METHODS.md §12.6).
 */

/** Options of {@link minimiseBrent}. */
export interface MinimisationOptions {
  /**
   * Absolute tolerance on x, added to the relative tolerance √ε·|x| of Brent's method (default
   * 1e-12 of the bracket width).
   */
  xTolerance?: number;
  /** Maximum function evaluations after the first (default 200). */
  maxIterations?: number;
}

/** Result of {@link minimiseBrent}. */
export interface Minimum {
  /** abscissa of the smallest value found, inside [lower, upper] */
  x: number;
  /** f(x) */
  value: number;
}

/** (3 − √5)/2: the golden-section step as a fraction of the larger part of the bracket. */
const GOLDEN_SECTION_STEP = 0.3819660112501051;
/** √ε of double precision: Brent's relative tolerance, below which a parabolic step cannot resolve a minimum. */
const RELATIVE_TOLERANCE = Math.sqrt(Number.EPSILON);

/**
 * Finds a local minimum of f on [lower, upper]. For a unimodal f this is the minimum on the bracket;
 * otherwise it is one of the local minima (callers that cannot rule out several scan first and
 * bracket each candidate). Never evaluates f outside the bracket; converges superlinearly where f
 * is smooth and at least as fast as golden-section search where it is not (a kink).
 *
 * @param f function of one variable (any unit)
 * @param lower bracket start, finite
 * @param upper bracket end, finite, > lower
 * @param options absolute tolerance on x and the iteration limit
 * @returns the minimiser and the value there
 * @throws RangeError when the bracket is not a finite interval with lower < upper
 * @see Brent R.P., "Algorithms for Minimization without Derivatives", Prentice-Hall (1973), ch. 5
 *   (procedure localmin).
 */
export function minimiseBrent(f: (x: number) => number, lower: number, upper: number, options: MinimisationOptions = {}): Minimum {
  if (!Number.isFinite(lower) || !Number.isFinite(upper) || !(lower < upper)) {
    throw new RangeError(`minimiseBrent: the bracket must be finite with lower < upper (got ${lower}, ${upper})`);
  }
  const absoluteTolerance = options.xTolerance ?? 1e-12 * (upper - lower);
  const maxIterations = options.maxIterations ?? 200;
  let a = lower;
  let b = upper;
  let x = a + GOLDEN_SECTION_STEP * (b - a);
  let w = x;
  let v = x;
  let fx = f(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const middle = 0.5 * (a + b);
    const tolerance = RELATIVE_TOLERANCE * Math.abs(x) + absoluteTolerance;
    const twiceTolerance = 2 * tolerance;
    if (Math.abs(x - middle) <= twiceTolerance - 0.5 * (b - a)) break;
    let parabolic = false;
    if (Math.abs(e) > tolerance) {
      // Fit a parabola through x, w, v; take its vertex when it lies well inside the bracket and
      // the step is less than half the step before last (Brent's safeguard against cycling).
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < twiceTolerance || b - u < twiceTolerance) d = x < middle ? tolerance : -tolerance;
        parabolic = true;
      }
    }
    if (!parabolic) {
      e = (x < middle ? b : a) - x;
      d = GOLDEN_SECTION_STEP * e;
    }
    const u = x + (Math.abs(d) >= tolerance ? d : d > 0 ? tolerance : -tolerance);
    const fu = f(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, value: fx };
}
