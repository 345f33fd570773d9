import { createLocalProjection } from '../geo/localProjection.js'
import { fastLog10 } from '../stats/fastLog10.js'
import { DEFAULT_MAX_ATTENUATION_DB } from '../antenna/pattern.js'
import { type PreparedObstacles } from '../fresnel/obstacles.js'
import { createClearanceScratch, createObstacleTracker, trackedObstacleClearance } from '../fresnel/obstacleClearance.js'
import { groundClearanceFraction } from '../fresnel/groundClearance.js'
import { REQUIRED_CLEARANCE_FRACTION } from '../fresnel/zone.js'
import { type ResolvedAntennas } from './validateInput.js'
import { CLEARANCE_FRACTION_CAP, LIMITING_GROUND, LIMITING_NONE, LIMITING_TERRAIN, type TerrainProbe } from './clearancePass.js'
import { type FlightInput } from './types.js'

/** Per-sample geometry and clearance of a flight relative to the ground station. */
export interface FlightGeometry {
  distanceM: Float64Array
  /**
   * log10 of the 3-D slant range from the ground antenna to the aircraft, m (ground distance when the height is
   * missing). The fit and predicted margins use it: close in and high up, ground distance understates the path
   * and biases the exponent upward. Float32 keeps 1e-6 dB.
   */
  log10SlantRangeM: Float32Array
  /** Subtract from altM to get height above the station ground, m (ground elevation for AMSL, else 0). */
  altitudeOffsetM: number
  /** Gain lost to pointing against the best boresight gain at sample i, dB (0 without directional antennas or a fix). */
  pointingLossDb: (index: number) => number
  /** Best diversity antenna, dBm (the rssiDbm array itself without a second antenna). */
  rxBestDbm: Float64Array | Float32Array
  /** Worst F1 clearance fraction, capped at CLEARANCE_FRACTION_CAP; NaN without a fix. */
  clearanceFraction: Float32Array
  /** LIMITING_* code or obstacle index of the worst clearance. */
  limitingObstacle: Int16Array
  validFixCount: number
  /** 3-D length of the track over consecutive fixes, m. */
  distanceFlownM: number
  /** Largest straight-line range from the antenna, m (NaN without fixes). */
  maxSlantRangeM: number
  /** Extremes over samples with a fix (±Infinity when none). */
  minDistanceM: number
  maxDistanceM: number
  maxHeightM: number
  minClearanceFraction: number
  /** Samples with a clearance fraction below the 60 % rule, by limiting code + 3 (index 0 = none, 1 = terrain, 2 = ground, 3.. = obstacles). */
  belowRuleByCode: Int32Array
  /** Samples with a clearance fraction (fix and altitude present). */
  clearanceSampleCount: number
}

const DEG = Math.PI / 180
const RAD_TO_DEG = 180 / Math.PI

// arccos for the pattern loop: Abramowitz & Stegun 4.4.46, |error| <= 2e-8 rad (1e-6°), no libm call
function arcCosine(x: number): number {
  const a = x < 0 ? -x : x
  const p =
    1.5707963050 +
    a * (-0.2145988016 + a * (0.0889789874 + a * (-0.0501743046 + a * (0.0308918810 + a * (-0.0170881256 + a * (0.0066700901 + a * -0.0012624911))))))
  const r = Math.sqrt(1 - a) * p
  return x < 0 ? Math.PI - r : r
}

/**
 * Pointing loss on demand: only dropout samples need it, so the per-sample pass does not pay for the pattern.
 * @param input validated flight input
 * @param antennas resolved receive antennas
 * @param proj the flight-wide local projection around the station
 * @returns loss of the best antenna toward sample i against the best boresight gain, dB (>= 0; 0 without a fix)
 */
