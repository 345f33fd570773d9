import { describe, expect, it } from 'vitest'
import { mhzToHz, SPEED_OF_LIGHT_M_S, wavelengthM } from '../../../../shared/rf/wavelength.js'

describe('wavelengthM', () => {
  it('is about 0.125 m at 2.4 GHz (λ = c/f)', () => expect(wavelengthM(2.4e9)).toBeCloseTo(0.1249, 4))
  it('is exactly 1 m at c hertz', () => expect(wavelengthM(SPEED_OF_LIGHT_M_S)).toBe(1))
  it('rejects a zero frequency', () => expect(() => wavelengthM(0)).toThrow(/freqHz/))
})

describe('mhzToHz', () => {
  it('multiplies by a million', () => expect(mhzToHz(915)).toBe(915e6))
  it('rejects a negative frequency', () => expect(() => mhzToHz(-1)).toThrow(/freqMHz/))
})
