import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { geodesicInverse, normaliseBearingDeg } from '../../../../shared/geo/geodesic.js'

const wgs84 = geodesic.Geodesic.WGS84

/** Seeded pairs from 10 m to 200 km in every direction and latitude band (Park–Miller generator). */
function pairs(count: number): Array<[number, number, number, number]> {
  let seed = 20251202
  const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647
  const out: Array<[number, number, number, number]> = []
  for (let i = 0; i < count; i++) {
    const lat1 = -80 + 160 * rnd()
    const lon1 = -180 + 360 * rnd()
    const r = wgs84.Direct(lat1, lon1, 360 * rnd(), 10 + 200_000 * rnd())
    out.push([lat1, lon1, r.lat2!, ((r.lon2! + 540) % 360) - 180])
  }
  return out
}

describe('geodesicInverse', () => {
  it('matches geographiclib-geodesic to 1 mm and 1e-6° on 500 seeded pairs (reference library)', () => {
    for (const [a, b, c, d] of pairs(500)) {
      const ours = geodesicInverse(a, b, c, d)
      const ref = wgs84.Inverse(a, b, c, d)
      expect(Math.abs(ours.distanceM - ref.s12!)).toBeLessThan(1e-3)
      const dAz = ((ours.initialBearingDeg - ref.azi1! + 540) % 360) - 180
      expect(Math.abs(dAz)).toBeLessThan(1e-6)
      const dAz2 = ((ours.finalBearingDeg - ref.azi2! + 540) % 360) - 180
      expect(Math.abs(dAz2)).toBeLessThan(1e-6)
    }
  })
  it('returns zero for coincident points', () => expect(geodesicInverse(47, 8, 47, 8).distanceM).toBe(0))
  it('gives a quarter meridian of 10 001 965.729 m pole to equator (WGS-84, geographiclib)', () => {
    expect(geodesicInverse(0, 0, 90, 0).distanceM).toBeCloseTo(wgs84.Inverse(0, 0, 90, 0).s12!, 3)
  })
  it('rejects a latitude above 90° naming lat1Deg', () => expect(() => geodesicInverse(91, 0, 0, 0)).toThrow(/lat1Deg/))
  it('rejects nearly antipodal points it cannot converge on', () =>
    expect(() => geodesicInverse(0, 0, 0.5, 179.7)).toThrow(/antipodal/))
})

describe('normaliseBearingDeg', () => {
  it('wraps negative and large angles into [0, 360)', () => {
    expect(normaliseBearingDeg(-90)).toBe(270)
    expect(normaliseBearingDeg(725)).toBe(5)
    expect(normaliseBearingDeg(-1e-15)).toBeLessThan(360)
  })
  it('rejects NaN', () => expect(() => normaliseBearingDeg(NaN)).toThrow(/angleDeg/))
})
