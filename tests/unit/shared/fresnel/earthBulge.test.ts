import { describe, expect, it } from 'vitest'
import { earthBulgeM } from '../../../../shared/fresnel/earthBulge.js'

describe('earthBulgeM', () => {
  it('matches the exact sphere sagitta to 1e-6 over 20 km', () => {
    const a = (4 / 3) * 6_371_000
    // exact height of the chord above the arc midpoint: a(1 − cos(θ/2)) with θ = D/a
    expect(earthBulgeM(10_000, 10_000)).toBeCloseTo(a * (1 - Math.cos(10_000 / a)), 5)
  })
  it('shrinks as k grows', () => expect(earthBulgeM(5000, 5000, 2)).toBeLessThan(earthBulgeM(5000, 5000, 1)))
  it('is zero at either end', () => expect(earthBulgeM(0, 7000)).toBe(0))
  it('rejects k = 0', () => expect(() => earthBulgeM(1, 1, 0)).toThrow(/kFactor/))
})
