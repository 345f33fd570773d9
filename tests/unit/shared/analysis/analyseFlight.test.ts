import { describe, expect, it } from 'vitest'
import { analyseFlight, METHOD_VERSION } from '../../../../shared/analysis/analyseFlight.js'
import { type FlightInput } from '../../../../shared/analysis/types.js'
import { createLocalProjection } from '../../../../shared/geo/localProjection.js'
import { freeSpaceLossDb } from '../../../../shared/rf/freeSpaceLoss.js'
import { generateFlight, type GeneratorCourse, type GeneratorSetup } from '../../../../shared/demo/generateFlight.js'
import { fitLogDistance } from '../../../../shared/propagation/logDistanceFit.js'
import { selectFitSamples } from '../../../../shared/propagation/fitSelection.js'

const station = { latDeg: 47.4, lonDeg: 8.5, antennaHeightM: 2, groundElevM: 400 }
const proj = createLocalProjection(station.latDeg, station.lonDeg)

/** Seeded normal deviates (Park–Miller + Box–Muller) so every run sees the same flight. */
function normals(seed: number) {
  let s = seed
  const u = () => (s = (s * 16807) % 2147483647) / 2147483647
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u())
}

/**
 * A flight straight out along a bearing and back at a fixed height, 10 Hz, with power from a
 * log-distance model on the slant range s: Pr = p1m − 10 n log10(s) + σ·N(0, 1).
 */
function radialFlight(opts: { n?: number; p1mDbm?: number; sigmaDb?: number; maxM?: number; heightM?: number; bearingDeg?: number; count?: number } = {}): FlightInput {
  const { n = 2.5, p1mDbm = -5, sigmaDb = 2, maxM = 3000, heightM = 60, bearingDeg = 0, count = 4000 } = opts
  const gauss = normals(12345)
  const timeMs = new Float64Array(count)
  const latDeg = new Float64Array(count)
  const lonDeg = new Float64Array(count)
  const altM = new Float64Array(count)
  const rssiDbm = new Float64Array(count)
  const b = (bearingDeg * Math.PI) / 180
  for (let i = 0; i < count; i++) {
    const phase = i / (count - 1)
    const r = 20 + (maxM - 20) * (phase < 0.5 ? 2 * phase : 2 - 2 * phase)
    timeMs[i] = i * 100
    latDeg[i] = station.latDeg + (r * Math.cos(b)) / proj.north0
    lonDeg[i] = station.lonDeg + (r * Math.sin(b)) / proj.east0
    altM[i] = heightM
    // the signal travels the slant range from the 2 m antenna to the aircraft
    rssiDbm[i] = p1mDbm - 10 * n * Math.log10(Math.hypot(r, heightM - station.antennaHeightM)) + sigmaDb * gauss()
  }
  return {
    samples: { timeMs, latDeg, lonDeg, altM, rssiDbm },
    station,
    altitudeReference: 'AGL',
    setup: { freqMHz: 2400, txPowerDbm: 20, txGainDbi: 2, rxAntennas: [{ gainDbi: 2, kind: 'omni' }], cableLossDb: 1, sensitivityDbm: -105, floorDbm: -130 },
  }
}

