import { describe, expect, it } from 'vitest'
import { freeSpaceLossDb } from '../../../../shared/rf/freeSpaceLoss.js'
import {
  allowedPathLossDb,
  eirpDbm,
  freeSpaceMarginDb,
  freeSpaceRangeM,
  freeSpaceRangePracticalM,
  type LinkBudget,
  receivedPowerDbm,
} from '../../../../shared/rf/linkBudget.js'

const budget: LinkBudget = { txPowerDbm: 25, txGainDbi: 2, rxGainDbi: 8, txLossDb: 0.5, rxLossDb: 1, freqHz: 5.8e9 }

describe('eirpDbm', () => {
  it('adds gain and subtracts loss', () => expect(eirpDbm(20, 3, 1)).toBe(22))
  it('rejects a negative loss', () => expect(() => eirpDbm(20, 3, -1)).toThrow(/txLossDb/))
})

describe('receivedPowerDbm', () => {
  it('is the Friis sum in dB', () =>
    expect(receivedPowerDbm(budget, 3000)).toBeCloseTo(25 + 2 + 8 - 0.5 - 1 - freeSpaceLossDb(3000, 5.8e9), 10))
  it('counts receive gain exactly like transmit power', () =>
    expect(receivedPowerDbm({ ...budget, rxGainDbi: 18 }, 3000)).toBeCloseTo(receivedPowerDbm({ ...budget, txPowerDbm: 35 }, 3000), 10))
  it('rejects a NaN gain naming rxGainDbi', () =>
    expect(() => receivedPowerDbm({ ...budget, rxGainDbi: NaN }, 1)).toThrow(/rxGainDbi/))
})

describe('freeSpaceMarginDb and ranges', () => {
  it('gives exactly the fade margin at the predicted range', () => {
    const range = freeSpaceRangeM(budget, -90, 10)
    expect(freeSpaceMarginDb(budget, range, -90)).toBeCloseTo(10, 9)
  })
  it('agrees between the exact and the 32.45 forms to 0.03 %', () =>
    expect(freeSpaceRangePracticalM(budget, -90, 10) / freeSpaceRangeM(budget, -90, 10)).toBeCloseTo(1, 3))
  it('allowed loss drops one for one with the fade margin', () =>
    expect(allowedPathLossDb(budget, -90, 0) - allowedPathLossDb(budget, -90, 15)).toBeCloseTo(15, 12))
  it('rejects a negative fade margin', () => expect(() => freeSpaceRangeM(budget, -90, -1)).toThrow(/fadeMarginDb/))
})
