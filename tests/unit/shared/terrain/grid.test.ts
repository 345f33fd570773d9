import { describe, expect, it } from 'vitest'
import { sampleGridBilinear, sampleProfile, type ElevationGrid } from '../../../../shared/terrain/grid.js'

// 3×2 grid over lon 0..2, lat 0..1; north row first
const grid: ElevationGrid = {
  width: 3,
  height: 2,
  west: 0,
  south: 0,
  east: 2,
  north: 1,
  elevationsM: Float32Array.from([10, 20, 30, 0, 10, NaN]),
}

describe('sampleGridBilinear', () => {
  it('returns sample values at sample positions, even beside a missing sample (regression)', () => {
    expect(sampleGridBilinear(grid, 1, 0)).toBe(10)
    expect(sampleGridBilinear(grid, 0, 1)).toBe(10)
  })
  it('interpolates inside a cell: centre of the west cell is the mean of its corners', () => {
    expect(sampleGridBilinear(grid, 0.5, 0.5)).toBeCloseTo((10 + 20 + 0 + 10) / 4, 9)
  })
  it('is NaN outside the grid and next to a missing sample', () => {
    expect(sampleGridBilinear(grid, 1.01, 0.5)).toBeNaN()
    expect(sampleGridBilinear(grid, 0.5, 1.5)).toBeNaN()
  })
})

describe('sampleProfile', () => {
  it('samples n evenly spaced points with distances from the start', () => {
    const p = sampleProfile((lat, lon) => lat * 100 + lon, { latDeg: 0, lonDeg: 0 }, { latDeg: 1, lonDeg: 2 }, 3, 1000)
    expect([...p.distanceM]).toEqual([0, 500, 1000])
    expect([...p.elevationM]).toEqual([0, 51, 102])
  })
  it('rejects fewer than 2 points', () => {
    expect(() => sampleProfile(() => 0, { latDeg: 0, lonDeg: 0 }, { latDeg: 0, lonDeg: 0 }, 1, 0)).toThrow(/n must be/)
  })
})