describe('analyseFlight', () => {
  it('recovers the path-loss exponent of a clean flight inside its 95 % interval', () => {
    const { result } = analyseFlight(radialFlight({ n: 2.5 }))
    expect(result.fit).not.toBeNull()
    expect(result.fit!.exponentLower).toBeLessThanOrEqual(2.5)
    expect(result.fit!.exponentUpper).toBeGreaterThanOrEqual(2.5)
    expect(result.fit!.residualSigmaDb).toBeCloseTo(2, 0)
    expect(result.model.source).toBe('fit')
    expect(result.dropouts).toHaveLength(0)
  })
  it('returns plain JSON: stringify and parse give the same object', () => {
    const { result } = analyseFlight(radialFlight())
    expect(JSON.parse(JSON.stringify(result))).toEqual(result)
    expect(result.methodVersion).toBe(METHOD_VERSION)
  })
  it('returns per-sample arrays of the flight length', () => {
    const input = radialFlight({ count: 500 })
    const { series } = analyseFlight(input)
    for (const a of [series.distanceM, series.clearanceFraction, series.marginDb, series.inDropout]) expect(a.length).toBe(500)
    expect(series.distanceM[0]).toBeCloseTo(20, 3)
    expect(series.marginDb[10]).toBeCloseTo(input.samples.rssiDbm[10]! + 105, 4)
  })
  it('reports distances, EIRP and the free-space range of the setup', () => {
    const { result } = analyseFlight(radialFlight({ maxM: 2500 }), { fadeMarginDb: 10 })
    expect(result.distances.maxDistanceM).toBeCloseTo(2500, -1)
    expect(result.summary.eirpDbm).toBe(22)
    // Friis: 20 + 2 + 2 − 1 − FSPL(d) = −105 + 10
    const lossAtRange = freeSpaceLossDb(result.summary.freeSpaceRangeM, 2.4e9)
    expect(20 + 2 + 2 - 1 - lossAtRange).toBeCloseTo(-95, 6)
    expect(result.summary.distanceFlownM).toBeCloseTo(2 * (2500 - 20), -1)
  })
  it('predicts the range where the fitted model meets sensitivity + fade margin', () => {
    const { result } = analyseFlight(radialFlight({ n: 2.5 }), { fadeMarginDb: 10 })
    const f = result.fit!
    const atRange = f.interceptDbm - 10 * f.exponent * Math.log10(result.summary.predictedRangeM! / f.referenceDistanceM)
    expect(atRange).toBeCloseTo(-95, 6)
  })
  it('classifies a dropout behind a wall as an obstruction naming the wall', () => {
    const input = radialFlight({ sigmaDb: 0.5, heightM: 15 })
    const wallNorthM = 1000
    input.obstacles = [
      {
        kind: 'line',
        label: 'hangar wall',
        heightM: 25,
        path: [
          { latDeg: station.latDeg + wallNorthM / proj.north0, lonDeg: station.lonDeg - 50 / proj.east0 },
          { latDeg: station.latDeg + wallNorthM / proj.north0, lonDeg: station.lonDeg + 50 / proj.east0 },
        ],
      },
    ]
    // the receiver loses the link while the aircraft is beyond the wall, 1.6–1.8 km out
    const { timeMs, rssiDbm } = input.samples
    for (let i = 0; i < timeMs.length; i++) {
      const r = 20 + 2980 * (i / 3999 < 0.5 ? (2 * i) / 3999 : 2 - (2 * i) / 3999)
      if (r > 1600 && r < 1800) rssiDbm[i] = -130
    }
    const { result } = analyseFlight(input)
    expect(result.dropouts.length).toBeGreaterThan(0)
    for (const d of result.dropouts) {
      expect(d.cause).toBe('obstruction')
      expect(d.evidence.limitingObstacle).toBe('hangar wall')
    }
    expect(result.clearance.belowRuleByObstacle['hangar wall']).toBeGreaterThan(0)
  })
  it('classifies a dropout outside a directional antenna beam as a beam dropout', () => {
    const input = radialFlight({ bearingDeg: 90, sigmaDb: 0.5 })
    input.setup.rxAntennas = [{ gainDbi: 12, kind: 'directional', azimuthDeg: 0, beamwidthDeg: 30 }]
    input.samples.rssiDbm.fill(-130, 1000, 1020)
    const { result } = analyseFlight(input)
    expect(result.dropouts).toHaveLength(1)
    expect(result.dropouts[0]!.cause).toBe('beam')
    expect(result.dropouts[0]!.evidence.maxPointingLossDb).toBeCloseTo(20, 6)
  })
  it('classifies losing the link at the far end of a long leg as range', () => {
    const input = radialFlight({ n: 3, maxM: 8000, sigmaDb: 1 })
    const { rssiDbm } = input.samples
    for (let i = 0; i < rssiDbm.length; i++) if (rssiDbm[i]! < -105) rssiDbm[i] = -130
    const { result } = analyseFlight(input, { fadeMarginDb: 10 })
    expect(result.dropouts.length).toBeGreaterThan(0)
    expect(result.summary.dropoutsByCause.range).toBe(result.dropouts.length)
    expect(result.summary.maxDistanceWithLinkM!).toBeLessThan(8000)
  })
  it('reports a telemetry gap as a gap dropout', () => {
    const input = radialFlight({ sigmaDb: 0.5, maxM: 1000 })
    for (let i = 2000; i < 4000; i++) input.samples.timeMs[i]! += 5000
    const { result } = analyseFlight(input)
    expect(result.dropouts).toHaveLength(1)
    expect(result.dropouts[0]).toMatchObject({ cause: 'gap', fromGap: true, startIndex: 1999, endIndex: 2000 })
    expect(result.summary.timeWithLinkMs).toBeLessThan(result.summary.durationMs - 5000)
  })
  it('combines two diversity antennas by taking the stronger', () => {
    const input = radialFlight({ count: 100 })
    input.samples.rssi2Dbm = input.samples.rssiDbm.map((p, i) => (i % 2 === 0 ? p + 6 : NaN))
    input.setup.rxAntennas = [{ gainDbi: 2, kind: 'omni' }, { gainDbi: 2, kind: 'omni' }]
    const { series } = analyseFlight(input)
    // the combined series is stored as float32: 1e-5 dB is far below any receiver's resolution
    expect(series.rxBestDbm[10]).toBeCloseTo(input.samples.rssiDbm[10]! + 6, 4)
    expect(series.rxBestDbm[11]).toBeCloseTo(input.samples.rssiDbm[11]!, 4)
  })
  it('reports what each diversity antenna alone would have lost', () => {
    const input = radialFlight({ count: 400, sigmaDb: 0.5, maxM: 1000 })
    input.samples.rssi2Dbm = input.samples.rssiDbm.slice()
    input.samples.rssi2Dbm.fill(-130, 100, 120)
    input.setup.rxAntennas = [{ gainDbi: 2, kind: 'omni' }, { gainDbi: 2, kind: 'omni' }]
    const { result } = analyseFlight(input)
    expect(result.dropouts).toHaveLength(0)
    expect(result.antennas.map((a) => a.dropoutCount)).toEqual([0, 1])
    expect(result.antennas[1]!.timeInDropoutMs).toBe(2000)
  })
  it('turns AMSL altitudes into heights above the station ground', () => {
    const input = radialFlight({ count: 50, heightM: 460 })
    input.altitudeReference = 'AMSL'
    expect(analyseFlight(input).result.distances.maxHeightM).toBeCloseTo(60, 9)
  })
  it('treats a 0,0 fix as missing', () => {
    const input = radialFlight({ count: 50 })
    input.samples.latDeg[0] = 0
    input.samples.lonDeg[0] = 0
    const { result, series } = analyseFlight(input)
    expect(Number.isNaN(series.distanceM[0])).toBe(true)
    expect(result.validFixCount).toBe(49)
  })
  it('applies and reports a caller-changed fit selection rule', () => {
    const { result } = analyseFlight(radialFlight(), { fitSelection: { minDistanceM: 500 } })
    expect(result.fitSelection.rule.minDistanceM).toBe(500)
    expect(result.fit!.minDistanceM).toBeGreaterThanOrEqual(500)
    expect(result.fitSelection.excluded.tooClose).toBeGreaterThan(0)
  })
  it('falls back to free space and says why when too few samples remain', () => {
    const { result } = analyseFlight(radialFlight({ count: 50, maxM: 100 }), { fitSelection: { minDistanceM: 5000 } })
    expect(result.fit).toBeNull()
    expect(result.fitError).toMatch(/at least 3/)
    expect(result.model).toMatchObject({ source: 'free-space', exponent: 2 })
  })
  it('lets a terrain ridge limit the clearance', () => {
    const input = radialFlight({ heightM: 20, count: 400 })
    input.terrain = { elevationAmslM: (lat) => (Math.abs((lat - station.latDeg) * proj.north0 - 700) < 60 ? 430 : 400) }
    const { result } = analyseFlight(input)
    expect(result.clearance.belowRuleByObstacle.terrain).toBeGreaterThan(0)
  })
  it('rejects arrays of different lengths naming the field', () => {
    const input = radialFlight({ count: 20 })
    input.samples.altM = new Float64Array(19)
    expect(() => analyseFlight(input)).toThrow(/samples\.altM/)
  })
  it('rejects a directional antenna without an azimuth', () => {
    const input = radialFlight({ count: 20 })
    input.setup.rxAntennas = [{ gainDbi: 10, kind: 'directional' }]
    expect(() => analyseFlight(input)).toThrow(/azimuthDeg/)
  })
  it('rejects a negative fade margin', () => expect(() => analyseFlight(radialFlight({ count: 20 }), { fadeMarginDb: -1 })).toThrow(/fadeMarginDb/))
})

