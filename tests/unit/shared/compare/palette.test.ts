import { describe, expect, it } from 'vitest'
import { COMPARE_PALETTE, seriesStyle } from '../../../../shared/compare/palette.js'
import { colourDifference, perceivedLab, type VisionType } from '../../../../shared/compare/colourVision.js'

const VISIONS: VisionType[] = ['normal', 'protanopia', 'deuteranopia', 'tritanopia']

describe('COMPARE_PALETTE', () => {
  it('keeps every pair clearly apart (ΔE76 > 30) under normal vision and the three dichromacies', () => {
    for (const v of VISIONS) {
      for (let i = 0; i < COMPARE_PALETTE.length; i++) {
        for (let j = i + 1; j < COMPARE_PALETTE.length; j++) {
          const d = colourDifference(COMPARE_PALETTE[i]!.colour, COMPARE_PALETTE[j]!.colour, v)
          expect(d, `${COMPARE_PALETTE[i]!.name}/${COMPARE_PALETTE[j]!.name} under ${v}`).toBeGreaterThan(30)
        }
      }
    }
  })
  it('has six colours with distinct dash patterns and lightness readable on light tiles', () => {
    expect(COMPARE_PALETTE).toHaveLength(6)
    expect(new Set(COMPARE_PALETTE.map((s) => s.dash.join(','))).size).toBe(6)
    for (const s of COMPARE_PALETTE) expect(perceivedLab(s.colour, 'normal')[0]).toBeLessThan(75)
  })
})

describe('seriesStyle', () => {
  it('wraps after six flights', () => expect(seriesStyle(6)).toBe(seriesStyle(0)))
  it('rejects a negative index', () => expect(() => seriesStyle(-1)).toThrow(/index/))
})

describe('colourDifference', () => {
  it('is zero for the same colour and large for black against white (L* 0 vs 100)', () => {
    expect(colourDifference('#123456', '#123456')).toBe(0)
    expect(colourDifference('#000000', '#ffffff')).toBeCloseTo(100, 0)
  })
  it('makes red and green close under deuteranopia', () => {
    expect(colourDifference('#d03030', '#30a030', 'deuteranopia')).toBeLessThan(
      colourDifference('#d03030', '#30a030', 'normal') / 2,
    )
  })
})
