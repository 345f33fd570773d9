import { describe, expect, it } from 'vitest'
import { knifeEdgeLossDb, knifeEdgeNu } from '../../../../shared/fresnel/knifeEdge.js'

describe('knifeEdgeNu', () => {
  it('is −√2 when the ray clears the edge by one F1 radius', () => expect(knifeEdgeNu(7, 7)).toBeCloseTo(-Math.SQRT2, 12))
  it('is positive when the edge blocks the ray', () => expect(knifeEdgeNu(-1, 5)).toBeGreaterThan(0))
  it('rejects a zero F1 radius', () => expect(() => knifeEdgeNu(1, 0)).toThrow(/f1RadiusM/))
})

describe('knifeEdgeLossDb', () => {
  // ITU-R P.526: about 6 dB when the edge grazes the line of sight (ν = 0)
  it('is about 6 dB at grazing incidence', () => expect(knifeEdgeLossDb(0)).toBeCloseTo(6.0, 1))
  it('is 0 dB at and below ν = −0.78', () => {
    expect(knifeEdgeLossDb(-0.78)).toBe(0)
    expect(knifeEdgeLossDb(-3)).toBe(0)
  })
  it('is continuous near ν = −0.78 to within 0.01 dB', () => expect(knifeEdgeLossDb(-0.7799)).toBeLessThan(0.01))
  it('grows with ν', () => expect(knifeEdgeLossDb(2)).toBeGreaterThan(knifeEdgeLossDb(1)))
  it('rejects NaN', () => expect(() => knifeEdgeLossDb(NaN)).toThrow(/nu/))
})
