import { describe, expect, it } from 'vitest'
import { matchedDistanceAdvantage } from '../../../../shared/propagation/matchedAdvantage.js'
import { studentTQuantile } from '../../../../shared/stats/studentT.js'

/** A flight on a fixed course: power falls 25 dB/decade, with a repeating ±1 dB ripple. */
function flight(offsetDb: number, count: number) {
  const distanceM = new Float64Array(count)
  const rxPowerDbm = new Float64Array(count)
  for (let i = 0; i < count; i++) {
    distanceM[i] = 20 + (i * 1000) / count
    rxPowerDbm[i] = offsetDb - 30 - 25 * Math.log10(distanceM[i]!) + (i % 3) - 1
  }
  return { distanceM, rxPowerDbm }
}

describe('matchedDistanceAdvantage', () => {
  it('finds the dB offset between two flights of the same course', () => {
    const res = matchedDistanceAdvantage(flight(0, 4000), flight(6, 4000), { binWidthM: 100 })
    expect(res.meanDifferenceDb).toBeCloseTo(6, 9)
    expect(res.binCount).toBe(res.bins.length)
    expect(res.lowerDb!).toBeLessThanOrEqual(6)
    expect(res.upperDb!).toBeGreaterThanOrEqual(6)
  })
  it('builds the interval from the spread of per-bin differences with t(0.975, m − 1)', () => {
    const a = flight(0, 2000)
    const b = flight(3, 2000)
    // a 2 dB step on the far half makes the bins disagree
    for (let i = 1000; i < 2000; i++) b.rxPowerDbm[i]! += 2
    const res = matchedDistanceAdvantage(a, b, { binWidthM: 100 })
    const diffs = res.bins.map((x) => x.differenceDb)
    const m = diffs.length
    const mean = diffs.reduce((s, v) => s + v, 0) / m
    const sd = Math.sqrt(diffs.reduce((s, v) => s + (v - mean) ** 2, 0) / (m - 1))
    expect(res.upperDb! - res.meanDifferenceDb!).toBeCloseTo((studentTQuantile(0.975, m - 1) * sd) / Math.sqrt(m), 9)
  })
  it('compares medians, so a few deep fades do not move a bin', () => {
    const a = flight(0, 4000)
    const b = flight(0, 4000)
    let meanShiftDb = 0
    for (let i = 0; i < 4000; i += 50) {
      meanShiftDb += (-140 - b.rxPowerDbm[i]!) / 4000
      b.rxPowerDbm[i] = -140
    }
    // a mean per bin would drop by the average fade share; the median moves by at most one rank
    expect(Math.abs(meanShiftDb)).toBeGreaterThan(0.5)
    expect(Math.abs(matchedDistanceAdvantage(a, b, { binWidthM: 100 }).meanDifferenceDb!)).toBeLessThan(0.1)
  })
  it('skips bins thinner than minSamplesPerBin and returns null without shared bins', () => {
    const res = matchedDistanceAdvantage(flight(0, 10), flight(1, 10), { binWidthM: 100, minSamplesPerBin: 5 })
    expect(res.binCount).toBe(0)
    expect(res.meanDifferenceDb).toBeNull()
  })
  it('rejects a zero bin width', () =>
    expect(() => matchedDistanceAdvantage(flight(0, 10), flight(0, 10), { binWidthM: 0 })).toThrow(/binWidthM/))
})
