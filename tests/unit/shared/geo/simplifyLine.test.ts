import { describe, expect, it } from 'vitest'
import { simplifyLine } from '../../../../shared/geo/simplifyLine.js'
import { groundDistanceM } from '../../../../shared/geo/localOffset.js'

// about 1 m of latitude in degrees at 52°N
const M = 1 / 111_260

describe('simplifyLine', () => {
  it('drops the jitter of a straight leg and keeps its ends', () => {
    const coords: [number, number][] = Array.from({ length: 200 }, (_, i) => [-0.05 + i * 1e-5, 52.87 + (i % 2 ? 1 : -1) * M])
    const out = simplifyLine(coords, 5)
    expect(out).toEqual([coords[0], coords[199]])
  })

  it('keeps the corner of an L-shaped track and the points further out than the tolerance', () => {
    const leg1: [number, number][] = Array.from({ length: 50 }, (_, i) => [-0.05, 52.87 + i * 10 * M])
    const leg2: [number, number][] = Array.from({ length: 50 }, (_, i) => [-0.05 + (i + 1) * 1.6e-4, 52.87 + 490 * M])
    const out = simplifyLine([...leg1, ...leg2], 3)
    expect(out).toHaveLength(3)
    expect(out[1]).toEqual(leg1[49])
  })

  it('keeps a bump wider than the tolerance but not one narrower', () => {
    const line = (bumpM: number): [number, number][] => [
      [-0.05, 52.87],
      [-0.049, 52.87 + bumpM * M],
      [-0.048, 52.87],
    ]
    expect(simplifyLine(line(8), 5)).toHaveLength(3)
    expect(simplifyLine(line(3), 5)).toHaveLength(2)
  })

  it('keeps the far turn of a track that doubles back on itself', () => {
    const out = simplifyLine([[-0.05, 52.87], [-0.04, 52.87], [-0.05, 52.87 + 2 * M]], 5)
    expect(out).toHaveLength(3)
    expect(groundDistanceM(out[0]![1], out[0]![0], out[1]![1], out[1]![0])).toBeGreaterThan(600)
  })

  it('removes repeated fixes and passes short lines through', () => {
    expect(simplifyLine([[1, 2], [1, 2], [1, 2]], 5)).toEqual([[1, 2]])
    expect(simplifyLine([[1, 2], [1, 3]], 5)).toEqual([[1, 2], [1, 3]])
    expect(simplifyLine([], 5)).toEqual([])
  })

  it('refuses a tolerance that is not positive', () => {
    expect(() => simplifyLine([[1, 2]], 0)).toThrow(RangeError)
    expect(() => simplifyLine([[1, 2]], Number.NaN)).toThrow(RangeError)
  })
})
