import { describe, expect, it } from 'vitest'
import { studentTCdf, studentTQuantile } from '../../../../shared/stats/studentT.js'

// two-sided 95 % critical values from standard t tables (e.g. NIST/SEMATECH e-Handbook, table 1.3.6.7.2)
const TABLE_975: Array<[number, number]> = [
  [1, 12.706],
  [2, 4.303],
  [5, 2.571],
  [10, 2.228],
  [30, 2.042],
  [100, 1.984],
]

describe('studentTQuantile', () => {
  for (const [df, t] of TABLE_975) {
    it(`matches the table value ${t} at 0.975 with ${df} degrees of freedom`, () =>
      expect(studentTQuantile(0.975, df)).toBeCloseTo(t, 3))
  }
  it('approaches the normal 1.95996 for many degrees of freedom', () =>
    expect(studentTQuantile(0.975, 1e6)).toBeCloseTo(1.959964, 5))
  it('is antisymmetric', () => expect(studentTQuantile(0.1, 7)).toBeCloseTo(-studentTQuantile(0.9, 7), 10))
  it('rejects a probability of 1', () => expect(() => studentTQuantile(1, 5)).toThrow(/probability/))
})

describe('studentTCdf', () => {
  it('is 0.5 at zero', () => expect(studentTCdf(0, 3)).toBeCloseTo(0.5, 14))
  it('matches the Cauchy CDF for one degree of freedom', () =>
    expect(studentTCdf(1.5, 1)).toBeCloseTo(0.5 + Math.atan(1.5) / Math.PI, 12))
  it('rejects zero degrees of freedom', () => expect(() => studentTCdf(1, 0)).toThrow(/degreesOfFreedom/))
})
