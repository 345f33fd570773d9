import { describe, expect, it } from 'vitest'
import { dbmToMw, dbToRatio, mwToDbm, ratioToDb } from '../../../../shared/units/power.js'

describe('mwToDbm', () => {
  // ITU-R V.574: 1 mW is 0 dBm, 1 W is 30 dBm by definition
  it('is 0 dBm at 1 mW and 30 dBm at 1 W', () => {
    expect(mwToDbm(1)).toBe(0)
    expect(mwToDbm(1000)).toBeCloseTo(30, 12)
  })
  it('rejects zero power naming powerMw', () => expect(() => mwToDbm(0)).toThrow(/powerMw/))
  it('rejects NaN', () => expect(() => mwToDbm(NaN)).toThrow(RangeError))
})

describe('dbmToMw', () => {
  it('round-trips mwToDbm over nine decades', () => {
    for (let mw = 1e-6; mw <= 1e3; mw *= 7.3) expect(dbmToMw(mwToDbm(mw)) / mw).toBeCloseTo(1, 12)
  })
  it('rejects Infinity naming powerDbm', () => expect(() => dbmToMw(Infinity)).toThrow(/powerDbm/))
})

describe('ratioToDb and dbToRatio', () => {
  it('gives 10 dB for a tenfold ratio (definition)', () => expect(ratioToDb(10)).toBeCloseTo(10, 12))
  it('are inverse functions', () => {
    for (const db of [-30, -3, 0, 3.0103, 17]) expect(ratioToDb(dbToRatio(db))).toBeCloseTo(db, 12)
  })
  it('rejects a negative ratio', () => expect(() => ratioToDb(-1)).toThrow(/powerRatio/))
})
