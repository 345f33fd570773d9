import { requireNonNegative, requirePositive } from '../units/guards.js'
import { EARTH_RADIUS_M, STANDARD_K_FACTOR } from '../geo/slant.js'

/**
 * Height of the earth's bulge above the chord at a point on the path, d1·d2/(2·k·Re).
 * @param d1M distance from one end in metres, >= 0
 * @param d2M distance from the other end in metres, >= 0
 * @param kFactor effective-earth-radius factor, > 0 (default 4/3)
 * @param earthRadiusM earth radius in metres, > 0 (default 6 371 000)
 * @returns bulge in metres, >= 0
 * @throws RangeError when an argument is out of range
 */
export function earthBulgeM(
  d1M: number,
  d2M: number,
  kFactor = STANDARD_K_FACTOR,
  earthRadiusM = EARTH_RADIUS_M,
): number {
  requireNonNegative('d1M', d1M)
  requireNonNegative('d2M', d2M)
  requirePositive('kFactor', kFactor)
  requirePositive('earthRadiusM', earthRadiusM)
  // parabolic sagitta with effective radius k·Re (ITU-R P.526 §4; IEC 60050-705-05-41 for k)
  return (d1M * d2M) / (2 * kFactor * earthRadiusM)
}
