import { describe, expect, it } from 'vitest'
import { fastLog10 } from '../../../../shared/stats/fastLog10.js'

describe('fastLog10', () => {
  it('stays within 1e-13 of Math.log10 from 1 m to 4000 km', () => {
    let worst = 0
    for (let x = 1; x < 4e9; x *= 1.0007) worst = Math.max(worst, Math.abs(fastLog10(x) - Math.log10(x)))
    expect(worst).toBeLessThan(1e-13)
  })
  it('is exact at powers of two and ten used as table edges', () => {
    for (const x of [1, 2, 1024, 1e3, 1e6]) expect(fastLog10(x)).toBeCloseTo(Math.log10(x), 14)
  })
  it('falls back to Math.log10 below 1 and for NaN, 0 and Infinity', () => {
    expect(fastLog10(0.25)).toBe(Math.log10(0.25))
    expect(fastLog10(0)).toBe(-Infinity)
    expect(Number.isNaN(fastLog10(NaN))).toBe(true)
    expect(fastLog10(Infinity)).toBe(Infinity)
  })
})
