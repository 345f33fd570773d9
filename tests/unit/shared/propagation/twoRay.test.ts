import { describe, expect, it } from 'vitest'
import { wavelengthM } from '../../../../shared/rf/wavelength.js'
import {
  nearestTwoRayNullM,
  twoRayBreakpointM,
  twoRayDistanceForPathDifferenceM,
  twoRayNullCount,
  twoRayNullDistanceApproxM,
  twoRayNullDistanceM,
  twoRayPathDifferenceM,
} from '../../../../shared/propagation/twoRay.js'

const f = 2.4e9
const lambda = wavelengthM(f)

describe('twoRayPathDifferenceM', () => {
  it('equals the direct difference of the two ray lengths', () => {
    const d = 750
    expect(twoRayPathDifferenceM(d, 2, 50)).toBeCloseTo(Math.hypot(52, d) - Math.hypot(48, d), 12)
  })
  it('tends to 2·h1·h2/d far out', () => expect(twoRayPathDifferenceM(1e6, 2, 50) * 1e6).toBeCloseTo(200, 3))
  it('rejects a zero height', () => expect(() => twoRayPathDifferenceM(10, 0, 5)).toThrow(/groundHeightM/))
})

describe('twoRayNullDistanceM', () => {
  it('puts a whole number of wavelengths between the rays', () => {
    for (const k of [1, 2, 5]) {
      const d = twoRayNullDistanceM(k, f, 2, 50)
      expect(twoRayPathDifferenceM(d, 2, 50) / lambda).toBeCloseTo(k, 9)
    }
  })
  it('approaches the far-field approximation for the outer nulls', () =>
    expect(twoRayNullDistanceM(1, f, 2, 50) / twoRayNullDistanceApproxM(1, f, 2, 50)).toBeCloseTo(1, 3))
  it('rejects a null that does not exist', () => expect(() => twoRayNullDistanceM(1000, f, 2, 50)).toThrow(/pathDifferenceM/))
  it('rejects a fractional index', () => expect(() => twoRayNullDistanceM(1.5, f, 2, 50)).toThrow(/nullIndex/))
})

describe('twoRayDistanceForPathDifferenceM', () => {
  it('inverts twoRayPathDifferenceM', () =>
    expect(twoRayDistanceForPathDifferenceM(twoRayPathDifferenceM(321, 3, 40), 3, 40)).toBeCloseTo(321, 7))
})

describe('twoRayNullCount', () => {
  it('counts the nulls whose distances fall inside the range', () => {
    let count = 0
    for (let k = 1; k * lambda < 4; k++) if (twoRayNullDistanceM(k, f, 2, 50) <= 1500) count++
    expect(twoRayNullCount(f, 2, 50, 1500)).toBe(count)
  })
})

describe('twoRayBreakpointM', () => {
  it('is twice the first null distance in the far-field approximation', () =>
    expect(twoRayBreakpointM(f, 2, 50)).toBeCloseTo(2 * twoRayNullDistanceApproxM(1, f, 2, 50), 9))
})

describe('nearestTwoRayNullM', () => {
  it('returns the null itself when asked at a null', () => {
    const d = twoRayNullDistanceM(3, f, 2, 50)
    expect(nearestTwoRayNullM(d, lambda, 2, 50)).toBeCloseTo(d, 6)
  })
  it('returns the outermost null beyond it', () =>
    expect(nearestTwoRayNullM(50_000, lambda, 2, 50)).toBeCloseTo(twoRayNullDistanceM(1, f, 2, 50), 6))
  it('returns null when the antennas are too low for any null', () => expect(nearestTwoRayNullM(100, lambda, 0.01, 50)).toBeNull())
})