// The demo course: a tree line about 600 m out on a route east-north-east, a gap cut out of the log at 37 %.
const demoCourse: GeneratorCourse = {
  stationLatDeg: 52.8712,
  stationLonDeg: -0.0563,
  antennaHeightM: 2,
  routeLonLat: [[-0.0549, 52.8717], [-0.0408, 52.8766], [-0.0254, 52.882]],
  obstacles: [
    { kind: 'line', label: 'Tree line', heightM: 14, path: [{ latDeg: 52.87507, lonDeg: -0.04972 }, { latDeg: 52.87273, lonDeg: -0.04748 }] },
  ],
}
const demoOmni = { kind: 'omni' as const, gainDbi: 2.15, beamwidthDeg: null, azimuthDeg: null, elevationDeg: null }
const demoPatch = { kind: 'directional' as const, gainDbi: 8, beamwidthDeg: null, azimuthDeg: 60, elevationDeg: 5 }

function generatedInput(rx: GeneratorSetup['rxAntennas'], txPowerDbm: number, truthN = 2.6, gaps = [{ atFraction: 0.37, durationMs: 2400 }]): FlightInput {
  const setup: GeneratorSetup = { freqMHz: 868, txPowerDbm, txGainDbi: 2.15, rxAntennas: rx, cableLossDb: 1, sensitivityDbm: -112, floorDbm: -130 }
  const f = generateFlight(demoCourse, setup, {
    seed: 105,
    profile: { speedMps: 15, cruiseAltM: 60, sampleHz: 10 },
    truth: { exponent: truthN, shadowSigmaDb: 4, shadowFieldSeed: 20261202, flightShadowSigmaDb: 1.5, tailShadowDb: 5 },
    gaps,
  })
  return {
    samples: { timeMs: f.timeMs, latDeg: f.latDeg, lonDeg: f.lonDeg, altM: f.altM, rssiDbm: f.rssiDbm[0]!, ...(f.rssiDbm[1] ? { rssi2Dbm: f.rssiDbm[1] } : {}), lqPct: f.lqPct },
    station: { latDeg: demoCourse.stationLatDeg, lonDeg: demoCourse.stationLonDeg, antennaHeightM: 2, groundElevM: 2 },
    altitudeReference: 'AGL',
    setup: {
      freqMHz: 868, txPowerDbm, txGainDbi: 2.15, cableLossDb: 1, sensitivityDbm: -112, floorDbm: -130,
      rxAntennas: rx.map((a) => ({ kind: a.kind, gainDbi: a.gainDbi, ...(a.azimuthDeg !== null ? { azimuthDeg: a.azimuthDeg, elevationDeg: a.elevationDeg ?? 0 } : {}) })),
    },
    obstacles: [...demoCourse.obstacles],
  }
}

