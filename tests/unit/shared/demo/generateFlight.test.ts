import { describe, expect, it } from 'vitest'
import { generateFlight, type GeneratorCourse, type GeneratorSetup } from '../../../../shared/demo/generateFlight.js'
import { groundDistanceM } from '../../../../shared/geo/localOffset.js'

const course: GeneratorCourse = {
  stationLatDeg: 52.61,
  stationLonDeg: -0.72,
  antennaHeightM: 2,
  routeLonLat: null,
  obstacles: [],
}
const omni = { kind: 'omni' as const, gainDbi: 2, beamwidthDeg: null, azimuthDeg: null, elevationDeg: null }
const setup: GeneratorSetup = {
  freqMHz: 2440,
  txPowerDbm: 14,
  txGainDbi: 2,
  rxAntennas: [omni],
  cableLossDb: 1,
  sensitivityDbm: -105,
  floorDbm: -130,
}
const spec = { seed: 7, profile: { speedMps: 15, cruiseAltM: 60 }, truth: { exponent: 2.4, shadowSigmaDb: 4 } }

describe('generateFlight', () => {
  it('gives the same rows for the same seed', () => {
    const a = generateFlight(course, setup, spec)
    const b = generateFlight(course, setup, spec)
    expect(Array.from(a.rssiDbm[0]!)).toEqual(Array.from(b.rssiDbm[0]!))
    expect(Array.from(a.latDeg)).toEqual(Array.from(b.latDeg))
  })

  it('shifts every heard sample by exactly the power change when only the power changes', () => {
    const low = generateFlight(course, setup, spec)
    const high = generateFlight(course, { ...setup, txPowerDbm: 24 }, spec)
    let compared = 0
    for (let i = 0; i < low.timeMs.length; i++) {
      if (low.rssiDbm[0]![i] === -130) continue
      // both draws are identical; rounding to whole dBm keeps the difference at exactly 10
      expect(high.rssiDbm[0]![i]! - low.rssiDbm[0]![i]!).toBe(10)
      compared++
    }
    expect(compared).toBeGreaterThan(1000)
  })

  it('flies out to the end of the route and back to the station', () => {
    const f = generateFlight(course, setup, spec)
    const last = f.timeMs.length - 1
    const dist = Array.from(f.latDeg, (lat, i) => groundDistanceM(52.61, -0.72, lat, f.lonDeg[i]!))
    expect(Math.max(...dist)).toBeGreaterThan(1950)
    expect(Math.max(...dist)).toBeLessThan(2050)
    expect(dist[last]!).toBeLessThan(5)
  })

  it('writes the floor value and zero link quality below sensitivity', () => {
    const f = generateFlight(course, { ...setup, txPowerDbm: -6 }, spec)
    const floorIdx = Array.from(f.rssiDbm[0]!).findIndex((v) => v === -130)
    expect(floorIdx).toBeGreaterThan(0)
    expect(f.lqPct[floorIdx]).toBe(0)
  })

  it('adds knife-edge loss behind a tree line on a low pass, enough to drop the link', () => {
    const treeLine = {
      kind: 'line' as const,
      label: 'tree line',
      heightM: 16,
      path: [
        { latDeg: 52.6157, lonDeg: -0.7200 },
        { latDeg: 52.6145, lonDeg: -0.7120 },
      ],
    }
    const low = { ...spec, profile: { speedMps: 12, cruiseAltM: 8, altWanderM: 1 } }
    const f = generateFlight({ ...course, obstacles: [treeLine] }, setup, low)
    expect(Math.max(...f.obstructionLossDb)).toBeGreaterThan(10)
    const free = generateFlight(course, setup, low)
    const floorWith = Array.from(f.rssiDbm[0]!).filter((v) => v === -130).length
    const floorWithout = Array.from(free.rssiDbm[0]!).filter((v) => v === -130).length
    expect(floorWith).toBeGreaterThan(floorWithout)
  })

  it('writes a second signal column for a diversity setup and cuts telemetry gaps', () => {
    const dir = { kind: 'directional' as const, gainDbi: 9, beamwidthDeg: null, azimuthDeg: 45, elevationDeg: 5 }
    const f = generateFlight(course, { ...setup, rxAntennas: [omni, dir] }, {
      ...spec,
      gaps: [{ atFraction: 0.3, durationMs: 2500 }],
    })
    expect(f.rssiDbm).toHaveLength(2)
    let maxStep = 0
    for (let i = 1; i < f.timeMs.length; i++) maxStep = Math.max(maxStep, f.timeMs[i]! - f.timeMs[i - 1]!)
    expect(maxStep).toBeGreaterThanOrEqual(2500)
  })
})
