import { requireNonNegative, requirePositive } from '../units/guards.js'
import { wavelengthM } from '../rf/wavelength.js'

/** Share of the first Fresnel zone to keep clear, common practice (no single source; in the spirit of ITU-R P.530). */
export const REQUIRED_CLEARANCE_FRACTION = 0.6

/**
 * Radius of the n-th Fresnel zone at a point on the path, √(nλ·d1·d2/(d1+d2)).
 * @param freqHz carrier frequency in hertz, > 0
 * @param d1M distance from one end in metres, >= 0
 * @param d2M distance from the other end in metres, >= 0 (d1M + d2M > 0)
 * @param zone zone number n, integer >= 1 (default 1)
 * @returns radius in metres (0 at either end)
 * @throws RangeError when an argument is out of range
 */
export function fresnelZoneRadiusM(freqHz: number, d1M: number, d2M: number, zone = 1): number {
  requireNonNegative('d1M', d1M)
  requireNonNegative('d2M', d2M)
  if (!(d1M + d2M > 0)) throw new RangeError('d1M + d2M must be > 0')
  if (!Number.isInteger(zone) || zone < 1) throw new RangeError(`zone must be an integer >= 1, got ${zone}`)
  // ITU-R P.526 §3.1 eq. (2): R_n = √(nλ d1 d2/(d1 + d2))
  return Math.sqrt((zone * wavelengthM(freqHz) * d1M * d2M) / (d1M + d2M))
}

/**
 * Clearance needed to keep a fraction (default 60 %) of the first Fresnel zone free.
 * @param freqHz carrier frequency in hertz, > 0
 * @param d1M distance from one end in metres, >= 0
 * @param d2M distance from the other end in metres, >= 0
 * @param fraction required fraction of F1, > 0 (default 0.6)
 * @returns clearance in metres
 * @throws RangeError when an argument is out of range
 */
export function requiredClearanceM(
  freqHz: number,
  d1M: number,
  d2M: number,
  fraction = REQUIRED_CLEARANCE_FRACTION,
): number {
  requirePositive('fraction', fraction)
  // common practice, no source: 0.6·F1
  return fraction * fresnelZoneRadiusM(freqHz, d1M, d2M, 1)
}
