import { requireInRange } from '../units/guards.js'
import { WGS84_A_M, WGS84_B_M, WGS84_F } from './wgs84.js'

/** Result of the inverse geodesic problem on the WGS-84 ellipsoid. */
export interface GeodesicInverse {
  /** Ellipsoidal distance in metres. */
  distanceM: number
  /** Forward azimuth at the first point, degrees clockwise from true north in [0, 360). */
  initialBearingDeg: number
  /** Forward azimuth at the second point, degrees clockwise from true north in [0, 360). */
  finalBearingDeg: number
}

const DEG = Math.PI / 180
const MAX_ITERATIONS = 200

/**
 * Normalises an angle to [0, 360) degrees.
 * @param angleDeg any finite angle in degrees
 * @returns the same direction in [0, 360)
 * @throws RangeError when angleDeg is not finite
 */
export function normaliseBearingDeg(angleDeg: number): number {
  if (!Number.isFinite(angleDeg)) throw new RangeError(`angleDeg must be finite, got ${angleDeg}`)
  const r = angleDeg % 360
  const out = r < 0 ? r + 360 : r
  // -1e-15 % 360 + 360 rounds to 360; fold it back
  return out >= 360 ? 0 : out
}

/**
 * WGS-84 ellipsoidal distance and azimuths between two fixes, sub-millimetre for non-antipodal points.
 * @param lat1Deg latitude of the first point in degrees, [-90, 90]
 * @param lon1Deg longitude of the first point in degrees, [-180, 180] (any finite value is wrapped)
 * @param lat2Deg latitude of the second point in degrees, [-90, 90]
 * @param lon2Deg longitude of the second point in degrees, finite
 * @returns distance in metres and azimuths in [0, 360) degrees
 * @throws RangeError for latitudes out of range, non-finite longitudes, or nearly antipodal points where the iteration does not converge
 */
export function geodesicInverse(
  lat1Deg: number,
  lon1Deg: number,
  lat2Deg: number,
  lon2Deg: number,
): GeodesicInverse {
  requireInRange('lat1Deg', lat1Deg, -90, 90)
  requireInRange('lat2Deg', lat2Deg, -90, 90)
  requireInRange('lon1Deg', lon1Deg, -1e6, 1e6)
  requireInRange('lon2Deg', lon2Deg, -1e6, 1e6)
  // Vincenty (1975), Survey Review 23(176), inverse formula with reduced latitudes
  const a = WGS84_A_M
  const b = WGS84_B_M
  const f = WGS84_F
  let dLon = ((lon2Deg - lon1Deg) % 360) * DEG
  if (dLon > Math.PI) dLon -= 2 * Math.PI
  if (dLon < -Math.PI) dLon += 2 * Math.PI
  const u1 = Math.atan((1 - f) * Math.tan(lat1Deg * DEG))
  const u2 = Math.atan((1 - f) * Math.tan(lat2Deg * DEG))
  const sinU1 = Math.sin(u1)
  const cosU1 = Math.cos(u1)
  const sinU2 = Math.sin(u2)
  const cosU2 = Math.cos(u2)
  let lambda = dLon
  let sinSigma = 0
  let cosSigma = 1
  let sigma = 0
  let cos2Alpha = 1
  let cos2SigmaM = 0
  let sinLambda = 0
  let cosLambda = 1
  let converged = false
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    sinLambda = Math.sin(lambda)
    cosLambda = Math.cos(lambda)
    const t1 = cosU2 * sinLambda
    const t2 = cosU1 * sinU2 - sinU1 * cosU2 * cosLambda
    sinSigma = Math.sqrt(t1 * t1 + t2 * t2)
    if (sinSigma === 0) return { distanceM: 0, initialBearingDeg: 0, finalBearingDeg: 0 }
    cosSigma = sinU1 * sinU2 + cosU1 * cosU2 * cosLambda
    sigma = Math.atan2(sinSigma, cosSigma)
    const sinAlpha = (cosU1 * cosU2 * sinLambda) / sinSigma
    cos2Alpha = 1 - sinAlpha * sinAlpha
    // on the equator cos²α = 0 and the term vanishes (Vincenty's note)
    cos2SigmaM = cos2Alpha === 0 ? 0 : cosSigma - (2 * sinU1 * sinU2) / cos2Alpha
    const c = (f / 16) * cos2Alpha * (4 + f * (4 - 3 * cos2Alpha))
    const prev = lambda
    lambda =
      dLon +
      (1 - c) *
        f *
        sinAlpha *
        (sigma + c * sinSigma * (cos2SigmaM + c * cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM)))
    if (Math.abs(lambda - prev) < 1e-13) {
      converged = true
      break
    }
  }
  if (!converged) throw new RangeError('geodesicInverse did not converge: points nearly antipodal')
  const uSq = (cos2Alpha * (a * a - b * b)) / (b * b)
  const bigA = 1 + (uSq / 16384) * (4096 + uSq * (-768 + uSq * (320 - 175 * uSq)))
  const bigB = (uSq / 1024) * (256 + uSq * (-128 + uSq * (74 - 47 * uSq)))
  const deltaSigma =
    bigB *
    sinSigma *
    (cos2SigmaM +
      (bigB / 4) *
        (cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM) -
          (bigB / 6) * cos2SigmaM * (-3 + 4 * sinSigma * sinSigma) * (-3 + 4 * cos2SigmaM * cos2SigmaM)))
  const distanceM = b * bigA * (sigma - deltaSigma)
  const az1 = Math.atan2(cosU2 * sinLambda, cosU1 * sinU2 - sinU1 * cosU2 * cosLambda)
  const az2 = Math.atan2(cosU1 * sinLambda, -sinU1 * cosU2 + cosU1 * sinU2 * cosLambda)
  return {
    distanceM,
    initialBearingDeg: normaliseBearingDeg(az1 / DEG),
    finalBearingDeg: normaliseBearingDeg(az2 / DEG),
  }
}
