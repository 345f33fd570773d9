import { describe, expect, it } from 'vitest'
import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../../../../shared/units/guards.js'

describe('requireFinite', () => {
  it('returns a finite value unchanged', () => expect(requireFinite('x', -3.5)).toBe(-3.5))
  it('rejects NaN naming the argument', () => expect(() => requireFinite('heightM', NaN)).toThrow(/heightM/))
  it('rejects Infinity as a RangeError', () => expect(() => requireFinite('x', Infinity)).toThrow(RangeError))
  it('rejects a string as a TypeError', () => expect(() => requireFinite('x', '3' as unknown as number)).toThrow(TypeError))
})

describe('requirePositive', () => {
  it('accepts a small positive number', () => expect(requirePositive('freqHz', 1e-300)).toBe(1e-300))
  it('rejects zero naming the argument', () => expect(() => requirePositive('freqHz', 0)).toThrow(/freqHz/))
})

describe('requireNonNegative', () => {
  it('accepts zero', () => expect(requireNonNegative('lossDb', 0)).toBe(0))
  it('rejects a negative value', () => expect(() => requireNonNegative('lossDb', -0.1)).toThrow(/lossDb/))
})

describe('requireInRange', () => {
  it('accepts both bounds', () => {
    expect(requireInRange('latDeg', -90, -90, 90)).toBe(-90)
    expect(requireInRange('latDeg', 90, -90, 90)).toBe(90)
  })
  it('rejects a value outside the interval', () => expect(() => requireInRange('latDeg', 91, -90, 90)).toThrow(/latDeg/))
})
