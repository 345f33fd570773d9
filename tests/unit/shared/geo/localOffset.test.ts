import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import {
  fillLocalOffsets,
  GROUND_DISTANCE_MAX_REL_ERROR,
  groundDistanceM,
  localOffsetM,
} from '../../../../shared/geo/localOffset.js'

const wgs84 = geodesic.Geodesic.WGS84

describe('groundDistanceM', () => {
  it('stays within its documented tolerance of geographiclib-geodesic up to 50 km below ±70° (reference library)', () => {
    let seed = 7
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647
    let worst = 0
    for (let i = 0; i < 3000; i++) {
      const lat1 = -70 + 140 * rnd()
      const lon1 = -179 + 358 * rnd()
      const s12 = 1 + 50_000 * rnd()
      const r = wgs84.Direct(lat1, lon1, 360 * rnd(), s12)
      const lon2 = ((r.lon2! + 540) % 360) - 180
      worst = Math.max(worst, Math.abs(groundDistanceM(lat1, lon1, r.lat2!, lon2) / s12 - 1))
    }
    expect(worst).toBeLessThanOrEqual(GROUND_DISTANCE_MAX_REL_ERROR)
  })
  it('takes the short way across the antimeridian', () => {
    const ref = wgs84.Inverse(-16.8, 179.95, -16.75, -179.9).s12!
    expect(groundDistanceM(-16.8, 179.95, -16.75, -179.9) / ref).toBeCloseTo(1, 4)
  })
  it('rejects a longitude out of range naming lon2Deg', () => expect(() => groundDistanceM(0, 0, 0, 181)).toThrow(/lon2Deg/))
})

describe('localOffsetM', () => {
  it('points east for a fix due east and north for a fix due north', () => {
    const east = localOffsetM(47, 8, 47, 8.01)
    const north = localOffsetM(47, 8, 47.01, 8)
    expect(east.eastM).toBeGreaterThan(0)
    expect(Math.abs(east.northM)).toBeLessThan(1e-9)
    expect(north.northM).toBeGreaterThan(0)
    expect(north.eastM).toBe(0)
  })
})

describe('fillLocalOffsets', () => {
  it('fills the same offsets as localOffsetM, and NaN for a missing fix', () => {
    const lat = Float64Array.of(47.1, NaN, 46.9)
    const lon = Float64Array.of(8.2, 8.2, 7.95)
    const e = new Float64Array(3)
    const n = new Float64Array(3)
    const d = new Float64Array(3)
    fillLocalOffsets(47, 8, lat, lon, e, n, d)
    const ref = localOffsetM(47, 8, 46.9, 7.95)
    expect(e[2]).toBeCloseTo(ref.eastM, 9)
    expect(n[2]).toBeCloseTo(ref.northM, 9)
    expect(d[2]).toBeCloseTo(Math.hypot(ref.eastM, ref.northM), 9)
    expect(Number.isNaN(d[1])).toBe(true)
  })
  it('rejects arrays of different lengths', () => {
    const a = new Float64Array(2)
    expect(() => fillLocalOffsets(0, 0, a, new Float64Array(3), a, a, a)).toThrow(/lengths/)
  })
})
