/**
 * Decibel conversions. All dB values here are power ratios: dB = 10·log10(ratio).
 */

/**
 * Converts a power ratio to decibels.
 * @param ratio power ratio, > 0 (dimensionless); 0 gives −Infinity
 * @returns 10·log10(ratio) [dB]
 * @see IEC 60027-3:2002, "Letter symbols to be used in electrical technology — Part 3", definition of the decibel.
 */
export function ratioToDb(ratio: number): number {
  return 10 * Math.log10(ratio);
}

/**
 * Converts decibels to a power ratio.
 * @param db value [dB], any real
 * @returns 10^(db/10), > 0 (dimensionless)
 * @see IEC 60027-3:2002.
 */
export function dbToRatio(db: number): number {
  return Math.pow(10, db / 10);
}

/**
 * Loss in dB of a transmitted or captured power fraction: −10·log10(fraction).
 * @param fraction power fraction in (0, 1] (dimensionless)
 * @returns loss [dB], ≥ 0 for fractions ≤ 1; +Infinity for 0
 * @see IEC 60027-3:2002.
 */
export function fractionToLossDb(fraction: number): number {
  return -10 * Math.log10(fraction);
}

/**
 * Converts watts to dBm: 10·log10(P / 1 mW).
 * @param powerW power [W], > 0
 * @returns power [dBm]
 * @see ITU-R V.574-5 (2015), "Use of the decibel and the neper in telecommunications", dBm definition.
 */
export function wattsToDbm(powerW: number): number {
  return 10 * Math.log10(powerW / 1e-3);
}

/**
 * Converts dBm to watts.
 * @param powerDbm power [dBm], any real
 * @returns power [W], > 0
 * @see ITU-R V.574-5 (2015).
 */
export function dbmToWatts(powerDbm: number): number {
  return 1e-3 * Math.pow(10, powerDbm / 10);
}
