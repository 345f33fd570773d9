import { describe, expect, it } from 'vitest'
import {
  BEAM_AREA_IDEAL_DEG2,
  BEAM_AREA_PRACTICAL_DEG2,
  beamWidthAtDistanceM,
  beamwidthFromGainDeg,
  gainFromBeamwidthsDbi,
} from '../../../../shared/antenna/beamwidth.js'

describe('gainFromBeamwidthsDbi', () => {
  it('gives 0 dBi when the beam covers the whole 4π sr (ideal constant)', () =>
    expect(gainFromBeamwidthsDbi(Math.sqrt(BEAM_AREA_IDEAL_DEG2), Math.sqrt(BEAM_AREA_IDEAL_DEG2), BEAM_AREA_IDEAL_DEG2)).toBeCloseTo(0, 12))
  it('gains 3 dB when one beamwidth halves', () =>
    expect(gainFromBeamwidthsDbi(30, 20) - gainFromBeamwidthsDbi(60, 20)).toBeCloseTo(10 * Math.log10(2), 12))
  it('rejects a zero beamwidth', () => expect(() => gainFromBeamwidthsDbi(0, 10)).toThrow(/eBeamwidthDeg/))
})

describe('beamwidthFromGainDeg', () => {
  it('inverts gainFromBeamwidthsDbi for a symmetric beam', () =>
    expect(beamwidthFromGainDeg(gainFromBeamwidthsDbi(40, 40))).toBeCloseTo(40, 10))
  it('gives a narrower beam for a higher gain', () => expect(beamwidthFromGainDeg(14)).toBeLessThan(beamwidthFromGainDeg(8)))
  it('uses the practical constant by default', () =>
    expect(beamwidthFromGainDeg(10)).toBeCloseTo(Math.sqrt(BEAM_AREA_PRACTICAL_DEG2 / 10), 10))
  it('caps at 360° for a very low gain', () => expect(beamwidthFromGainDeg(-30)).toBe(360))
})

describe('beamWidthAtDistanceM', () => {
  it('is 2 d tan(θ/2): 2 km wide at 1 km for 90°', () => expect(beamWidthAtDistanceM(1000, 90)).toBeCloseTo(2000, 9))
  it('grows linearly with distance', () =>
    expect(beamWidthAtDistanceM(3000, 20) / beamWidthAtDistanceM(1000, 20)).toBeCloseTo(3, 12))
  it('rejects a beamwidth of 180° or more', () => expect(() => beamWidthAtDistanceM(1, 180)).toThrow(/beamwidthDeg/))
})
