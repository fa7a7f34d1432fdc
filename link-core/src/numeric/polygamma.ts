/**
 * Digamma, trigamma, tetragamma and pentagamma for x > 0 (recurrence to x ≥ 8, then the asymptotic series).
 * Used for the cumulants of ln I of the gamma-gamma law (starting guess of the quantile).
 *
 * @see Abramowitz M., Stegun I.A., "Handbook of Mathematical Functions" (1964), eq. 6.3.5, 6.3.18,
 *   6.4.6 and 6.4.11 (recurrences and asymptotic expansions).
 */

/**
 * ψ(x) for x > 0.
 * @param x argument, > 0
 * @returns ψ(x)
 * @see Abramowitz & Stegun (1964), §6.3–6.4.
 */
export function digamma(x: number): number {
  let result = 0;
  while (x < 8) {
    result -= 1 / x;
    x += 1;
  }
  const inv2 = 1 / (x * x);
  return result + Math.log(x) - 0.5 / x - inv2 * (1 / 12 - inv2 * (1 / 120 - inv2 * (1 / 252 - inv2 * (1 / 240 - inv2 / 132))));
}

/**
 * ψ′(x) for x > 0.
 * @param x argument, > 0
 * @returns ψ′(x)
 * @see Abramowitz & Stegun (1964), §6.3–6.4.
 */
export function trigamma(x: number): number {
  let result = 0;
  while (x < 8) {
    result += 1 / (x * x);
    x += 1;
  }
  const inv = 1 / x;
  const inv2 = inv * inv;
  return result + inv + 0.5 * inv2 + inv * inv2 * (1 / 6 - inv2 * (1 / 30 - inv2 * (1 / 42 - inv2 / 30)));
}

/**
 * ψ″(x) for x > 0.
 * @param x argument, > 0
 * @returns ψ″(x)
 * @see Abramowitz & Stegun (1964), §6.3–6.4.
 */
export function tetragamma(x: number): number {
  let result = 0;
  while (x < 8) {
    result -= 2 / (x * x * x);
    x += 1;
  }
  const inv = 1 / x;
  const inv2 = inv * inv;
  return result - inv2 - inv2 * inv - 0.5 * inv2 * inv2 + inv2 * inv2 * inv2 * (1 / 6 - inv2 * (1 / 6 - inv2 * (3 / 10)));
}

/**
 * ψ‴(x) for x > 0.
 * @param x argument, > 0
 * @returns ψ‴(x)
 * @see Abramowitz & Stegun (1964), §6.3–6.4.
 */
export function pentagamma(x: number): number {
  let result = 0;
  while (x < 8) {
    const x2 = x * x;
    result += 6 / (x2 * x2);
    x += 1;
  }
  const inv = 1 / x;
  const inv2 = inv * inv;
  const inv3 = inv2 * inv;
  return result + 2 * inv3 + 3 * inv2 * inv2 + 2 * inv3 * inv2 - inv3 * inv2 * inv2 + (4 / 3) * inv3 * inv3 * inv3;
}
