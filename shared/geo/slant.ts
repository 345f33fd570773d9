import { requireFinite, requireNonNegative, requirePositive } from '../units/guards.js'

const DEG = Math.PI / 180

/** Standard effective-earth-radius factor k = 4/3 (IEC 60050-705-05-41; ITU-R P.453). */
export const STANDARD_K_FACTOR = 4 / 3
/** Earth radius used with the k-factor, metres (ITU-R P.834 uses 6371 km). */
export const EARTH_RADIUS_M = 6371000

/** How an aircraft altitude is referenced. */
export type AltitudeReference = 'AGL' | 'AMSL'

/**
 * Straight-line (slant) range between two points from horizontal distance and height difference.
 * @param horizontalDistanceM horizontal distance in metres, >= 0
 * @param heightDifferenceM height of the far point above the near one in metres, finite (negative if below)
 * @returns slant range in metres, >= 0
 * @throws RangeError when horizontalDistanceM < 0 or either value is not finite
 */
export function slantRangeM(horizontalDistanceM: number, heightDifferenceM: number): number {
  requireNonNegative('horizontalDistanceM', horizontalDistanceM)
  requireFinite('heightDifferenceM', heightDifferenceM)
  // Pythagoras on a flat local plane
  return Math.hypot(horizontalDistanceM, heightDifferenceM)
}

/**
 * Elevation angle of a point seen from another over a flat earth.
 * @param horizontalDistanceM horizontal distance in metres, >= 0
 * @param heightDifferenceM height of the target above the observer in metres, finite
 * @returns elevation in degrees, [-90, 90]
 * @throws RangeError when horizontalDistanceM < 0 or either value is not finite
 */
export function elevationAngleDeg(horizontalDistanceM: number, heightDifferenceM: number): number {
  requireNonNegative('horizontalDistanceM', horizontalDistanceM)
  requireFinite('heightDifferenceM', heightDifferenceM)
  // plane trigonometry: atan2(Δh, d)
  return Math.atan2(heightDifferenceM, horizontalDistanceM) / DEG
}

/**
 * Elevation angle over a sphere of effective radius k·Re (curved earth, refraction via k).
 * @param groundDistanceM ground distance in metres, >= 0
 * @param observerHeightM observer height above the surface in metres, finite
 * @param targetHeightM target height above the surface in metres, finite
 * @param kFactor effective-earth-radius factor, > 0 (default 4/3)
 * @param earthRadiusM earth radius in metres, > 0 (default 6 371 000)
 * @returns elevation in degrees, [-90, 90]
 * @throws RangeError for negative distance or non-positive k or radius
 */
export function elevationAngleCurvedDeg(
  groundDistanceM: number,
  observerHeightM: number,
  targetHeightM: number,
  kFactor = STANDARD_K_FACTOR,
  earthRadiusM = EARTH_RADIUS_M,
): number {
  requireNonNegative('groundDistanceM', groundDistanceM)
  requireFinite('observerHeightM', observerHeightM)
  requireFinite('targetHeightM', targetHeightM)
  const a = requirePositive('kFactor', kFactor) * requirePositive('earthRadiusM', earthRadiusM)
  const t = groundDistanceM / a
  // spherical geometry: el = atan2((a+h2)cos t − (a+h1), (a+h2) sin t), central angle t = d/a
  const r2 = a + targetHeightM
  return Math.atan2(r2 * Math.cos(t) - (a + observerHeightM), r2 * Math.sin(t)) / DEG
}

/**
 * Aircraft height above the ground station's ground level.
 * @param altitudeM logged altitude in metres, finite
 * @param reference 'AGL' (relative to the station ground) or 'AMSL'
 * @param groundElevationM station ground elevation above mean sea level in metres, finite
 * @returns height above station ground in metres
 * @throws RangeError when a value is not finite; TypeError for an unknown reference
 */
export function heightAboveStationGroundM(
  altitudeM: number,
  reference: AltitudeReference,
  groundElevationM: number,
): number {
  requireFinite('altitudeM', altitudeM)
  requireFinite('groundElevationM', groundElevationM)
  if (reference === 'AGL') return altitudeM
  if (reference === 'AMSL') return altitudeM - groundElevationM
  throw new TypeError(`reference must be 'AGL' or 'AMSL', got ${String(reference)}`)
}
