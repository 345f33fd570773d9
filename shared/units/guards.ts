/**
 * Throws unless a value is a finite number.
 * @param name argument name used in the message
 * @param value value to check, any finite number
 * @returns the value unchanged
 * @throws TypeError when value is not a number; RangeError when it is NaN or infinite
 */
export function requireFinite(name: string, value: number): number {
  if (typeof value !== 'number') throw new TypeError(`${name} must be a number, got ${typeof value}`)
  if (!Number.isFinite(value)) throw new RangeError(`${name} must be finite, got ${value}`)
  return value
}

/**
 * Throws unless a value is a finite number strictly greater than zero.
 * @param name argument name used in the message
 * @param value value to check, finite and > 0
 * @returns the value unchanged
 * @throws TypeError when value is not a number; RangeError when it is not finite or not > 0
 */
export function requirePositive(name: string, value: number): number {
  requireFinite(name, value)
  if (value <= 0) throw new RangeError(`${name} must be > 0, got ${value}`)
  return value
}

/**
 * Throws unless a value is a finite number greater than or equal to zero.
 * @param name argument name used in the message
 * @param value value to check, finite and >= 0
 * @returns the value unchanged
 * @throws TypeError when value is not a number; RangeError when it is not finite or < 0
 */
export function requireNonNegative(name: string, value: number): number {
  requireFinite(name, value)
  if (value < 0) throw new RangeError(`${name} must be >= 0, got ${value}`)
  return value
}

/**
 * Throws unless a value lies in a closed interval.
 * @param name argument name used in the message
 * @param value value to check, finite and in [min, max]
 * @param min lower bound, inclusive
 * @param max upper bound, inclusive
 * @returns the value unchanged
 * @throws TypeError when value is not a number; RangeError when it is outside [min, max]
 */
export function requireInRange(name: string, value: number, min: number, max: number): number {
  requireFinite(name, value)
  if (value < min || value > max) {
    throw new RangeError(`${name} must be in [${min}, ${max}], got ${value}`)
  }
  return value
}
