import { requireInRange, requirePositive } from '../units/guards.js'

/** WGS-84 semi-major axis in metres (NIMA TR8350.2, table 3.1). */
export const WGS84_A_M = 6378137
/** WGS-84 flattening, dimensionless (NIMA TR8350.2, table 3.1: 1/298.257223563). */
export const WGS84_F = 1 / 298.257223563
/** WGS-84 semi-minor axis in metres, b = a(1 − f). */
export const WGS84_B_M = WGS84_A_M * (1 - WGS84_F)
/** WGS-84 first eccentricity squared, e² = f(2 − f). */
export const WGS84_E2 = WGS84_F * (2 - WGS84_F)
/** IUGG mean earth radius R1 = (2a + b)/3 in metres, used by the spherical formulas. */
export const MEAN_EARTH_RADIUS_M = 6371008.8

const DEG = Math.PI / 180

/**
 * Meridian (north–south) radius of curvature of the WGS-84 ellipsoid.
 * @param latDeg geodetic latitude in degrees, [-90, 90]
 * @returns radius of curvature M in metres
 * @throws RangeError when latDeg is outside [-90, 90]
 */
export function meridianRadiusM(latDeg: number): number {
  requireInRange('latDeg', latDeg, -90, 90)
  const s = Math.sin(latDeg * DEG)
  const w = 1 - WGS84_E2 * s * s
  // M = a(1 − e²)/(1 − e² sin²φ)^(3/2), standard geodesy (e.g. Torge, Geodesy §6.2)
  return (WGS84_A_M * (1 - WGS84_E2)) / (w * Math.sqrt(w))
}

/**
 * Prime-vertical (east–west) radius of curvature of the WGS-84 ellipsoid.
 * @param latDeg geodetic latitude in degrees, [-90, 90]
 * @returns radius of curvature N in metres
 * @throws RangeError when latDeg is outside [-90, 90]
 */
export function primeVerticalRadiusM(latDeg: number): number {
  requireInRange('latDeg', latDeg, -90, 90)
  const s = Math.sin(latDeg * DEG)
  // N = a/√(1 − e² sin²φ), standard geodesy (e.g. Torge, Geodesy §6.2)
  return WGS84_A_M / Math.sqrt(1 - WGS84_E2 * s * s)
}

/**
 * Relative error of a spherical distance over a short path, sphere radius over the ellipsoid's local radius minus 1.
 * @param latDeg latitude of the path in degrees, [-90, 90]
 * @param direction 'north-south' uses the meridian radius, 'east-west' the prime-vertical radius
 * @param sphereRadiusM radius of the sphere in metres, > 0 (default IUGG R1)
 * @returns dimensionless scale error, e.g. +0.0056 at the equator north–south
 * @throws RangeError when latDeg or sphereRadiusM is out of range
 */
export function sphericalScaleError(
  latDeg: number,
  direction: 'north-south' | 'east-west',
  sphereRadiusM = MEAN_EARTH_RADIUS_M,
): number {
  requirePositive('sphereRadiusM', sphereRadiusM)
  const r = direction === 'north-south' ? meridianRadiusM(latDeg) : primeVerticalRadiusM(latDeg)
  return sphereRadiusM / r - 1
}
