import { describe, expect, it } from 'vitest'
import { feetToMetres, kmToMiles, metresToFeet, milesToKm } from '../../../../shared/units/length.js'

describe('metresToFeet and feetToMetres', () => {
  // international foot = 0.3048 m exactly (1959 agreement)
  it('gives 100 ft for 30.48 m', () => expect(metresToFeet(30.48)).toBeCloseTo(100, 12))
  it('round-trip', () => expect(feetToMetres(metresToFeet(123.4))).toBeCloseTo(123.4, 12))
  it('rejects NaN naming the argument', () => expect(() => metresToFeet(NaN)).toThrow(/lengthM/))
})

describe('kmToMiles and milesToKm', () => {
  // statute mile = 1609.344 m exactly
  it('gives 1 mi for 1.609344 km', () => expect(kmToMiles(1.609344)).toBeCloseTo(1, 12))
  it('round-trip', () => expect(milesToKm(kmToMiles(42.195))).toBeCloseTo(42.195, 12))
  it('rejects Infinity', () => expect(() => milesToKm(Infinity)).toThrow(/lengthMi/))
})
