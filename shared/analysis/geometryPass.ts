import { WGS84_A_M, WGS84_E2 } from '../geo/wgs84.js'
import { DEFAULT_MAX_ATTENUATION_DB } from '../antenna/pattern.js'
import { createClearanceScratch, type PreparedObstacles, worstObstacleClearance } from '../fresnel/obstacles.js'
import { groundClearanceFraction } from '../fresnel/groundClearance.js'
import { type ResolvedAntennas } from './validateInput.js'
import { CLEARANCE_FRACTION_CAP, LIMITING_GROUND, LIMITING_NONE, LIMITING_TERRAIN, type TerrainProbe } from './clearancePass.js'
import { type FlightInput } from './types.js'

/** Per-sample geometry and clearance of a flight relative to the ground station. */
export interface FlightGeometry {
  distanceM: Float64Array
  /** log10 of the ground distance in metres (for the fit and predictions). */
  log10DistanceM: Float64Array
  heightM: Float64Array
  slantRangeM: Float64Array
  pointingLossDb: Float64Array
  rxBestDbm: Float64Array
  /** Worst F1 clearance fraction, capped at CLEARANCE_FRACTION_CAP; NaN without a fix. */
  clearanceFraction: Float64Array
  /** LIMITING_* code or obstacle index of the worst clearance. */
  limitingObstacle: Int32Array
  validFixCount: number
  /** 3-D length of the track over consecutive fixes, m. */
  distanceFlownM: number
}

const DEG = Math.PI / 180
const RAD_TO_DEG = 180 / Math.PI

/**
 * One fused pass over the samples: local offsets, distance, height, slant range, pointing loss, best-antenna power and clearance.
 * @param input validated flight input
 * @param antennas resolved receive antennas
 * @param prep obstacles projected around the station
 * @param wavelengthMetres carrier wavelength, m (> 0)
 * @param twoKEarthRadiusM 2·k·Re, m (> 0)
 * @param terrain optional terrain probe
 * @returns typed arrays of the flight's length; NaN where the fix is missing
 * @throws RangeError only from the terrain probe; input is validated beforehand
 */
export function computeGeometry(
  input: FlightInput,
  antennas: ResolvedAntennas,
  prep: PreparedObstacles,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
  terrain: TerrainProbe | null,
): FlightGeometry {
  const { samples: s, station } = input
  const len = s.timeMs.length
  const distanceM = new Float64Array(len)
  const log10DistanceM = new Float64Array(len)
  const heightM = new Float64Array(len)
  const slantRangeM = new Float64Array(len)
  const pointingLossDb = new Float64Array(len)
  const rxBestDbm = new Float64Array(len)
  const clearanceFraction = new Float64Array(len)
  const limitingObstacle = new Int32Array(len)
  const datumOffset = input.altitudeReference === 'AMSL' ? station.groundElevM : 0
  const hAnt = station.antennaHeightM
  const lat0 = station.latDeg
  const lon0 = station.lonDeg
  const r1 = s.rssiDbm
  const r2 = s.rssi2Dbm
  const nAnt = antennas.count
  const hasObstacles = prep.circleR.length > 0
  const scratch = createClearanceScratch()
  const ae2 = 1 - WGS84_E2
  let valid = 0
  let flown = 0
  let pe = NaN
  let pn = NaN
  let ph = NaN
  for (let i = 0; i < len; i++) {
    const lat = s.latDeg[i]!
    const lon = s.lonDeg[i]!
    const h = s.altM[i]! - datumOffset
    heightM[i] = h
    const a = r1[i]!
    const b = r2 ? r2[i]! : NaN
    // diversity: the receiver uses the stronger antenna; NaN > x is false, so a missing one is skipped
    rxBestDbm[i] = b > a || a !== a ? b : a
    // a 0,0 fix is the GPS's "no fix yet" frame, not a position in the Gulf of Guinea
    if (!(lat === lat && lon === lon) || (lat === 0 && lon === 0)) {
      distanceM[i] = log10DistanceM[i] = slantRangeM[i] = clearanceFraction[i] = NaN
      limitingObstacle[i] = LIMITING_NONE
      continue
    }
    valid++
    // mid-latitude WGS-84 plane, as in geo/localOffset.ts (error O((d/R)²))
    const mid = (lat0 + lat) * (DEG / 2)
    const sm = Math.sin(mid)
    const w = 1 - WGS84_E2 * sm * sm
    const nRad = WGS84_A_M / Math.sqrt(w)
    let dLon = lon - lon0
    if (dLon > 180) dLon -= 360
    else if (dLon < -180) dLon += 360
    const e = dLon * DEG * nRad * Math.cos(mid)
    const no = (lat - lat0) * DEG * ((nRad * ae2) / w)
    const d = Math.sqrt(e * e + no * no)
    distanceM[i] = d
    log10DistanceM[i] = Math.log10(d)
    const up = h - hAnt
    const slant = Math.sqrt(d * d + up * up)
    slantRangeM[i] = slant
    if (pe === pe) {
      const dh = h - ph
      flown += Math.sqrt((e - pe) * (e - pe) + (no - pn) * (no - pn) + (dh === dh ? dh * dh : 0))
    }
    pe = e
    pn = no
    ph = h
    if (antennas.anyDirectional && slant > 0) {
      const inv = 1 / slant
      let best = -Infinity
      for (let k = 0; k < nAnt; k++) {
        let g = antennas.gainDbi[k]!
        if (antennas.directional[k] === 1) {
          let c = (e * antennas.bx[k]! + no * antennas.by[k]! + up * antennas.bz[k]!) * inv
          c = c > 1 ? 1 : c < -1 ? -1 : c
          const r = (Math.acos(c) * RAD_TO_DEG) / antennas.beamwidthDeg[k]!
          // 3GPP TR 36.942 §4.2.1.1 parabolic main lobe, floored at A_m
          const att = 12 * r * r
          g -= att < DEFAULT_MAX_ATTENUATION_DB ? att : DEFAULT_MAX_ATTENUATION_DB
        }
        if (g > best) best = g
      }
      pointingLossDb[i] = best === best ? antennas.maxGainDbi - best : NaN
    }
    let worst = groundClearanceFraction(d, hAnt, h, wavelengthMetres, twoKEarthRadiusM)
    let limiting = LIMITING_GROUND
    if (hasObstacles) {
      const f = worstObstacleClearance(prep, e, no, hAnt, h, wavelengthMetres, twoKEarthRadiusM, scratch)
      if (f < worst) (worst = f), (limiting = scratch.obstacleIndex)
    }
    if (terrain !== null && d > 0) {
      const f = terrain.worstFraction(e, no, d, h)
      if (f < worst) (worst = f), (limiting = LIMITING_TERRAIN)
    }
    // NaN (no altitude) stays NaN rather than reading as clear
    clearanceFraction[i] = worst !== worst ? NaN : worst < CLEARANCE_FRACTION_CAP ? worst : CLEARANCE_FRACTION_CAP
    limitingObstacle[i] = worst < CLEARANCE_FRACTION_CAP ? limiting : LIMITING_NONE
  }
  return {
    distanceM,
    log10DistanceM,
    heightM,
    slantRangeM,
    pointingLossDb,
    rxBestDbm,
    clearanceFraction,
    limitingObstacle,
    validFixCount: valid,
    distanceFlownM: flown,
  }
}
