import { describe, expect, it } from 'vitest'
import { censoredMatchedAdvantage, type ComparedSeries } from '../../../../shared/compare/censoredAdvantage.js'

function series(offsetDb: number, sensitivityDbm: number): ComparedSeries {
  const n = 2000
  const d = new Float64Array(n)
  const p = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    d[i] = 30 + i
    // deterministic ripple instead of noise: identical shape in both flights
    const pr = -40 - 25 * Math.log10(d[i]!) + offsetDb + 2 * Math.sin(i / 7)
    p[i] = pr < sensitivityDbm ? -130 : pr
  }
  return { distanceM: d, rxDbm: p, floorDbm: -130, sensitivityDbm }
}

describe('censoredMatchedAdvantage', () => {
  it('recovers a 10 dB offset exactly when neither flight loses the link', () => {
    const r = censoredMatchedAdvantage(series(0, -200), series(10, -200))
    expect(r.meanDifferenceDb).toBeCloseTo(10, 6)
    expect(r.censoredBinCount).toBe(0)
  })
  it('leaves out bins where the weaker flight is mostly at the floor instead of biasing the advantage', () => {
    // the weak flight drops below -118 dBm beyond about 1.1 km
    const r = censoredMatchedAdvantage(series(0, -118), series(10, -118))
    expect(r.censoredBinCount).toBeGreaterThan(5)
    expect(r.meanDifferenceDb).toBeCloseTo(10, 6)
  })
})
