import { describe, expect, it } from 'vitest'
import { freeSpaceLossDb } from '../../../../shared/rf/freeSpaceLoss.js'
import { receivedPowerDbm } from '../../../../shared/rf/linkBudget.js'
import {
  equivalentTxPowerMw,
  freeSpaceModel,
  linkMarginAtDistanceDb,
  predictedRangeM,
  rangeFactor,
  rangeGainPercent,
  txPowerForRangeDbm,
} from '../../../../shared/propagation/predictions.js'

const fitted = { interceptDbm: -35, exponent: 2.8, referenceDistanceM: 1 }

describe('rangeFactor', () => {
  it('is 10 for 10·n dB', () => expect(rangeFactor(28, 2.8)).toBeCloseTo(10, 12))
  it('shrinks range for a loss', () => expect(rangeFactor(-6, 2)).toBeCloseTo(0.5, 2))
  it('rejects a zero exponent', () => expect(() => rangeFactor(3, 0)).toThrow(/exponent/))
})

describe('rangeGainPercent', () => {
  it('is 0 % for 0 dB', () => expect(rangeGainPercent(0, 3)).toBe(0))
})

describe('equivalentTxPowerMw', () => {
  it('turns −3.0103 dB into half the power', () => expect(equivalentTxPowerMw(500, -10 * Math.log10(2))).toBeCloseTo(250, 9))
  it('rejects zero power', () => expect(() => equivalentTxPowerMw(0, 3)).toThrow(/txPowerMw/))
})

describe('predictedRangeM', () => {
  it('puts the model exactly at sensitivity + fade margin', () => {
    const d = predictedRangeM(fitted, -110, 10)
    expect(linkMarginAtDistanceDb(fitted, d, -110)).toBeCloseTo(10, 9)
  })
  it('scales with the range factor when the margin changes', () =>
    expect(predictedRangeM(fitted, -110, 4) / predictedRangeM(fitted, -110, 10)).toBeCloseTo(rangeFactor(6, 2.8), 10))
  it('rejects a negative exponent', () =>
    expect(() => predictedRangeM({ ...fitted, exponent: -1 }, -100, 10)).toThrow(/exponent/))
})

describe('txPowerForRangeDbm', () => {
  it('asks 10·n·log10(2) dB more for twice the range', () => {
    const d = predictedRangeM(fitted, -110, 10)
    expect(txPowerForRangeDbm(fitted, 20, 2 * d, -110, 10) - 20).toBeCloseTo(28 * Math.log10(2), 9)
  })
})

describe('freeSpaceModel', () => {
  const budget = { txPowerDbm: 14, txGainDbi: 0, rxGainDbi: 3, txLossDb: 0, rxLossDb: 0.5, freqHz: 868e6 }
  it('predicts what Friis predicts at any distance', () => {
    const model = freeSpaceModel(budget)
    for (const d of [10, 1234, 50_000]) expect(linkMarginAtDistanceDb(model, d, 0)).toBeCloseTo(receivedPowerDbm(budget, d), 9)
  })
  it('has exponent 2 and the Friis intercept at 1 m', () =>
    expect(freeSpaceModel(budget)).toEqual({ interceptDbm: 14 + 3 - 0.5 - freeSpaceLossDb(1, 868e6), exponent: 2, referenceDistanceM: 1 }))
})
