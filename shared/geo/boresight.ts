import { requireInRange } from '../units/guards.js'

const DEG = Math.PI / 180

/**
 * Angle between an antenna's boresight and the direction to a target.
 * @param boresightAzimuthDeg boresight azimuth in degrees clockwise from north, finite
 * @param boresightElevationDeg boresight elevation in degrees, [-90, 90]
 * @param targetAzimuthDeg target azimuth in degrees, finite
 * @param targetElevationDeg target elevation in degrees, [-90, 90]
 * @returns off-boresight angle in degrees, [0, 180]
 * @throws RangeError for elevations outside [-90, 90] or non-finite azimuths
 */
export function offBoresightAngleDeg(
  boresightAzimuthDeg: number,
  boresightElevationDeg: number,
  targetAzimuthDeg: number,
  targetElevationDeg: number,
): number {
  requireInRange('boresightAzimuthDeg', boresightAzimuthDeg, -1e6, 1e6)
  requireInRange('targetAzimuthDeg', targetAzimuthDeg, -1e6, 1e6)
  requireInRange('boresightElevationDeg', boresightElevationDeg, -90, 90)
  requireInRange('targetElevationDeg', targetElevationDeg, -90, 90)
  const e0 = boresightElevationDeg * DEG
  const e1 = targetElevationDeg * DEG
  const dAz = (targetAzimuthDeg - boresightAzimuthDeg) * DEG
  // spherical law of cosines: cos ψ = sin e0 sin e + cos e0 cos e cos Δaz;
  // the haversine form keeps small angles accurate
  const sDe = Math.sin((e1 - e0) / 2)
  const sDa = Math.sin(dAz / 2)
  const h = sDe * sDe + Math.cos(e0) * Math.cos(e1) * sDa * sDa
  return (2 * Math.asin(Math.min(1, Math.sqrt(h)))) / DEG
}
