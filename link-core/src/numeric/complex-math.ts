/**
 * Minimal complex helpers for the hypergeometric and Rytov integrals (principal branches).
 * Internal to the turbulence module.
 */

/**
 * Real part of Γ(−5/6)·[a^(5/6) − (a − i·b)^(5/6)] for a ≥ 0 (principal branch): the kernel of the
 * weak-fluctuation Rytov integrals with the Kolmogorov spectrum.
 * @param a real part ≥ 0
 * @param b imaginary offset
 * @returns the kernel value (real)
 * @see Andrews & Phillips (2005), ch. 8 and 10 (integrals over κ done in closed form) [derived].
 */
export function kolmogorovKernelReal(a: number, b: number): number {
  const modulus = Math.hypot(a, b);
  const argument = Math.atan2(-b, a);
  const powered = Math.pow(modulus, 5 / 6) * Math.cos((5 / 6) * argument);
  return GAMMA_MINUS_FIVE_SIXTHS * (Math.pow(a, 5 / 6) - powered);
}

/** Γ(−5/6) = Γ(1/6)/(−5/6). */
export const GAMMA_MINUS_FIVE_SIXTHS = -6.679579202136284;
