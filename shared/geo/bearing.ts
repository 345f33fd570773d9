import { geodesicInverse } from './geodesic.js'

/**
 * Initial WGS-84 bearing from one fix to another (forward azimuth of the geodesic).
 * @param lat1Deg start latitude in degrees, [-90, 90]
 * @param lon1Deg start longitude in degrees, finite
 * @param lat2Deg end latitude in degrees, [-90, 90]
 * @param lon2Deg end longitude in degrees, finite
 * @returns bearing in degrees clockwise from true north, [0, 360); 0 for coincident fixes
 * @throws RangeError for out-of-range coordinates or nearly antipodal fixes
 */
export function initialBearingDeg(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  return geodesicInverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg).initialBearingDeg
}
