import { localOffsetM } from '../geo/localOffset.js'
import { requireFinite, requireInRange } from '../units/guards.js'

const DEG = Math.PI / 180

/**
 * Latitude and longitude of a point given metres east and north of an origin (inverse of localOffsetM).
 * @param originLatDeg origin latitude in degrees, (-89, 89)
 * @param originLonDeg origin longitude in degrees, [-180, 180]
 * @param eastM metres east of the origin, finite (short ranges, under ~50 km)
 * @param northM metres north of the origin, finite
 * @returns the position in degrees
 * @throws RangeError when an argument is out of range
 */
export function offsetToLatLonDeg(
  originLatDeg: number,
  originLonDeg: number,
  eastM: number,
  northM: number,
): { latDeg: number; lonDeg: number } {
  requireInRange('originLatDeg', originLatDeg, -89, 89)
  requireInRange('originLonDeg', originLonDeg, -180, 180)
  requireFinite('eastM', eastM)
  requireFinite('northM', northM)
  // first guess on a sphere, then two Newton-style corrections against the forward map
  let lat = originLatDeg + northM / 111_132
  let lon = originLonDeg + eastM / (111_320 * Math.cos(originLatDeg * DEG))
  for (let k = 0; k < 3; k++) {
    const o = localOffsetM(originLatDeg, originLonDeg, lat, lon)
    lat += (northM - o.northM) / 111_132
    lon += (eastM - o.eastM) / (111_320 * Math.cos(lat * DEG))
  }
  return { latDeg: lat, lonDeg: lon }
}
