import { describe, expect, it } from 'vitest'
import { wavelengthM } from '../../../../shared/rf/wavelength.js'
import { fresnelZoneRadiusM, REQUIRED_CLEARANCE_FRACTION, requiredClearanceM } from '../../../../shared/fresnel/zone.js'

describe('fresnelZoneRadiusM', () => {
  it('is ½√(λD) at mid-path (ITU-R P.526 eq. 2)', () =>
    expect(fresnelZoneRadiusM(2.4e9, 1000, 1000)).toBeCloseTo(0.5 * Math.sqrt(wavelengthM(2.4e9) * 2000), 12))
  it('grows as √n with the zone number', () =>
    expect(fresnelZoneRadiusM(915e6, 300, 700, 4) / fresnelZoneRadiusM(915e6, 300, 700, 1)).toBeCloseTo(2, 12))
  it('is symmetric in d1 and d2 and zero at an end', () => {
    expect(fresnelZoneRadiusM(5.8e9, 200, 800)).toBeCloseTo(fresnelZoneRadiusM(5.8e9, 800, 200), 12)
    expect(fresnelZoneRadiusM(5.8e9, 0, 800)).toBe(0)
  })
  it('rejects zone 0', () => expect(() => fresnelZoneRadiusM(1e9, 1, 1, 0)).toThrow(/zone/))
  it('rejects a zero-length path', () => expect(() => fresnelZoneRadiusM(1e9, 0, 0)).toThrow(/d1M \+ d2M/))
})

describe('requiredClearanceM', () => {
  it('is 60 % of F1 by default (common practice)', () => {
    expect(REQUIRED_CLEARANCE_FRACTION).toBe(0.6)
    expect(requiredClearanceM(2.4e9, 500, 500)).toBeCloseTo(0.6 * fresnelZoneRadiusM(2.4e9, 500, 500), 12)
  })
  it('rejects a zero fraction', () => expect(() => requiredClearanceM(2.4e9, 1, 1, 0)).toThrow(/fraction/))
})
