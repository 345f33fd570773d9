import { describe, expect, it } from 'vitest'
import { medianOf } from '../../../../shared/stats/median.js'

describe('medianOf', () => {
  it('picks the middle of an odd count', () => expect(medianOf(Float64Array.of(5, 1, 3))).toBe(3))
  it('averages the middle two of an even count', () => expect(medianOf(Float64Array.of(4, 1, 3, 2))).toBe(2.5))
  it('skips NaN entries', () => expect(medianOf(Float64Array.of(NaN, 7, NaN, 9, 8))).toBe(8))
  it('works on a slice', () => expect(medianOf(Float64Array.of(100, 1, 2, 3, 100), 1, 4)).toBe(2))
  it('does not reorder the input', () => {
    const a = Float64Array.of(3, 1, 2)
    medianOf(a)
    expect([...a]).toEqual([3, 1, 2])
  })
  it('rejects an all-NaN slice', () => expect(() => medianOf(Float64Array.of(NaN))).toThrow(/finite/))
  it('rejects bad bounds', () => expect(() => medianOf(new Float64Array(3), 2, 1)).toThrow(/start/))
})
