import { describe, expect, it } from 'vitest'
import {
  effectiveRxGainDbi,
  predictedAdvantageDb,
  typicalDirection,
  type SetupBudgetTerms,
} from '../../../../shared/compare/predictedAdvantage.js'

const omni = { kind: 'omni' as const, gainDbi: 2, beamwidthDeg: null, azimuthDeg: null, elevationDeg: null }
const patch = { kind: 'directional' as const, gainDbi: 12, beamwidthDeg: 40, azimuthDeg: 90, elevationDeg: 0 }
const base: SetupBudgetTerms = { txPowerDbm: 14, txGainDbi: 2, cableLossDb: 1, rxAntennas: [omni] }

describe('effectiveRxGainDbi', () => {
  it('gives full gain on boresight and −3 dB at half the beamwidth (parabolic pattern)', () => {
    const s = { ...base, rxAntennas: [patch] }
    expect(effectiveRxGainDbi(s, { azimuthDeg: 90, elevationDeg: 0 })).toBeCloseTo(12, 9)
    expect(effectiveRxGainDbi(s, { azimuthDeg: 110, elevationDeg: 0 })).toBeCloseTo(9, 9)
  })
  it('takes the better antenna of a diversity pair', () => {
    const s = { ...base, rxAntennas: [omni, patch] }
    expect(effectiveRxGainDbi(s, { azimuthDeg: 270, elevationDeg: 0 })).toBe(2)
  })
})

describe('predictedAdvantageDb', () => {
  it('adds power and receive gain differences', () => {
    const other = { ...base, txPowerDbm: 24, rxAntennas: [patch] }
    const dir = { azimuthDeg: 90, elevationDeg: 0 }
    expect(predictedAdvantageDb(base, other, dir, dir)).toBeCloseTo(20, 9)
  })
})

describe('typicalDirection', () => {
  it('finds the mean bearing and median elevation of a flight', () => {
    const east = Float64Array.from([100, 200, 300, 5])
    const north = Float64Array.from([0, 0, 0, 0])
    const h = Float64Array.from([100, 200, 0, 50])
    const t = typicalDirection(east, north, h)!
    expect(t.azimuthDeg).toBeCloseTo(90, 9)
    expect(t.elevationDeg).toBeCloseTo(45, 9)
  })
})
