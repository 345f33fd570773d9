import { requireInRange } from '../units/guards.js'
import { WGS84_A_M, WGS84_E2 } from './wgs84.js'

const DEG = Math.PI / 180

/**
 * Documented accuracy of {@link groundDistanceM} against WGS-84 geodesics (geographiclib-geodesic):
 * relative error at most 3e-5 for paths up to 50 km at latitudes within ±70°; checked in
 * tests/unit/shared/geo/localOffset.test.ts. Range tests rarely exceed 50 km.
 */
export const GROUND_DISTANCE_MAX_REL_ERROR = 3e-5

function wrapLonDeltaDeg(dLonDeg: number): number {
  // keep the short way round across the antimeridian
  if (dLonDeg > 180) return dLonDeg - 360
  if (dLonDeg < -180) return dLonDeg + 360
  return dLonDeg
}

/** East and north components of a short ground offset, metres. */
export interface LocalOffset {
  eastM: number
  northM: number
}

function checkFixes(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): void {
  requireInRange('lat1Deg', lat1Deg, -90, 90)
  requireInRange('lat2Deg', lat2Deg, -90, 90)
  requireInRange('lon1Deg', lon1Deg, -180, 180)
  requireInRange('lon2Deg', lon2Deg, -180, 180)
}

/**
 * East/north offset of a fix from an origin, WGS-84 radii of curvature at the mid-latitude.
 * @param originLatDeg origin latitude in degrees, [-90, 90]
 * @param originLonDeg origin longitude in degrees, [-180, 180]
 * @param latDeg target latitude in degrees, [-90, 90]
 * @param lonDeg target longitude in degrees, [-180, 180]
 * @returns offset in metres east and north of the origin
 * @throws RangeError for coordinates out of range
 */
export function localOffsetM(
  originLatDeg: number,
  originLonDeg: number,
  latDeg: number,
  lonDeg: number,
): LocalOffset {
  checkFixes(originLatDeg, originLonDeg, latDeg, lonDeg)
  const midRad = ((originLatDeg + latDeg) / 2) * DEG
  const s = Math.sin(midRad)
  const w = 1 - WGS84_E2 * s * s
  const n = WGS84_A_M / Math.sqrt(w)
  // mid-latitude plane approximation with meridian radius M = N(1 − e²)/w and prime-vertical N
  // (Bowring 1981-style local ellipsoidal flat-earth; error O((d/R)²))
  return {
    eastM: wrapLonDeltaDeg(lonDeg - originLonDeg) * DEG * n * Math.cos(midRad),
    northM: (latDeg - originLatDeg) * DEG * ((n * (1 - WGS84_E2)) / w),
  }
}

/**
 * Ground distance between two fixes on WGS-84, accurate to GROUND_DISTANCE_MAX_REL_ERROR up to 50 km.
 * @param lat1Deg first latitude in degrees, [-90, 90]
 * @param lon1Deg first longitude in degrees, [-180, 180]
 * @param lat2Deg second latitude in degrees, [-90, 90]
 * @param lon2Deg second longitude in degrees, [-180, 180]
 * @returns distance in metres, >= 0
 * @throws RangeError for coordinates out of range
 */
export function groundDistanceM(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  const o = localOffsetM(lat1Deg, lon1Deg, lat2Deg, lon2Deg)
  return Math.hypot(o.eastM, o.northM)
}

/**
 * Fills east/north/ground-distance arrays of many fixes from one origin (hot loop, no allocation).
 * @param originLatDeg origin latitude in degrees, [-90, 90]
 * @param originLonDeg origin longitude in degrees, [-180, 180]
 * @param latDeg latitudes in degrees; NaN entries give NaN outputs (missing fix)
 * @param lonDeg longitudes in degrees, same length as latDeg
 * @param eastM output east offsets in metres, same length
 * @param northM output north offsets in metres, same length
 * @param distanceM output ground distances in metres, same length
 * @returns nothing; the three output arrays are filled in place
 * @throws RangeError when the origin is out of range or the array lengths differ
 */
export function fillLocalOffsets(
  originLatDeg: number,
  originLonDeg: number,
  latDeg: Float64Array,
  lonDeg: Float64Array,
  eastM: Float64Array,
  northM: Float64Array,
  distanceM: Float64Array,
): void {
  requireInRange('originLatDeg', originLatDeg, -90, 90)
  requireInRange('originLonDeg', originLonDeg, -180, 180)
  const len = latDeg.length
  if (lonDeg.length !== len || eastM.length !== len || northM.length !== len || distanceM.length !== len) {
    throw new RangeError('fillLocalOffsets: latDeg, lonDeg and output arrays must have equal lengths')
  }
  const ae2 = 1 - WGS84_E2
  for (let i = 0; i < len; i++) {
    const lat = latDeg[i]!
    const midRad = (originLatDeg + lat) * (DEG / 2)
    const s = Math.sin(midRad)
    const w = 1 - WGS84_E2 * s * s
    const n = WGS84_A_M / Math.sqrt(w)
    let dLon = lonDeg[i]! - originLonDeg
    if (dLon > 180) dLon -= 360
    else if (dLon < -180) dLon += 360
    const e = dLon * DEG * n * Math.cos(midRad)
    const no = (lat - originLatDeg) * DEG * ((n * ae2) / w)
    eastM[i] = e
    northM[i] = no
    distanceM[i] = Math.sqrt(e * e + no * no)
  }
}
