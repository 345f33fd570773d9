// Property tests of the radio-link core: identities that must hold for any input, not single figures.
import { describe, expect, it } from 'vitest'
import {
  dbmToMw,
  equivalentTxPowerMw,
  fitLogDistance,
  freeSpaceLossDb,
  freeSpaceModel,
  predictedRangeM,
  rangeFactor,
  rangeGainPercent,
  txPowerForRangeDbm,
} from '../../shared/index.js'
import { readLogfitCsv } from './checkValues.js'

const files = ['logfit-a.csv', 'logfit-b.csv', 'logfit-c.csv']

describe('log-distance fit properties (log-distance model, Rappaport)', () => {
  for (const file of files) {
    it(`${file}: scaling every distance by 10 raises the intercept by exactly 10·n dB`, () => {
      const { distanceM, rssiDbm } = readLogfitCsv(file)
      const base = fitLogDistance(distanceM, rssiDbm)
      const scaled = fitLogDistance(distanceM.map((d) => d * 10), rssiDbm)
      expect(scaled.exponent).toBeCloseTo(base.exponent, 9)
      // the same powers now sit a decade further out, so Pr(1 m) rises by one decade of slope: 10·n dB
      expect(scaled.interceptDbm - base.interceptDbm).toBeCloseTo(10 * base.exponent, 8)
      expect(scaled.residualSigmaDb).toBeCloseTo(base.residualSigmaDb, 9)
    })
    it(`${file}: a reference distance of 100 m gives the fitted power at 100 m as intercept`, () => {
      const { distanceM, rssiDbm } = readLogfitCsv(file)
      const at1 = fitLogDistance(distanceM, rssiDbm)
      const at100 = fitLogDistance(distanceM, rssiDbm, { referenceDistanceM: 100 })
      expect(at100.interceptDbm).toBeCloseTo(at1.interceptDbm - 20 * at1.exponent, 8)
    })
    it(`${file}: the 95 % interval of n contains the estimate and widens at 99 %`, () => {
      const { distanceM, rssiDbm } = readLogfitCsv(file)
      const f95 = fitLogDistance(distanceM, rssiDbm)
      const f99 = fitLogDistance(distanceM, rssiDbm, { confidenceLevel: 0.99 })
      expect(f95.exponentLower).toBeLessThanOrEqual(f95.exponent)
      expect(f95.exponentUpper).toBeGreaterThanOrEqual(f95.exponent)
      expect(f99.exponentUpper - f99.exponentLower).toBeGreaterThan(f95.exponentUpper - f95.exponentLower)
    })
  }
  it('adding a constant to every power shifts only the intercept', () => {
    const { distanceM, rssiDbm } = readLogfitCsv('logfit-c.csv')
    const base = fitLogDistance(distanceM, rssiDbm)
    const shifted = fitLogDistance(distanceM, rssiDbm.map((p) => p + 7.5))
    expect(shifted.interceptDbm - base.interceptDbm).toBeCloseTo(7.5, 9)
    expect(shifted.exponent).toBeCloseTo(base.exponent, 10)
    expect(shifted.rSquared).toBeCloseTo(base.rSquared, 10)
  })
})

describe('range trades (common practice, no source; follow from the log-distance model)', () => {
  it('+3.0103 dB at n = 2 gives a range factor of √2', () => {
    expect(rangeFactor(10 * Math.log10(2), 2)).toBeCloseTo(Math.SQRT2, 12)
  })
  it('doubling the power at n = 2 gives about 41 % more range', () => {
    expect(rangeGainPercent(10 * Math.log10(2), 2)).toBeCloseTo(100 * (Math.SQRT2 - 1), 9)
  })
  it('+10 dB at n = 2 multiplies range by √10', () => {
    expect(rangeFactor(10, 2)).toBeCloseTo(Math.sqrt(10), 12)
  })
  it('the same dB buys less range at a higher exponent', () => {
    for (const db of [3, 6, 10]) expect(rangeFactor(db, 3.5)).toBeLessThan(rangeFactor(db, 2))
  })
  it('range factors compose: Δ1 then Δ2 equals Δ1 + Δ2', () => {
    for (const n of [2, 2.7, 3.4]) {
      expect(rangeFactor(4, n) * rangeFactor(5, n)).toBeCloseTo(rangeFactor(9, n), 12)
    }
  })
  it('an antenna-gain change is worth the same factor in transmit milliwatts', () => {
    for (const g of [-3, 0, 3, 8, 10]) {
      expect(equivalentTxPowerMw(100, g) / 100).toBeCloseTo(dbmToMw(g), 10)
    }
  })
})

describe('free-space predictions (ITU-R P.525, Friis)', () => {
  const budget = { txPowerDbm: 20, txGainDbi: 2, rxGainDbi: 2, txLossDb: 0.5, rxLossDb: 0.5, freqHz: 2.4e9 }
  it('free-space loss grows 20 dB per decade of distance', () => {
    expect(freeSpaceLossDb(10_000, 2.4e9) - freeSpaceLossDb(1000, 2.4e9)).toBeCloseTo(20, 10)
  })
  it('doubling transmit power stretches the free-space range by √2', () => {
    const model = freeSpaceModel(budget)
    const louder = freeSpaceModel({ ...budget, txPowerDbm: budget.txPowerDbm + 10 * Math.log10(2) })
    expect(predictedRangeM(louder, -100, 10) / predictedRangeM(model, -100, 10)).toBeCloseTo(Math.SQRT2, 10)
  })
  it('the power needed for the predicted range is the power the model was built with', () => {
    const model = freeSpaceModel(budget)
    const range = predictedRangeM(model, -100, 10)
    expect(txPowerForRangeDbm(model, budget.txPowerDbm, range, -100, 10)).toBeCloseTo(budget.txPowerDbm, 9)
  })
  it('twice the range needs 6.02 dB more power under n = 2', () => {
    const model = freeSpaceModel(budget)
    const range = predictedRangeM(model, -100, 10)
    const more = txPowerForRangeDbm(model, budget.txPowerDbm, 2 * range, -100, 10)
    expect(more - budget.txPowerDbm).toBeCloseTo(20 * Math.log10(2), 9)
  })
})
