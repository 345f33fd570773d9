import { describe, expect, it } from 'vitest'
import {
  elevationAngleCurvedDeg,
  elevationAngleDeg,
  heightAboveStationGroundM,
  slantRangeM,
} from '../../../../shared/geo/slant.js'

describe('slantRangeM', () => {
  it('is the hypotenuse (3-4-5 triangle)', () => expect(slantRangeM(400, 300)).toBeCloseTo(500, 12))
  it('accepts an aircraft below the antenna', () => expect(slantRangeM(0, -5)).toBe(5))
  it('rejects a negative distance', () => expect(() => slantRangeM(-1, 0)).toThrow(/horizontalDistanceM/))
})

describe('elevationAngleDeg', () => {
  it('is 45° for equal height and distance', () => expect(elevationAngleDeg(100, 100)).toBeCloseTo(45, 12))
  it('is 90° straight overhead', () => expect(elevationAngleDeg(0, 10)).toBe(90))
  it('is negative below the antenna', () => expect(elevationAngleDeg(1000, -5)).toBeLessThan(0))
})

describe('elevationAngleCurvedDeg', () => {
  it('is below the flat-earth angle because the earth curves away', () =>
    expect(elevationAngleCurvedDeg(20_000, 3, 103)).toBeLessThan(elevationAngleDeg(20_000, 100)))
  it('approaches the flat angle for a short path', () =>
    expect(elevationAngleCurvedDeg(100, 2, 12)).toBeCloseTo(elevationAngleDeg(100, 10), 3))
  it('rejects a zero k-factor', () => expect(() => elevationAngleCurvedDeg(1, 0, 1, 0)).toThrow(/kFactor/))
})

describe('heightAboveStationGroundM', () => {
  it('keeps AGL altitudes and subtracts the ground elevation from AMSL ones', () => {
    expect(heightAboveStationGroundM(120, 'AGL', 400)).toBe(120)
    expect(heightAboveStationGroundM(520, 'AMSL', 400)).toBe(120)
  })
  it('rejects an unknown reference', () =>
    expect(() => heightAboveStationGroundM(1, 'QNH' as unknown as 'AGL', 0)).toThrow(TypeError))
})