describe('analyseFlight on generated demo flights', () => {
  // 25 mW diversity as in the demo; the single omni at 250 mW so that no fade merges into the gap
  for (const [name, rx, txDbm] of [['diversity', [demoOmni, demoPatch], 13.98], ['single-antenna', [demoOmni], 23.98]] as const) {
    it(`reports the 2.4 s telemetry gap of a ${name} flight as a gap dropout with its evidence`, () => {
      const input = generatedInput([...rx], txDbm)
      const t = input.samples.timeMs
      let at = 1
      for (let i = 1; i < t.length; i++) if (t[i]! - t[i - 1]! > t[at]! - t[at - 1]!) at = i
      expect(t[at]! - t[at - 1]!).toBe(2500)
      const { result } = analyseFlight(input)
      const gap = result.dropouts.find((d) => d.fromGap)
      expect(gap).toBeDefined()
      expect(gap!.startMs).toBeLessThanOrEqual(t[at - 1]!)
      expect(gap!.endMs).toBeGreaterThanOrEqual(t[at]!)
      expect(gap).toMatchObject({ cause: 'gap', fromSignal: false, fromLinkQuality: false })
      // the geometry at the gap stays on record: about 1.8 km out, 60 m up, the tree line near the first zone
      expect(gap!.evidence.distanceM).toBeGreaterThan(1000)
      expect(gap!.evidence.heightM).toBeGreaterThan(50)
      expect(gap!.evidence.minClearanceFraction).not.toBeNull()
      expect(result.summary.dropoutsByCause.gap).toBeGreaterThanOrEqual(1)
    })
  }
})

