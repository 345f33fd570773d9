import { createClearanceScratch, prepareObstacles, worstObstacleClearance, type Obstacle } from '../fresnel/obstacles.js'
import { knifeEdgeLossDb, knifeEdgeNu } from '../fresnel/knifeEdge.js'
import { EARTH_RADIUS_M, STANDARD_K_FACTOR } from '../geo/slant.js'
import { localOffsetM } from '../geo/localOffset.js'
import { wavelengthM } from '../rf/wavelength.js'
import { requireFinite, requireInRange } from '../units/guards.js'
import { flyOutAndBack, type FlightProfile } from './flightPath.js'
import { offsetToLatLonDeg } from './localInverse.js'
import { createSeededRandom } from './random.js'
import { createShadowField } from './shadowField.js'
import {
  antennaGainTowardDbi,
  reflectionFadeDb,
  truthPathLossDb,
  type GeneratorAntenna,
  type PropagationTruth,
} from './signalModel.js'

/** The link setup a generated flight is flown with. */
export interface GeneratorSetup {
  freqMHz: number
  txPowerDbm: number
  txGainDbi: number
  /** One or two receive antennas (two = diversity, two signal columns). */
  rxAntennas: GeneratorAntenna[]
  /** Total cable and connector loss, dB. */
  cableLossDb: number
  sensitivityDbm: number
  /** What the log writes when nothing is heard, dBm (null: the sensitivity rounded down). */
  floorDbm: number | null
}

/** The test site: ground station, planned route, obstacles. */
export interface GeneratorCourse {
  stationLatDeg: number
  stationLonDeg: number
  /** Ground antenna height above ground, m. */
  antennaHeightM: number
  /** Planned route as [lon, lat] pairs, or null for a straight 2 km leg north-east. */
  routeLonLat: ReadonlyArray<readonly [number, number]> | null
  obstacles: readonly Obstacle[]
}

/** What to fly and which random stream to use. */
export interface GeneratedFlightSpec {
  seed: number
  profile: FlightProfile
  truth: PropagationTruth
  /** Telemetry gaps to cut out: at a share of the flight time in (0, 1), lasting durationMs. */
  gaps?: ReadonlyArray<{ atFraction: number; durationMs: number }>
}

/** A generated telemetry log as typed arrays, one entry per row. */
export interface GeneratedFlight {
  timeMs: Float64Array
  latDeg: Float64Array
  lonDeg: Float64Array
  /** Height above ground, m. */
  altM: Float64Array
  /** Logged signal per receive antenna, dBm (the floor value when below sensitivity). */
  rssiDbm: Float64Array[]
  /** Link quality, percent. */
  lqPct: Float64Array
  /** Signal-to-noise ratio of the better antenna, dB. */
  snrDb: Float64Array
  /** Knife-edge loss applied per sample, dB (the truth behind obstruction dropouts). */
  obstructionLossDb: Float64Array
}

/** SNR the modelled receiver shows at sensitivity: spread-spectrum links decode below the noise. */
const SNR_AT_SENSITIVITY_DB = -7
const TWO_K_EARTH_RADIUS_M = 2 * STANDARD_K_FACTOR * EARTH_RADIUS_M

function waypointsOf(course: GeneratorCourse): Array<[number, number]> {
  if (!course.routeLonLat || course.routeLonLat.length < 2) {
    return [[0, 0], [1414, 1414]]
  }
  const pts = course.routeLonLat.map(([lon, lat]) => {
    const o = localOffsetM(course.stationLatDeg, course.stationLonDeg, lat, lon)
    return [o.eastM, o.northM] as [number, number]
  })
  // take off beside the station when the route starts elsewhere
  const first = pts[0]!
  return Math.hypot(first[0], first[1]) > 20 ? [[5, 5], ...pts] : pts
}

function linkQualityPct(marginDb: number): number {
  if (marginDb < 0) return 0
  // logistic roll-off of packet success over the last few dB above sensitivity
  return Math.round(100 / (1 + Math.exp(-(marginDb - 2.5) / 1.2)))
}

/**
 * Generates one flight's telemetry from a physics model: log-distance loss, antenna gains and pattern, cable loss,
 * knife-edge loss over obstacles in the first Fresnel zone, correlated log-normal shadowing and a two-ray fade
 * pattern close in; below sensitivity the log holds the floor value. Deterministic for a given seed.
 * @param course station (deg), antenna height (m), route ([lon, lat]) and obstacles
 * @param setup frequency (MHz), powers (dBm), gains (dBi), losses (dB), sensitivity and floor (dBm)
 * @param spec seed, flight profile and propagation truth
 * @returns per-row arrays ready to write as a log
 * @throws RangeError when an input is out of range
 */
