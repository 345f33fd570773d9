import { meridianRadiusM, primeVerticalRadiusM } from '../geo/wgs84.js'
import { type GroundStation, type TerrainSampler } from './types.js'

/** Limiting code: flat ground (with earth bulge) limits the clearance. */
export const LIMITING_GROUND = -1
/** Limiting code: the terrain sampler's ground limits the clearance. */
export const LIMITING_TERRAIN = -2
/** Limiting code: nothing limits it (zone clear, or no fix). */
export const LIMITING_NONE = -3

/** Stored clearance fractions are capped here: at 1 the first Fresnel zone is wholly clear. */
export const CLEARANCE_FRACTION_CAP = 1

const DEG = Math.PI / 180

/** Samples a terrain model along station→aircraft paths given in local east/north metres. */
export interface TerrainProbe {
  /**
   * Worst F1 clearance fraction over the terrain between station and aircraft.
   * @param eastM aircraft east of the station, m
   * @param northM aircraft north of the station, m
   * @param pathLengthM horizontal path length, m (> 0)
   * @param aircraftHeightM aircraft height above the station ground, m
   * @returns clearance / F1 at the worst terrain point
   */
  worstFraction(eastM: number, northM: number, pathLengthM: number, aircraftHeightM: number): number
}

/**
 * Builds a terrain probe that checks samplesPerPath − 1 evenly spaced points of each path.
 * @param terrain elevation lookup (m above mean sea level) and points per path (>= 2, default 16)
 * @param station ground station; its ground elevation is the datum
 * @param wavelengthMetres carrier wavelength, m (> 0)
 * @param twoKEarthRadiusM 2·k·Re, m (> 0)
 * @returns the probe
 * @throws RangeError from the probe when the sampler returns a non-finite elevation
 */
export function createTerrainProbe(
  terrain: TerrainSampler,
  station: GroundStation,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
): TerrainProbe {
  const n = Math.max(2, Math.floor(terrain.samplesPerPath ?? 16))
  const lat0 = station.latDeg
  const mPerDegLat = meridianRadiusM(lat0) * DEG
  const mPerDegLon = primeVerticalRadiusM(lat0) * Math.cos(lat0 * DEG) * DEG
  const hg = station.antennaHeightM
  return {
    worstFraction(eastM, northM, pathLengthM, aircraftHeightM) {
      let worst = Infinity
      for (let j = 1; j < n; j++) {
        const f = j / n
        const elev = terrain.elevationAmslM(lat0 + (f * northM) / mPerDegLat, station.lonDeg + (f * eastM) / mPerDegLon)
        if (!Number.isFinite(elev)) throw new RangeError(`terrain.elevationAmslM returned ${elev}`)
        const d1 = f * pathLengthM
        const d2 = pathLengthM - d1
        // straight ray over terrain plus bulge, F1 by ITU-R P.526 eq. (2)
        const c = hg + (aircraftHeightM - hg) * f - (elev - station.groundElevM) - (d1 * d2) / twoKEarthRadiusM
        const fr = c / Math.sqrt((wavelengthMetres * d1 * d2) / pathLengthM)
        if (fr < worst) worst = fr
      }
      return worst
    },
  }
}
