import { describe, expect, it } from 'vitest'
import { estimateBeamwidthDeg } from '../../../../shared/setup/beamwidth.js'
import { powerFromInput, resolveRxAntenna, setupEirpDbm } from '../../../../shared/setup/derive.js'

describe('powerFromInput', () => {
  it('converts 25 mW to 13.98 dBm and 250 mW to 23.98 dBm (10·log10 P)', () => {
    expect(powerFromInput(25, 'mW').powerDbm).toBeCloseTo(13.979, 3)
    expect(powerFromInput(250, 'mW').powerDbm).toBeCloseTo(23.979, 3)
  })
  it('converts 20 dBm to 100 mW', () => expect(powerFromInput(20, 'dBm').powerMw).toBeCloseTo(100, 9))
  it('rejects 0 mW', () => expect(() => powerFromInput(0, 'mW')).toThrow(/powerMw/))
})

describe('setupEirpDbm', () => {
  it('adds the transmit antenna gain to the power', () => expect(setupEirpDbm(13.98, 2.15)).toBeCloseTo(16.13, 9))
})

describe('estimateBeamwidthDeg', () => {
  it('gives about 78° in elevation for a 2.15 dBi dipole (omni approximation)', () => {
    expect(estimateBeamwidthDeg('omni', 2.15)).toBeCloseTo(78, 0)
  })
  it('narrows an omni beam as its gain rises', () => {
    expect(estimateBeamwidthDeg('omni', 5)).toBeLessThan(estimateBeamwidthDeg('omni', 2.15))
  })
  it('treats a 0 dBi omni as a half-plane', () => expect(estimateBeamwidthDeg('omni', 0)).toBe(180))
  it('gives about 57° for a 10 dBi directional antenna, sqrt(32400/10)', () => {
    expect(estimateBeamwidthDeg('directional', 10)).toBeCloseTo(56.9, 1)
  })
})

describe('resolveRxAntenna', () => {
  const base = { label: '', type: 'patch', kind: 'directional' as const, gainDbi: 10, beamwidthDeg: null, azimuthDeg: 45, elevationDeg: 3, polarisation: 'rhcp' as const }
  it('estimates a blank beamwidth, marks it, and names the antenna by position', () => {
    expect(resolveRxAntenna(base, 1)).toMatchObject({ label: 'Rx 2', beamwidthDeg: 56.9, beamwidthEstimated: true, azimuthDeg: 45 })
  })
  it('keeps a typed beamwidth unmarked', () => {
    expect(resolveRxAntenna({ ...base, beamwidthDeg: 40 }, 0)).toMatchObject({ beamwidthDeg: 40, beamwidthEstimated: false })
  })
  it('drops pointing from an omni', () => {
    expect(resolveRxAntenna({ ...base, kind: 'omni' }, 0)).toMatchObject({ azimuthDeg: null, elevationDeg: null })
  })
})