export function generateFlight(
  course: GeneratorCourse,
  setup: GeneratorSetup,
  spec: GeneratedFlightSpec,
): GeneratedFlight {
  requireInRange('setup.rxAntennas.length', setup.rxAntennas.length, 1, 2)
  requireFinite('setup.txPowerDbm', setup.txPowerDbm)
  requireFinite('setup.sensitivityDbm', setup.sensitivityDbm)
  const freqHz = setup.freqMHz * 1e6
  const lambda = wavelengthM(freqHz)
  const track = flyOutAndBack(waypointsOf(course), spec.profile)
  const keep = gapMask(track.timeMs, spec.gaps ?? [])
  const rng = createSeededRandom(spec.seed)
  const prep = prepareObstacles(course.obstacles, { latDeg: course.stationLatDeg, lonDeg: course.stationLonDeg }, 0)
  const scratch = createClearanceScratch()
  const nAnt = setup.rxAntennas.length
  const n = keep.reduce((a, k) => a + k, 0)
  const out: GeneratedFlight = {
    timeMs: new Float64Array(n),
    latDeg: new Float64Array(n),
    lonDeg: new Float64Array(n),
    altM: new Float64Array(n),
    rssiDbm: setup.rxAntennas.map(() => new Float64Array(n)),
    lqPct: new Float64Array(n),
    snrDb: new Float64Array(n),
    obstructionLossDb: new Float64Array(n),
  }
  const floor = setup.floorDbm ?? Math.floor(setup.sensitivityDbm)
  const decorrM = spec.truth.flightShadowDecorrelationM ?? 8
  const sigma = spec.truth.flightShadowSigmaDb ?? 1.5
  const field = createShadowField(
    spec.truth.shadowFieldSeed ?? 1,
    spec.truth.shadowSigmaDb,
    spec.truth.shadowCorrelationM ?? 40,
  )
  const shadow = new Float64Array(nAnt + 1)
  for (let k = 0; k <= nAnt; k++) shadow[k] = rng.normal() * sigma
  const hAnt = course.antennaHeightM
  let j = 0
  for (let i = 0; i < track.timeMs.length; i++) {
    // shadowing as a first-order autoregressive process over distance travelled (Gudmundson-style correlation)
    const step = i === 0 ? 0 : track.travelledM[i]! - track.travelledM[i - 1]!
    const rho = Math.exp(-step / decorrM)
    const innov = Math.sqrt(1 - rho * rho)
    for (let k = 0; k <= nAnt; k++) shadow[k] = rho * shadow[k]! + innov * sigma * rng.normal()
    const jitterE = rng.normal() * 0.4
    const jitterN = rng.normal() * 0.4
    if (keep[i] === 0) continue
    const east = track.eastM[i]!
    const north = track.northM[i]!
    const alt = track.altM[i]!
    const horiz = Math.hypot(east, north)
    const dz = alt - hAnt
    const geometry = {
      horizontalM: horiz,
      azimuthDeg: ((Math.atan2(east, north) * 180) / Math.PI + 360) % 360,
      elevationDeg: (Math.atan2(dz, Math.max(horiz, 0.1)) * 180) / Math.PI,
      antennaHeightM: hAnt,
      aircraftHeightM: alt,
    }
    const pathLoss = truthPathLossDb(Math.hypot(horiz, dz), freqHz, spec.truth.exponent)
    const frac = worstObstacleClearance(prep, east, north, hAnt, alt, lambda, TWO_K_EARTH_RADIUS_M, scratch)
    const knife = Number.isFinite(frac) ? knifeEdgeLossDb(knifeEdgeNu(scratch.clearanceM, scratch.f1RadiusM)) : 0
    const ground = field.atDb(east, north)
    // heading against the bearing to the station: the tail faces the station when flying straight away
    const k0 = Math.max(0, i - 1)
    const k1 = Math.min(track.timeMs.length - 1, i + 1)
    const vx = track.eastM[k1]! - track.eastM[k0]!
    const vy = track.northM[k1]! - track.northM[k0]!
    const vLen = Math.hypot(vx, vy)
    const awayCos = vLen > 0 && horiz > 1 ? (vx * east + vy * north) / (vLen * horiz) : 0
    const tail = ((spec.truth.tailShadowDb ?? 0) * (1 + awayCos)) / 2
    const common =
      ground -
      tail +
      setup.txPowerDbm + setup.txGainDbi - setup.cableLossDb - (spec.truth.hiddenLossDb ?? 0) - pathLoss - knife
    let best = -Infinity
    for (let k = 0; k < nAnt; k++) {
      const ant = setup.rxAntennas[k]!
      const gain = antennaGainTowardDbi(ant, geometry.azimuthDeg, geometry.elevationDeg)
      const fade = reflectionFadeDb(geometry, ant, lambda, spec.truth)
      // antennas share part of the shadowing (same aircraft, same surroundings)
      const sh = nAnt === 1 ? shadow[0]! : 0.7 * shadow[0]! + 0.71 * shadow[k + 1]!
      const pr = common + gain + fade + sh + rng.normal() * 0.8
      out.rssiDbm[k]![j] = pr < setup.sensitivityDbm ? floor : Math.round(pr)
      if (pr > best) best = pr
    }
    const margin = best - setup.sensitivityDbm
    out.lqPct[j] = linkQualityPct(margin)
    out.snrDb[j] = Math.round(Math.min(12, margin + SNR_AT_SENSITIVITY_DB) * 4) / 4
    const pos = offsetToLatLonDeg(course.stationLatDeg, course.stationLonDeg, east + jitterE, north + jitterN)
    out.timeMs[j] = track.timeMs[i]!
    out.latDeg[j] = pos.latDeg
    out.lonDeg[j] = pos.lonDeg
    out.altM[j] = Math.round(alt * 10) / 10
    out.obstructionLossDb[j] = knife
    j++
  }
  return out
}

function gapMask(timeMs: Float64Array, gaps: ReadonlyArray<{ atFraction: number; durationMs: number }>): Uint8Array {
  const keep = new Uint8Array(timeMs.length).fill(1)
  const total = timeMs[timeMs.length - 1] ?? 0
  for (const g of gaps) {
    requireInRange('gap.atFraction', g.atFraction, 0, 1)
    const start = g.atFraction * total
    for (let i = 0; i < timeMs.length; i++) {
      if (timeMs[i]! >= start && timeMs[i]! < start + g.durationMs) keep[i] = 0
    }
  }
  return keep
}
