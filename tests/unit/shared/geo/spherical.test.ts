import { describe, expect, it } from 'vitest'
import { haversineDistanceM, sphericalInitialBearingDeg } from '../../../../shared/geo/spherical.js'
import { MEAN_EARTH_RADIUS_M } from '../../../../shared/geo/wgs84.js'

describe('haversineDistanceM', () => {
  it('gives a quarter great circle, πR/2, from equator to pole', () =>
    expect(haversineDistanceM(0, 0, 90, 0)).toBeCloseTo((Math.PI * MEAN_EARTH_RADIUS_M) / 2, 6))
  it('is symmetric', () =>
    expect(haversineDistanceM(10, 20, -5, 33)).toBeCloseTo(haversineDistanceM(-5, 33, 10, 20), 9))
  it('uses the radius it is given', () =>
    expect(haversineDistanceM(0, 0, 0, 1, 1)).toBeCloseTo(Math.PI / 180, 12))
  it('rejects a zero radius', () => expect(() => haversineDistanceM(0, 0, 0, 1, 0)).toThrow(/radiusM/))
})

describe('sphericalInitialBearingDeg', () => {
  it('is 90° due east along the equator and 0° due north', () => {
    expect(sphericalInitialBearingDeg(0, 0, 0, 1)).toBeCloseTo(90, 12)
    expect(sphericalInitialBearingDeg(10, 5, 11, 5)).toBe(0)
  })
  it('is 270° due west', () => expect(sphericalInitialBearingDeg(0, 1, 0, 0)).toBeCloseTo(270, 12))
  it('rejects NaN latitude', () => expect(() => sphericalInitialBearingDeg(NaN, 0, 0, 0)).toThrow(/lat1Deg/))
})
