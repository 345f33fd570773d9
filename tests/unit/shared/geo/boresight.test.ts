import { describe, expect, it } from 'vitest'
import { offBoresightAngleDeg } from '../../../../shared/geo/boresight.js'

describe('offBoresightAngleDeg', () => {
  it('equals the azimuth difference on the horizon', () => expect(offBoresightAngleDeg(10, 0, 55, 0)).toBeCloseTo(45, 10))
  it('wraps across north', () => expect(offBoresightAngleDeg(355, 0, 5, 0)).toBeCloseTo(10, 10))
  it('is 180° straight behind', () => expect(offBoresightAngleDeg(0, 0, 180, 0)).toBeCloseTo(180, 10))
  it('keeps precision for a tiny offset', () => expect(offBoresightAngleDeg(0, 0, 1e-7, 0)).toBeCloseTo(1e-7, 15))
  it('rejects an elevation above 90°', () => expect(() => offBoresightAngleDeg(0, 91, 0, 0)).toThrow(/boresightElevationDeg/))
})
