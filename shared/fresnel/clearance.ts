import { requireFinite, requireNonNegative, requirePositive } from '../units/guards.js'
import { EARTH_RADIUS_M, STANDARD_K_FACTOR } from '../geo/slant.js'
import { earthBulgeM } from './earthBulge.js'
import { knifeEdgeLossDb, knifeEdgeNu } from './knifeEdge.js'
import { fresnelZoneRadiusM, REQUIRED_CLEARANCE_FRACTION } from './zone.js'

/** A straight path from a ground antenna to an aircraft; heights above one flat datum. */
export interface LinkPath {
  /** Carrier frequency, Hz. */
  freqHz: number
  /** Ground antenna height above the datum, metres. */
  groundAntennaHeightM: number
  /** Aircraft height above the datum, metres. */
  aircraftHeightM: number
  /** Horizontal path length, metres (> 0). */
  pathLengthM: number
  /** Effective-earth-radius factor (default 4/3). */
  kFactor?: number
  /** Earth radius, metres (default 6 371 000). */
  earthRadiusM?: number
}

/** Line-of-sight clearance over one obstacle and what it implies. */
export interface ClearanceResult {
  /** Height of the straight ray above the datum at the obstacle, m. */
  rayHeightM: number
  /** Earth bulge added to the obstacle, m. */
  bulgeM: number
  /** Ray height minus (obstacle + bulge), m; negative when the ray is blocked. */
  clearanceM: number
  /** Same without the bulge, m. */
  clearanceFlatM: number
  /** First Fresnel zone radius at the obstacle, m. */
  f1RadiusM: number
  /** clearanceM / F1. */
  clearanceFraction: number
  /** True when clearanceFraction >= 0.6 (common practice). */
  meetsClearanceRule: boolean
  /** Knife-edge parameter ν. */
  knifeEdgeNu: number
  /** Knife-edge loss J(ν), dB. */
  knifeEdgeLossDb: number
}

/**
 * Clearance of the line of sight above an obstacle, with earth bulge, F1 fraction, 60 % verdict and knife-edge loss.
 * @param path frequency (Hz), antenna and aircraft heights (m above datum), horizontal length (m), k, Re
 * @param obstacleDistanceM horizontal distance of the obstacle from the ground antenna in metres, in (0, pathLengthM)
 * @param obstacleHeightM obstacle top above the datum in metres, finite
 * @returns clearance figures; d1/d2 are horizontal (small elevation angles)
 * @throws RangeError when an argument is out of range
 */
export function lineOfSightClearance(
  path: LinkPath,
  obstacleDistanceM: number,
  obstacleHeightM: number,
): ClearanceResult {
  const { freqHz, groundAntennaHeightM: hg, aircraftHeightM: ha, pathLengthM: dist } = path
  requireFinite('groundAntennaHeightM', hg)
  requireFinite('aircraftHeightM', ha)
  requirePositive('pathLengthM', dist)
  requireNonNegative('obstacleDistanceM', obstacleDistanceM)
  requireFinite('obstacleHeightM', obstacleHeightM)
  if (!(obstacleDistanceM > 0 && obstacleDistanceM < dist)) {
    throw new RangeError(`obstacleDistanceM must be in (0, ${dist}), got ${obstacleDistanceM}`)
  }
  const d1 = obstacleDistanceM
  const d2 = dist - d1
  // straight ray between the antenna tops over a flat datum
  const rayHeightM = hg + ((ha - hg) * d1) / dist
  const bulgeM = earthBulgeM(d1, d2, path.kFactor ?? STANDARD_K_FACTOR, path.earthRadiusM ?? EARTH_RADIUS_M)
  const clearanceFlatM = rayHeightM - obstacleHeightM
  const clearanceM = clearanceFlatM - bulgeM
  const f1RadiusM = fresnelZoneRadiusM(freqHz, d1, d2, 1)
  const clearanceFraction = clearanceM / f1RadiusM
  const nu = knifeEdgeNu(clearanceM, f1RadiusM)
  return {
    rayHeightM,
    bulgeM,
    clearanceM,
    clearanceFlatM,
    f1RadiusM,
    clearanceFraction,
    meetsClearanceRule: clearanceFraction >= REQUIRED_CLEARANCE_FRACTION,
    knifeEdgeNu: nu,
    knifeEdgeLossDb: knifeEdgeLossDb(nu),
  }
}
