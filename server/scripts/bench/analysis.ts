// Benchmark of analyseFlight on a synthetic 1,000,000-sample flight against a plain distance loop.
// Run: npx tsx server/scripts/bench/analysis.ts
import { analyseFlight, type FlightInput, type Obstacle } from '../../../shared/index.js'

const SAMPLES = 1_000_000
const RUNS = 9
/** Mean earth radius, m (IUGG R1), written out so the reference loop imports nothing from the library. */
const EARTH_RADIUS_M = 6_371_008.8

/** Seeded PRNG (mulberry32): the same flight on every run and machine. */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

function syntheticFlight(n: number, seed: number): FlightInput {
  const rnd = mulberry32(seed)
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd())
  const station = { latDeg: 47.3977, lonDeg: 8.5456, antennaHeightM: 2, groundElevM: 410 }
  const timeMs = new Float64Array(n)
  const latDeg = new Float64Array(n)
  const lonDeg = new Float64Array(n)
  const altM = new Float64Array(n)
  const rssiDbm = new Float64Array(n)
  const rssi2Dbm = new Float64Array(n)
  const lqPct = new Float64Array(n)
  const mPerDegLat = 111_200
  const mPerDegLon = 111_320 * Math.cos((station.latDeg * Math.PI) / 180)
  let t = 0
  for (let i = 0; i < n; i++) {
    // 20 Hz frames with an occasional telemetry gap
    t += rnd() < 1e-4 ? 2500 : 50
    timeMs[i] = t
    // out-and-back legs to 3 km on slowly turning headings; every tenth leg pushes out to 8 km
    const leg = Math.floor(i / 6000)
    const phase = (i % 6000) / 6000
    const reach = leg % 10 === 9 ? 8000 : 3000
    const r = reach * (phase < 0.5 ? phase * 2 : (1 - phase) * 2) + 5
    const hdg = (leg * 37) % 360
    const east = r * Math.sin((hdg * Math.PI) / 180)
    const north = r * Math.cos((hdg * Math.PI) / 180)
    latDeg[i] = station.latDeg + north / mPerDegLat
    lonDeg[i] = station.lonDeg + east / mPerDegLon
    altM[i] = station.groundElevM + 40 + 60 * phase
    // log-distance signal with 2.5 dB shadowing; the second antenna sees an independent fade
    const base = -18 - 22 * Math.log10(r) + 2.5 * gauss()
    rssiDbm[i] = rnd() < 2e-5 ? -130 : base
    rssi2Dbm[i] = base - 3 + 2 * gauss()
    lqPct[i] = base > -106 ? 100 : 30
  }
  const obstacles: Obstacle[] = [
    { kind: 'point', label: 'mast', heightM: 25, radiusM: 1, position: { latDeg: 47.4, lonDeg: 8.55 } },
    {
      kind: 'line',
      label: 'tree line',
      heightM: 18,
      path: [
        { latDeg: 47.39, lonDeg: 8.53 },
        { latDeg: 47.395, lonDeg: 8.56 },
      ],
    },
    {
      kind: 'polygon',
      label: 'barn',
      heightM: 9,
      ring: [
        { latDeg: 47.401, lonDeg: 8.541 },
        { latDeg: 47.401, lonDeg: 8.5425 },
        { latDeg: 47.402, lonDeg: 8.5425 },
        { latDeg: 47.402, lonDeg: 8.541 },
      ],
    },
  ]
  return {
    samples: { timeMs, latDeg, lonDeg, altM, rssiDbm, rssi2Dbm, lqPct },
    station,
    altitudeReference: 'AMSL',
    setup: {
      freqMHz: 2440,
      txPowerDbm: 20,
      txGainDbi: 2,
      rxAntennas: [
        { gainDbi: 2, kind: 'omni' },
        { gainDbi: 10, kind: 'directional', azimuthDeg: 45, elevationDeg: 5 },
      ],
      cableLossDb: 1,
      sensitivityDbm: -105,
      floorDbm: -130,
    },
    obstacles,
  }
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]!
}

function time(fn: () => void): number {
  const t0 = performance.now()
  fn()
  return performance.now() - t0
}

const input = syntheticFlight(SAMPLES, 20250601)
const { latDeg, lonDeg } = input.samples

/**
 * Reference: a plain typed-array loop computing haversine distances inline, with no library calls and no argument
 * checks; the analysis is measured against this.
 */
function haversineOnly(lat0: number, lon0: number, lat: Float64Array, lon: Float64Array): Float64Array {
  const out = new Float64Array(lat.length)
  const rad = Math.PI / 180
  const cosLat0 = Math.cos(lat0 * rad)
  for (let i = 0; i < lat.length; i++) {
    const sLat = Math.sin((lat[i]! - lat0) * (rad / 2))
    const sLon = Math.sin((lon[i]! - lon0) * (rad / 2))
    const h = sLat * sLat + cosLat0 * Math.cos(lat[i]! * rad) * sLon * sLon
    out[i] = 2 * EARTH_RADIUS_M * Math.asin(Math.sqrt(h))
  }
  return out
}
let sink = 0
const distanceLoop = () => {
  sink += haversineOnly(input.station.latDeg, input.station.lonDeg, latDeg, lonDeg)[SAMPLES - 1]! > 0 ? 1 : 0
}
const analysis = () => {
  sink += analyseFlight(input, { fadeMarginDb: 10 }).result.dropouts.length
}

// warm up both so the JIT has compiled the hot loops before timing
for (let i = 0; i < 3; i++) {
  distanceLoop()
  analysis()
}
// interleaved so that load from other processes (the machine is shared) hits both alike
const distTimes: number[] = []
const anaTimes: number[] = []
const ratios: number[] = []
for (let i = 0; i < RUNS; i++) {
  const d = time(distanceLoop)
  const a = time(analysis)
  distTimes.push(d)
  anaTimes.push(a)
  ratios.push(a / d)
}
const distMs = median(distTimes)
const anaMs = median(anaTimes)
const last = analyseFlight(input, { fadeMarginDb: 10 }).result

console.log(`synthetic flight: ${SAMPLES} samples, 3 obstacles, diversity omni + directional, ${RUNS} timed runs after 3 warm-ups`)
console.log(`fit: n = ${last.fit?.exponent.toFixed(3)}, sigma = ${last.fit?.residualSigmaDb.toFixed(2)} dB, dropouts = ${last.dropouts.length} (${JSON.stringify(last.summary.dropoutsByCause)})`)
console.log('reference loop: inline haversine per fix into a new Float64Array (no library calls, no checks)')
console.log(`full analysis median ${anaMs.toFixed(1)} ms (min ${Math.min(...anaTimes).toFixed(1)}), distance loop median ${distMs.toFixed(1)} ms (min ${Math.min(...distTimes).toFixed(1)}) (checksum ${sink})`)
console.log(`analysis_1m_ms: ${anaMs.toFixed(1)}`)
console.log(`analysis_1m_min_ms: ${Math.min(...anaTimes).toFixed(1)}`)
console.log(`distance_loop_ms: ${distMs.toFixed(1)}`)
console.log(`distance_loop_min_ms: ${Math.min(...distTimes).toFixed(1)}`)
console.log(`analysis_ratio: ${(anaMs / distMs).toFixed(2)}`)
console.log(`analysis_ratio_of_mins: ${(Math.min(...anaTimes) / Math.min(...distTimes)).toFixed(2)}`)
console.log(`analysis_ratio_median_paired: ${median(ratios).toFixed(2)}`)
console.log(`analysis_samples_per_s: ${Math.round(SAMPLES / (anaMs / 1000))}`)
