import { describe, expect, it } from 'vitest'
import {
  fitLogDistance,
  fitLogDistanceFromLog10,
  predictRxPowerDbm,
  referenceLossDb,
} from '../../../../shared/propagation/logDistanceFit.js'

/** Noise-free samples of Pr = P0 − 10 n log10(d) on a geometric grid. */
function exactLine(p0: number, n: number, count: number) {
  const distanceM = new Float64Array(count)
  const rx = new Float64Array(count)
  for (let i = 0; i < count; i++) {
    distanceM[i] = 10 * 1.1 ** i
    rx[i] = p0 - 10 * n * Math.log10(distanceM[i]!)
  }
  return { distanceM, rx }
}

describe('fitLogDistance', () => {
  it('recovers n and the intercept of a noise-free line', () => {
    const { distanceM, rx } = exactLine(-30, 2.7, 50)
    const fit = fitLogDistance(distanceM, rx)
    expect(fit.exponent).toBeCloseTo(2.7, 10)
    expect(fit.interceptDbm).toBeCloseTo(-30, 9)
    expect(fit.rSquared).toBeCloseTo(1, 12)
    expect(fit.residualSigmaDb).toBeLessThan(1e-9)
    expect(fit.sampleCount).toBe(50)
  })
  it('uses only the samples the include mask selects', () => {
    const { distanceM, rx } = exactLine(-30, 2, 20)
    rx[3] = NaN
    rx[7] = 50
    const include = new Uint8Array(20).fill(1)
    include[3] = 0
    include[7] = 0
    const fit = fitLogDistance(distanceM, rx, { include })
    expect(fit.sampleCount).toBe(18)
    expect(fit.exponent).toBeCloseTo(2, 10)
  })
  it('reports σ with N − 2 and N denominators in the ratio √(N/(N−2))', () => {
    const distanceM = Float64Array.of(10, 20, 40, 80, 160)
    const rx = Float64Array.of(-50, -57, -62, -71, -74)
    const fit = fitLogDistance(distanceM, rx)
    expect(fit.residualSigmaDb / fit.residualSigmaPopulationDb).toBeCloseTo(Math.sqrt(5 / 3), 12)
  })
  it('rejects fewer than three samples', () =>
    expect(() => fitLogDistance(Float64Array.of(1, 2), Float64Array.of(-1, -2))).toThrow(/at least 3/))
  it('rejects a used NaN power naming the index', () =>
    expect(() => fitLogDistance(Float64Array.of(1, 2, 3), Float64Array.of(-1, NaN, -3))).toThrow(/rxPowerDbm\[1\]/))
  it('rejects a zero distance', () =>
    expect(() => fitLogDistance(Float64Array.of(0, 2, 3), Float64Array.of(-1, -2, -3))).toThrow(/distanceM\[0\]/))
  it('rejects equal distances', () =>
    expect(() => fitLogDistance(Float64Array.of(5, 5, 5), Float64Array.of(-1, -2, -3))).toThrow(/different/))
})

describe('fitLogDistanceFromLog10', () => {
  it('gives the same fit as fitLogDistance', () => {
    const distanceM = Float64Array.of(12, 40, 95, 300, 800, 2500)
    const rx = Float64Array.of(-55, -66, -71, -86, -93, -104)
    const a = fitLogDistance(distanceM, rx, { referenceDistanceM: 10 })
    const b = fitLogDistanceFromLog10(distanceM.map(Math.log10), rx, { referenceDistanceM: 10 })
    expect(b.exponent).toBeCloseTo(a.exponent, 12)
    expect(b.interceptDbm).toBeCloseTo(a.interceptDbm, 11)
    expect(b.exponentUpper).toBeCloseTo(a.exponentUpper, 11)
  })
})

describe('predictRxPowerDbm and referenceLossDb', () => {
  const model = { interceptDbm: -40, exponent: 3, referenceDistanceM: 10 }
  it('falls 30 dB per decade at n = 3', () => expect(predictRxPowerDbm(model, 100)).toBeCloseTo(-70, 12))
  it('gives EIRP − Pr(d0)', () => expect(referenceLossDb(model, 20)).toBe(60))
  it('rejects a negative distance', () => expect(() => predictRxPowerDbm(model, -1)).toThrow(/distanceM/))
})
