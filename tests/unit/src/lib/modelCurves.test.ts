import { describe, expect, it } from 'vitest'
import { freeSpaceLossDb } from '@shared/rf/freeSpaceLoss'
import type { LinkSetupDto } from '@shared/types/setup'
import { logSpacedM, marginCurve, modelCurve, setupFreeSpaceModel } from '@/lib/modelCurves'

const setup = {
  freqMHz: 2400,
  txPowerDbm: 20,
  txAntenna: { type: 'dipole', gainDbi: 2 },
  rxAntennas: [
    { gainDbi: 2, kind: 'omni' },
    { gainDbi: 8, kind: 'directional' },
  ],
  cableLossDb: 1,
  sensitivityDbm: -100,
} as unknown as LinkSetupDto

describe('logSpacedM', () => {
  it('runs from the first to the last distance', () => {
    const d = logSpacedM(10, 10_000, 4)
    expect(d[0]).toBeCloseTo(10, 6)
    expect(d[1]).toBeCloseTo(100, 6)
    expect(d[3]).toBeCloseTo(10_000, 6)
  })
})

describe('setupFreeSpaceModel', () => {
  it('matches Friis with the best receive gain at 1 km', () => {
    const [[, prx]] = modelCurve(setupFreeSpaceModel(setup), [1000]) as [[number, number]]
    // 20 + 2 + 8 − 1 − FSPL(1 km, 2.4 GHz)
    expect(prx).toBeCloseTo(29 - freeSpaceLossDb(1000, 2.4e9), 6)
  })
})

describe('marginCurve', () => {
  it('falls 6 dB per doubling of distance in free space', () => {
    const [a, b] = marginCurve(setupFreeSpaceModel(setup), [500, 1000], -100)
    expect(a![1] - b![1]).toBeCloseTo(20 * Math.log10(2), 6)
  })
})
