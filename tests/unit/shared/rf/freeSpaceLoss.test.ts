import { describe, expect, it } from 'vitest'
import {
  freeSpaceDistanceForLossM,
  freeSpaceDistanceForLossPracticalM,
  freeSpaceLossDb,
  freeSpaceLossPracticalDb,
  FSPL_EXACT_CONSTANT_DB,
} from '../../../../shared/rf/freeSpaceLoss.js'

describe('freeSpaceLossDb', () => {
  // ITU-R P.525: 32.4478 + 20 log f_MHz + 20 log d_km
  it('equals the exact-constant practical form', () =>
    expect(freeSpaceLossDb(5000, 915e6)).toBeCloseTo(FSPL_EXACT_CONSTANT_DB + 20 * Math.log10(915) + 20 * Math.log10(5), 10))
  it('grows 6.02 dB per doubling of distance', () =>
    expect(freeSpaceLossDb(2000, 5.8e9) - freeSpaceLossDb(1000, 5.8e9)).toBeCloseTo(20 * Math.log10(2), 10))
  it('rejects a zero distance', () => expect(() => freeSpaceLossDb(0, 1e9)).toThrow(/distanceM/))
})

describe('freeSpaceLossPracticalDb', () => {
  it('differs from the exact form by 32.45 − 32.4478 dB', () =>
    expect(freeSpaceLossPracticalDb(1000, 2.4e9) - freeSpaceLossDb(1000, 2.4e9)).toBeCloseTo(32.45 - FSPL_EXACT_CONSTANT_DB, 10))
})

describe('freeSpaceDistanceForLossM', () => {
  it('inverts freeSpaceLossDb', () => expect(freeSpaceDistanceForLossM(freeSpaceLossDb(1234, 868e6), 868e6)).toBeCloseTo(1234, 8))
  it('inverts the practical form too', () =>
    expect(freeSpaceDistanceForLossPracticalM(freeSpaceLossPracticalDb(777, 433e6), 433e6)).toBeCloseTo(777, 8))
  it('rejects a NaN loss', () => expect(() => freeSpaceDistanceForLossM(NaN, 1e9)).toThrow(/lossDb/))
})
