import { requirePositive } from '../units/guards.js'
import { type ClearanceResult, type LinkPath, lineOfSightClearance } from './clearance.js'

/** Worst point of a terrain profile under the line of sight. */
export interface ProfileClearance extends ClearanceResult {
  /** Horizontal distance of the worst point from the ground antenna, m. */
  distanceM: number
  /** Index of the worst point in the profile. */
  index: number
}

/**
 * Lowest F1 clearance fraction of the line of sight over a terrain profile (each point treated as a knife edge).
 * @param path link geometry; heights above the same datum as the profile
 * @param profileDistanceM horizontal distances from the ground antenna in metres; points outside (0, pathLengthM) are skipped
 * @param profileElevationM terrain (plus clutter) height above the datum at each distance, metres
 * @returns the worst point, or null when no profile point lies inside the path
 * @throws RangeError when lengths differ or a value is out of range
 */
export function terrainProfileClearance(
  path: LinkPath,
  profileDistanceM: Float64Array,
  profileElevationM: Float64Array,
): ProfileClearance | null {
  requirePositive('pathLengthM', path.pathLengthM)
  if (profileDistanceM.length !== profileElevationM.length) {
    throw new RangeError('profileElevationM must have the same length as profileDistanceM')
  }
  let worst: ProfileClearance | null = null
  for (let i = 0; i < profileDistanceM.length; i++) {
    const d = profileDistanceM[i]!
    if (!(d > 0 && d < path.pathLengthM)) continue
    // the worst knife edge dominates, as in ITU-R P.526 §4.5 (principal edge)
    const c = lineOfSightClearance(path, d, profileElevationM[i]!)
    if (worst === null || c.clearanceFraction < worst.clearanceFraction) worst = { ...c, distanceM: d, index: i }
  }
  return worst
}
