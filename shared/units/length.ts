import { requireFinite } from './guards.js'

/** Metres in one international foot (exact by the 1959 definition). */
export const METRES_PER_FOOT = 0.3048
/** Metres in one international statute mile (exact: 5280 ft). */
export const METRES_PER_MILE = 1609.344

/**
 * Converts metres to feet.
 * @param lengthM length in metres, finite
 * @returns length in feet
 * @throws RangeError when lengthM is not finite
 */
export function metresToFeet(lengthM: number): number {
  return requireFinite('lengthM', lengthM) / METRES_PER_FOOT
}

/**
 * Converts feet to metres.
 * @param lengthFt length in feet, finite
 * @returns length in metres
 * @throws RangeError when lengthFt is not finite
 */
export function feetToMetres(lengthFt: number): number {
  return requireFinite('lengthFt', lengthFt) * METRES_PER_FOOT
}

/**
 * Converts kilometres to statute miles.
 * @param lengthKm length in kilometres, finite
 * @returns length in miles
 * @throws RangeError when lengthKm is not finite
 */
export function kmToMiles(lengthKm: number): number {
  return (requireFinite('lengthKm', lengthKm) * 1000) / METRES_PER_MILE
}

/**
 * Converts statute miles to kilometres.
 * @param lengthMi length in miles, finite
 * @returns length in kilometres
 * @throws RangeError when lengthMi is not finite
 */
export function milesToKm(lengthMi: number): number {
  return (requireFinite('lengthMi', lengthMi) * METRES_PER_MILE) / 1000
}
