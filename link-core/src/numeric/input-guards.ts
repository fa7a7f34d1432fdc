/**
 * Input guards shared by the atmosphere, turbulence, receiver and safety modules. Each throws a
 * RangeError whose message names the field and the reason, so callers (API, UI) can show it next
 * to the offending input.
 */

/**
 * Throws unless `value` is a finite number > 0.
 * @param field name of the input field, used in the message
 * @param value the value to check
 * @returns nothing; throws a RangeError naming the field and the reason
 * @see common practice (input validation)
 */
export function requirePositive(field: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${field}: must be a finite number (got ${String(value)})`);
  if (!(value > 0)) throw new RangeError(`${field}: must be greater than 0 (got ${value})`);
}

/**
 * Throws unless `value` is a finite number ≥ 0.
 * @param field name of the input field, used in the message
 * @param value the value to check
 * @returns nothing; throws a RangeError naming the field and the reason
 * @see common practice (input validation)
 */
export function requireNonNegative(field: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${field}: must be a finite number (got ${String(value)})`);
  if (!(value >= 0)) throw new RangeError(`${field}: must be 0 or more (got ${value})`);
}

/**
 * Throws unless `value` is a finite number strictly between 0 and 1 (a probability of an event that can happen).
 * @param field name of the input field, used in the message
 * @param value the value to check
 * @returns nothing; throws a RangeError naming the field and the reason
 * @see common practice (input validation)
 */
export function requireOpenUnitInterval(field: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${field}: must be a finite number (got ${String(value)})`);
  if (!(value > 0 && value < 1)) throw new RangeError(`${field}: must lie strictly between 0 and 1 (got ${value})`);
}

/**
 * Throws unless `value` is a finite number in [min, max].
 * @param field name of the input field, used in the message
 * @param value the value to check
 * @param min lower bound (inclusive)
 * @param max upper bound (inclusive)
 * @returns nothing; throws a RangeError naming the field and the reason
 * @see common practice (input validation)
 */
export function requireInRange(field: string, value: number, min: number, max: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new RangeError(`${field}: must be a finite number (got ${String(value)})`);
  if (!(value >= min && value <= max)) throw new RangeError(`${field}: must lie between ${min} and ${max} (got ${value})`);
}
