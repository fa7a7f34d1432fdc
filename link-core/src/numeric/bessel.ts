/**
 * Exponentially scaled modified Bessel function of the first kind, order 0: i0e(x) = e^(−|x|)·I0(x).
 * Scaling keeps products such as exp(−2(r − r0)²/w²)·i0e(4 r r0/w²) finite for any argument.
 */

/**
 * Computes e^(−|x|)·I0(x).
 *
 * Below |x| = 25 the ascending series Σ (x²/4)^k/(k!)² is summed (all terms positive, so the
 * relative error stays near machine precision); above it the asymptotic expansion
 * e^(−x)I0(x) ~ (2πx)^(−1/2)·Σ [(2k−1)!!]²/(k!·(8x)^k) is summed until its terms stop decreasing.
 *
 * @param x argument (any real; the function is even)
 * @returns e^(−|x|)·I0(x), in (0, 1]
 * @see Abramowitz M., Stegun I.A., "Handbook of Mathematical Functions" (1964), eq. 9.6.12 (series)
 *   and eq. 9.7.1 (asymptotic expansion).
 */
export function besselI0Scaled(x: number): number {
  const ax = Math.abs(x);
  if (ax < 25) {
    const quarterSquare = 0.25 * ax * ax;
    let term = 1;
    let sum = 1;
    for (let k = 1; k < 200; k++) {
      term *= quarterSquare / (k * k);
      sum += term;
      if (term < 1e-17 * sum) break;
    }
    return sum * Math.exp(-ax);
  }
  let term = 1;
  let sum = 1;
  for (let k = 1; k < 60; k++) {
    const next = (term * (2 * k - 1) * (2 * k - 1)) / (k * 8 * ax);
    if (next > term) break;
    term = next;
    sum += term;
    if (term < 1e-17 * sum) break;
  }
  return sum / Math.sqrt(2 * Math.PI * ax);
}
