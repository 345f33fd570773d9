import { describe, expect, it } from 'vitest'
import { advantageEquivalents, predictionFlag } from '../../../../shared/compare/equivalents.js'

describe('advantageEquivalents', () => {
  it('says +9.6 dB is like 9.1× the power (10^0.96 = 9.12)', () => {
    const e = advantageEquivalents(9.6, 2)
    expect(e.phrase).toBe('+9.6 dB: like 9.1× the power')
    expect(e.powerFactor).toBeCloseTo(9.120108, 5)
    // log-distance model: 10^(9.6/20) = 3.0200
    expect(e.rangeFactor).toBeCloseTo(3.01995, 4)
  })
  it('writes a disadvantage with a minus sign and a factor below one', () => {
    expect(advantageEquivalents(-3, null).phrase).toBe('−3.0 dB: like 0.5× the power')
    expect(advantageEquivalents(-3, null).rangeFactor).toBeNull()
  })
})

describe('predictionFlag', () => {
  it('flags a shortfall larger than the interval half-width', () => {
    expect(predictionFlag(4, 1.2, 8)).toBe('shortfall')
    expect(predictionFlag(12, 1.2, 8)).toBe('excess')
  })
  it('stays quiet inside the interval or without one', () => {
    expect(predictionFlag(7.5, 1.2, 8)).toBeNull()
    expect(predictionFlag(2, null, 8)).toBeNull()
  })
})