function createPointingProbe(
  input: FlightInput,
  antennas: ResolvedAntennas,
  proj: ReturnType<typeof createLocalProjection>,
): (index: number) => number {
  const { samples: s, station } = input
  const { count: nAnt, anyDirectional, gainDbi, directional, beamwidthDeg, bx, by, bz, maxGainDbi } = antennas
  if (!anyDirectional) return () => 0
  const datumOffset = input.altitudeReference === 'AMSL' ? station.groundElevM : 0
  const { east0, east1, east2, north0, north1, north2 } = proj
  // beyond 1.29 beamwidths the parabola is floored at A_m, so acos is needed only inside that cone
  const cosFloor = new Float64Array(nAnt)
  for (let k = 0; k < nAnt; k++) {
    const satDeg = beamwidthDeg[k]! * Math.sqrt(DEFAULT_MAX_ATTENUATION_DB / 12)
    cosFloor[k] = satDeg >= 180 ? -2 : Math.cos(satDeg * DEG)
  }
  return (i: number): number => {
    const lat = s.latDeg[i]!
    const lon = s.lonDeg[i]!
    if (!(lat === lat && lon === lon) || (lat === 0 && lon === 0)) return 0
    const dLat = lat - station.latDeg
    let dLon = lon - station.lonDeg
    if (dLon > 180) dLon -= 360
    else if (dLon < -180) dLon += 360
    const e = dLon * (east0 + dLat * (east1 + dLat * east2))
    const no = dLat * (north0 + dLat * (north1 + dLat * north2))
    const up = s.altM[i]! - datumOffset - station.antennaHeightM
    const slant2 = e * e + no * no + up * up
    if (!(slant2 > 0)) return 0
    const inv = 1 / Math.sqrt(slant2)
    let best = -Infinity
    for (let k = 0; k < nAnt; k++) {
      let g = gainDbi[k]!
      if (directional[k] === 1) {
        const c = (e * bx[k]! + no * by[k]! + up * bz[k]!) * inv
        if (c <= cosFloor[k]!) g -= DEFAULT_MAX_ATTENUATION_DB
        else {
          const r = (arcCosine(c > 1 ? 1 : c) * RAD_TO_DEG) / beamwidthDeg[k]!
          // 3GPP TR 36.942 §4.2.1.1 parabolic main lobe, floored at A_m
          const att = 12 * r * r
          g -= att < DEFAULT_MAX_ATTENUATION_DB ? att : DEFAULT_MAX_ATTENUATION_DB
        }
      }
      if (g > best) best = g
    }
    return best === best ? maxGainDbi - best : NaN
  }
}