describe('analyseFlight fit distance', () => {
  // a steep climb to 100 m over a 700 m course keeps the aircraft high relative to its distance for much of the flight;
  // ground shadowing and the ground reflection are off so the geometry alone decides the fitted exponent
  const course: GeneratorCourse = {
    stationLatDeg: 52.8712,
    stationLonDeg: -0.0563,
    antennaHeightM: 2,
    routeLonLat: [[-0.0563, 52.8712], [-0.04703, 52.87444]],
    obstacles: [],
  }
  const setup: GeneratorSetup = { freqMHz: 868, txPowerDbm: 23.98, txGainDbi: 2.15, rxAntennas: [demoOmni], cableLossDb: 1, sensitivityDbm: -112, floorDbm: -130 }
  for (const truthN of [2.2, 2.6, 3.2]) {
    it(`fits a generated flight with n = ${truthN} within 0.05 of the truth, using the slant range`, () => {
      const f = generateFlight(course, setup, {
        seed: 3,
        profile: { speedMps: 15, cruiseAltM: 100, climbMps: 50, sampleHz: 10 },
        truth: { exponent: truthN, shadowSigmaDb: 0, flightShadowSigmaDb: 0.5, reflectionMagnitude: 0 },
      })
      const input: FlightInput = {
        samples: { timeMs: f.timeMs, latDeg: f.latDeg, lonDeg: f.lonDeg, altM: f.altM, rssiDbm: f.rssiDbm[0]!, lqPct: f.lqPct },
        station: { latDeg: course.stationLatDeg, lonDeg: course.stationLonDeg, antennaHeightM: 2, groundElevM: 2 },
        altitudeReference: 'AGL',
        setup: { ...setup, rxAntennas: [{ kind: 'omni', gainDbi: 2.15 }] },
      }
      const { result, series } = analyseFlight(input)
      expect(Math.abs(result.fit!.exponent - truthN)).toBeLessThan(0.05)
      // the same samples fitted on ground distance land far off: the reason the fit uses the slant range
      const selected = selectFitSamples(series.distanceM, series.rxBestDbm, result.fitSelection.rule, {
        inDropout: series.inDropout,
        clearanceFraction: series.clearanceFraction,
      })
      const onGround = fitLogDistance(series.distanceM, Float64Array.from(series.rxBestDbm), { include: selected.include })
      expect(onGround.sampleCount).toBe(result.fit!.sampleCount)
      expect(Math.abs(onGround.exponent - truthN)).toBeGreaterThan(0.3)
    })
  }
})
