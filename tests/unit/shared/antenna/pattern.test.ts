import { describe, expect, it } from 'vitest'
import { gainOffBoresightDbi, parabolicPatternDb } from '../../../../shared/antenna/pattern.js'

describe('parabolicPatternDb', () => {
  // 3GPP TR 36.942: the half-power points sit at half the beamwidth
  it('is −3 dB at half the beamwidth', () => expect(parabolicPatternDb(32.5, 65)).toBeCloseTo(-3, 12))
  it('is 0 dB on boresight', () => expect(parabolicPatternDb(0, 30)).toBeCloseTo(0, 15))
  it('floors at the maximum attenuation', () => expect(parabolicPatternDb(170, 30, 25)).toBe(-25))
  it('rejects a zero beamwidth', () => expect(() => parabolicPatternDb(1, 0)).toThrow(/beamwidthDeg/))
  it('rejects a negative angle', () => expect(() => parabolicPatternDb(-1, 60)).toThrow(/offBoresightDeg/))
})

describe('gainOffBoresightDbi', () => {
  it('is the peak gain less 3 dB at the half-power edge', () => expect(gainOffBoresightDbi(14, 15, 30)).toBeCloseTo(11, 12))
  it('never falls below peak − A_m', () => expect(gainOffBoresightDbi(14, 120, 30, 20)).toBe(-6))
  it('rejects a NaN gain', () => expect(() => gainOffBoresightDbi(NaN, 0, 30)).toThrow(/peakGainDbi/))
})
