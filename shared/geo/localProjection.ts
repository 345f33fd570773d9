import { requireInRange } from '../units/guards.js'
import { WGS84_A_M, WGS84_E2 } from './wgs84.js'
import { type LocalOffset } from './localOffset.js'

const DEG = Math.PI / 180

/**
 * A flat east/north plane around one origin for a whole flight: the mid-latitude WGS-84 scales of
 * geo/localOffset.ts expanded to second order in Δlat, so projecting a fix needs no trigonometry.
 */
export interface LocalProjection {
  originLatDeg: number
  originLonDeg: number
  /** East scale (metres per degree of longitude) = east0 + east1·Δlat + east2·Δlat², Δlat in degrees. */
  east0: number
  east1: number
  east2: number
  /** North scale (metres per degree of latitude) = north0 + north1·Δlat + north2·Δlat². */
  north0: number
  north1: number
  north2: number
}

function scales(latDeg: number): { east: number; north: number } {
  const s = Math.sin(latDeg * DEG)
  const w = 1 - WGS84_E2 * s * s
  const n = WGS84_A_M / Math.sqrt(w)
  // prime-vertical and meridian radii of curvature (Torge, Geodesy §6.2), per degree
  return { east: n * Math.cos(latDeg * DEG) * DEG, north: ((n * (1 - WGS84_E2)) / w) * DEG }
}

/**
 * Builds the projection around an origin; within 1e-6 relative of localOffsetM up to 50 km below ±70° latitude.
 * @param originLatDeg origin latitude in degrees, [-89, 89]
 * @param originLonDeg origin longitude in degrees, [-180, 180]
 * @returns series coefficients of the east and north scales
 * @throws RangeError when the origin is out of range
 */
export function createLocalProjection(originLatDeg: number, originLonDeg: number): LocalProjection {
  requireInRange('originLatDeg', originLatDeg, -89, 89)
  requireInRange('originLonDeg', originLonDeg, -180, 180)
  // scales are evaluated at the mid-latitude φ0 + Δ/2; central differences give the Taylor terms in Δ
  const h = 0.05
  const c = scales(originLatDeg)
  const p = scales(originLatDeg + h / 2)
  const m = scales(originLatDeg - h / 2)
  return {
    originLatDeg,
    originLonDeg,
    east0: c.east,
    east1: (p.east - m.east) / (2 * h),
    east2: (p.east - 2 * c.east + m.east) / (2 * h * h),
    north0: c.north,
    north1: (p.north - m.north) / (2 * h),
    north2: (p.north - 2 * c.north + m.north) / (2 * h * h),
  }
}

/**
 * Projects a fix onto a local plane.
 * @param proj projection from createLocalProjection
 * @param latDeg latitude in degrees, [-90, 90]
 * @param lonDeg longitude in degrees, [-180, 180]
 * @returns metres east and north of the origin
 * @throws RangeError when the fix is out of range
 */
export function projectToLocal(proj: LocalProjection, latDeg: number, lonDeg: number): LocalOffset {
  requireInRange('latDeg', latDeg, -90, 90)
  requireInRange('lonDeg', lonDeg, -180, 180)
  const dLat = latDeg - proj.originLatDeg
  let dLon = lonDeg - proj.originLonDeg
  if (dLon > 180) dLon -= 360
  else if (dLon < -180) dLon += 360
  return {
    eastM: dLon * (proj.east0 + dLat * (proj.east1 + dLat * proj.east2)),
    northM: dLat * (proj.north0 + dLat * (proj.north1 + dLat * proj.north2)),
  }
}
