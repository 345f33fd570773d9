import { WGS84_A_M, WGS84_E2 } from '../../../shared/geo/wgs84.js'

const DEG = Math.PI / 180

/**
 * Ground distance from one station to many fixes, allocation-free for the import's hot loop. Same formula and operation
 * order as shared/geo/localOffset.ts (groundDistanceM: WGS-84 radii at the mid-latitude), so values match it exactly;
 * inputs are already range-checked by the row converter.
 * @param stationLatDeg station latitude, degrees
 * @param stationLonDeg station longitude, degrees
 * @returns (latDeg, lonDeg) → metres
 */
export function distanceFromStation(stationLatDeg: number, stationLonDeg: number): (latDeg: number, lonDeg: number) => number {
  return (latDeg, lonDeg) => {
    const midRad = ((stationLatDeg + latDeg) / 2) * DEG
    const s = Math.sin(midRad)
    const w = 1 - WGS84_E2 * s * s
    const n = WGS84_A_M / Math.sqrt(w)
    let dLon = lonDeg - stationLonDeg
    if (dLon > 180) dLon -= 360
    else if (dLon < -180) dLon += 360
    const east = dLon * DEG * n * Math.cos(midRad)
    const north = (latDeg - stationLatDeg) * DEG * ((n * (1 - WGS84_E2)) / w)
    return Math.hypot(east, north)
  }
}
