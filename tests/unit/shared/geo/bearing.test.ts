import { describe, expect, it } from 'vitest'
import geodesic from 'geographiclib-geodesic'
import { initialBearingDeg } from '../../../../shared/geo/bearing.js'

describe('initialBearingDeg', () => {
  it('matches geographiclib-geodesic azi1 (reference library)', () => {
    const ref = geodesic.Geodesic.WGS84.Inverse(-33.9, 151, -34.2, 151.4).azi1!
    expect(initialBearingDeg(-33.9, 151, -34.2, 151.4)).toBeCloseTo((ref + 360) % 360, 6)
  })
  it('is 180° due south', () => expect(initialBearingDeg(10, 10, 9, 10)).toBeCloseTo(180, 9))
})
