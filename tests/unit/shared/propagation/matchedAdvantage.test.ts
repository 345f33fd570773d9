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

/** Seeded PRNG (mulberry32): the same trials on every run. */
function mulberry32(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/**
 * Out to reachM and back every 1.5 m, 25 dB/decade, 4 dB per-flight log-normal shadowing as a first-order
 * autoregressive process over distance travelled (decorrelation decorrM) plus 1 dB of independent noise.
 */
function shadowedFlight(rnd: () => number, offsetDb: number, reachM: number, decorrM: number) {
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd())
  const stepM = 1.5
  const n = Math.floor((2 * reachM) / stepM)
  const distanceM = new Float64Array(n)
  const rxPowerDbm = new Float64Array(n)
  const rho = Math.exp(-stepM / decorrM)
  const innov = Math.sqrt(1 - rho * rho)
  let shadowDb = 4 * gauss()
  for (let i = 0; i < n; i++) {
    const s = i * stepM
    const d = 20 + (s < reachM ? s : 2 * reachM - s)
    shadowDb = rho * shadowDb + innov * 4 * gauss()
    distanceM[i] = d
    rxPowerDbm[i] = offsetDb - 30 - 25 * Math.log10(d) + shadowDb + gauss()
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
  it('builds the interval from the spread of per-bin differences with t(0.975, n_eff − 1) on n_eff = m(1 − ρ)/(1 + ρ)', () => {
    const a = flight(0, 2000)
    const b = flight(3, 2000)
    // a 2 dB step on the far half makes the bins disagree, and neighbours agree with each other
    for (let i = 1000; i < 2000; i++) b.rxPowerDbm[i]! += 2
    const res = matchedDistanceAdvantage(a, b, { binWidthM: 100 })
    const diffs = res.bins.map((x) => x.differenceDb)
    const m = diffs.length
    const mean = diffs.reduce((s, v) => s + v, 0) / m
    const ss = diffs.reduce((s, v) => s + (v - mean) ** 2, 0)
    const sd = Math.sqrt(ss / (m - 1))
    let lag = 0
    for (let k = 1; k < m; k++) lag += (diffs[k]! - mean) * (diffs[k - 1]! - mean)
    // lag-1 autocorrelation with the (1 + 4ρ)/m small-sample correction, clamped to [0, 0.9]
    const raw = lag / ss
    const rho = Math.min(0.9, Math.max(0, raw + (1 + 4 * raw) / m))
    expect(res.lag1Correlation).toBeCloseTo(rho, 12)
    expect(rho).toBeGreaterThan(0.3)
    const nEff = (m * (1 - rho)) / (1 + rho)
    expect(res.effectiveBinCount).toBeCloseTo(nEff, 12)
    expect(res.upperDb! - res.meanDifferenceDb!).toBeCloseTo((studentTQuantile(0.975, Math.max(1, nEff - 1)) * sd) / Math.sqrt(nEff), 9)
  })
  it('covers the truth in at least 90 % of 200 seeded trials when shadowing is correlated across neighbouring bins', () => {
    let covered = 0
    for (let seed = 1; seed <= 200; seed++) {
      const rnd = mulberry32(seed)
      // per-flight shadowing decorrelates over 200 m: 50 m bins next to each other share most of it (ρ ≈ 0.78)
      const res = matchedDistanceAdvantage(shadowedFlight(rnd, 0, 2000, 200), shadowedFlight(rnd, 6, 2000, 200), { binWidthM: 50 })
      if (res.lowerDb! <= 6 && 6 <= res.upperDb!) covered++
    }
    // treating the bins as independent covered only about half of these trials
    expect(covered).toBeGreaterThanOrEqual(180)
  })
  it('narrows with more independent data', () => {
    const widths = [2000, 8000].map((reachM) => {
      let sum = 0
      for (let seed = 1; seed <= 20; seed++) {
        const rnd = mulberry32(seed)
        // shadowing decorrelates within 5 m: bins are close to independent
        const res = matchedDistanceAdvantage(shadowedFlight(rnd, 0, reachM, 5), shadowedFlight(rnd, 6, reachM, 5), { binWidthM: 50 })
        sum += res.upperDb! - res.lowerDb!
      }
      return sum / 20
    })
    // four times the bins: about half the width
    expect(widths[1]!).toBeLessThan(0.6 * widths[0]!)
  })
  it('reports the effective bin count and correlation as null without an interval', () => {
    const res = matchedDistanceAdvantage(flight(0, 100), flight(1, 100), { binWidthM: 2000 })
    expect(res.binCount).toBe(1)
    expect(res).toMatchObject({ lowerDb: null, lag1Correlation: null, effectiveBinCount: null })
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