/**
 * One fused pass over the samples: local offsets, distance, height, slant range, best-antenna power and clearance.
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
  const log10SlantRangeM = new Float32Array(len)
  const amsl = input.altitudeReference === 'AMSL'
  const altM = s.altM
  const r1 = s.rssiDbm
  const r2 = s.rssi2Dbm
  const rxBestDbm = r2 ? new Float32Array(len) : r1
  const clearanceFraction = new Float32Array(len)
  const limitingObstacle = new Int16Array(len)
  const latDeg = s.latDeg
  const lonDeg = s.lonDeg
  const datumOffset = amsl ? station.groundElevM : 0
  const hAnt = station.antennaHeightM
  const lat0 = station.latDeg
  const lon0 = station.lonDeg
  const hasObstacles = prep.circleR.length > 0
  const scratch = createClearanceScratch()
  const tracker = createObstacleTracker(prep)
  const proj = createLocalProjection(lat0, lon0)
  const { east0, east1, east2, north0, north1, north2 } = proj
  let valid = 0
  let flown = 0
  let minD = Infinity
  let maxD = -Infinity
  let maxH = -Infinity
  let minClear = Infinity
  let clearCount = 0
  const belowRuleByCode = new Int32Array(prep.labels.length + 3)
  let maxSlant = -Infinity
  let pe = NaN
  let pn = NaN
  let ph = NaN
  for (let i = 0; i < len; i++) {
    const lat = latDeg[i]!
    const lon = lonDeg[i]!
    const h = altM[i]! - datumOffset
    if (r2) {
      const a = r1[i]!
      const b = r2[i]!
      // diversity: the receiver uses the stronger antenna; NaN > x is false, so a missing one is skipped
      rxBestDbm[i] = b > a || a !== a ? b : a
    }
    // a 0,0 fix is the GPS's "no fix yet" frame, not a position in the Gulf of Guinea
    if (!(lat === lat && lon === lon) || (lat === 0 && lon === 0)) {
      distanceM[i] = log10SlantRangeM[i] = clearanceFraction[i] = NaN
      limitingObstacle[i] = LIMITING_NONE
      continue
    }
    valid++
    // flight-wide local plane (geo/localProjection.ts): mid-latitude WGS-84 scales as a series in Δlat
    const dLat = lat - lat0
    let dLon = lon - lon0
    if (dLon > 180) dLon -= 360
    else if (dLon < -180) dLon += 360
    const e = dLon * (east0 + dLat * (east1 + dLat * east2))
    const no = dLat * (north0 + dLat * (north1 + dLat * north2))
    const d2 = e * e + no * no
    const d = Math.sqrt(d2)
    distanceM[i] = d
    if (d < minD) minD = d
    if (d > maxD) maxD = d
    if (h > maxH) maxH = h
    const up = h - hAnt
    const slant2 = d2 + up * up
    // log10(√s²) = ½·log10(s²): no square root; without a height the ground distance stands in
    log10SlantRangeM[i] = slant2 === slant2 ? 0.5 * fastLog10(slant2) : fastLog10(d)
    if (slant2 > maxSlant) maxSlant = slant2
    if (pe === pe) {
      const dh = h - ph
      flown += Math.sqrt((e - pe) * (e - pe) + (no - pn) * (no - pn) + (dh === dh ? dh * dh : 0))
    }
    pe = e
    pn = no
    ph = h
    let worst = groundClearanceFraction(d, hAnt, h, wavelengthMetres, twoKEarthRadiusM, CLEARANCE_FRACTION_CAP)
    let limiting = LIMITING_GROUND
    if (hasObstacles) {
      const f = trackedObstacleClearance(tracker, e, no, hAnt, h, wavelengthMetres, twoKEarthRadiusM, scratch, d)
      if (f < worst) (worst = f), (limiting = scratch.obstacleIndex)
    }
    if (terrain !== null && d > 0) {
      const f = terrain.worstFraction(e, no, d, h)
      if (f < worst) (worst = f), (limiting = LIMITING_TERRAIN)
    }
    // NaN (no altitude) stays NaN rather than reading as clear
    clearanceFraction[i] = worst !== worst ? NaN : worst < CLEARANCE_FRACTION_CAP ? worst : CLEARANCE_FRACTION_CAP
    limitingObstacle[i] = worst < CLEARANCE_FRACTION_CAP ? limiting : LIMITING_NONE
    if (worst === worst) {
      clearCount++
      if (worst < minClear) minClear = worst
      // common practice, no source: the 60 % first-zone rule
      if (worst < REQUIRED_CLEARANCE_FRACTION) belowRuleByCode[limiting + 3]!++
    }
  }
  return {
    distanceM,
    log10SlantRangeM,
    altitudeOffsetM: datumOffset,
    pointingLossDb: createPointingProbe(input, antennas, proj),
    rxBestDbm,
    clearanceFraction,
    limitingObstacle,
    validFixCount: valid,
    distanceFlownM: flown,
    maxSlantRangeM: maxSlant >= 0 ? Math.sqrt(maxSlant) : NaN,
    minDistanceM: minD,
    maxDistanceM: maxD,
    maxHeightM: maxH,
    minClearanceFraction: minClear < CLEARANCE_FRACTION_CAP ? minClear : CLEARANCE_FRACTION_CAP,
    belowRuleByCode,
    clearanceSampleCount: clearCount,
  }
}
