import { describe, expect, it } from 'vitest'
import {
  legendTicksDbm,
  NO_SIGNAL_COLOUR,
  rampColour,
  rampGradientCss,
  relativeLuminance,
  SIGNAL_RAMP,
  signalColour,
  signalDomainFor,
} from '@/lib/signalScale'

// Viénot, Brettel & Mollon 1999 (Color Res. Appl. 24(4)), deuteranope simulation in linear RGB
const DEUTAN = [
  [0.29275, 0.70725, 0],
  [0.29275, 0.70725, 0],
  [-0.02234, 0.02234, 1],
]
function toLinear(hex: string): number[] {
  const n = Number.parseInt(hex.slice(1), 16)
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255].map((c) => {
    const s = c / 255
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4
  })
}
function deutanLuminance(hex: string): number {
  const rgb = toLinear(hex)
  const sim = DEUTAN.map((row) => row.reduce((acc, w, k) => acc + w * rgb[k]!, 0))
  return 0.2126 * sim[0]! + 0.7152 * sim[1]! + 0.0722 * sim[2]!
}

describe('rampColour', () => {
  it('returns the first and last ramp stops at 0 and 1', () => {
    expect(rampColour(0)).toBe(SIGNAL_RAMP[0])
    expect(rampColour(1)).toBe(SIGNAL_RAMP[SIGNAL_RAMP.length - 1])
  })
  it('clamps fractions outside 0…1', () => {
    expect(rampColour(-3)).toBe(SIGNAL_RAMP[0])
    expect(rampColour(7)).toBe(SIGNAL_RAMP[SIGNAL_RAMP.length - 1])
  })
  it('gives the no-signal grey for NaN', () => expect(rampColour(Number.NaN)).toBe(NO_SIGNAL_COLOUR))
  it('gets strictly brighter from weak to strong at 101 steps (ordered in greyscale)', () => {
    const lum = Array.from({ length: 101 }, (_, i) => relativeLuminance(rampColour(i / 100)))
    for (let i = 1; i < lum.length; i++) expect(lum[i]!).toBeGreaterThan(lum[i - 1]!)
  })
  it('stays ordered for a simulated deuteranope (red/green colour blindness)', () => {
    const lum = Array.from({ length: 21 }, (_, i) => deutanLuminance(rampColour(i / 20)))
    for (let i = 1; i < lum.length; i++) expect(lum[i]!).toBeGreaterThan(lum[i - 1]!)
  })
  it('spans a wide lightness range (contrast of the ends above 7:1, WCAG formula)', () => {
    const hi = relativeLuminance(rampColour(1))
    const lo = relativeLuminance(rampColour(0))
    expect((hi + 0.05) / (lo + 0.05)).toBeGreaterThan(7)
  })
})

describe('signalColour', () => {
  const domain = { lowDbm: -100, highDbm: -40 }
  it('paints the sensitivity end dark and the strong end bright', () => {
    expect(signalColour(-100, domain)).toBe(SIGNAL_RAMP[0])
    expect(signalColour(-40, domain)).toBe(SIGNAL_RAMP[4])
  })
  it('paints the midpoint with the middle stop', () => expect(signalColour(-70, domain)).toBe(SIGNAL_RAMP[2]))
  it('paints a missing reading grey', () => {
    expect(signalColour(null, domain)).toBe(NO_SIGNAL_COLOUR)
    expect(signalColour(Number.NaN, domain)).toBe(NO_SIGNAL_COLOUR)
  })
  it('rejects an empty domain', () =>
    expect(() => signalColour(-50, { lowDbm: -50, highDbm: -50 })).toThrow(/domain/))
})

describe('signalDomainFor', () => {
  it('runs from the sensitivity to the strongest reading, rounded out to 5 dB', () => {
    expect(signalDomainFor([-62, -88, -47.2, null, Number.NaN], -97)).toEqual({ lowDbm: -100, highDbm: -45 })
  })
  it('uses the weakest reading when the sensitivity is unknown', () => {
    expect(signalDomainFor([-62, -88, -47], null)).toEqual({ lowDbm: -90, highDbm: -45 })
  })
  it('keeps at least 10 dB of span', () => {
    expect(signalDomainFor([-60, -60], -60)).toEqual({ lowDbm: -60, highDbm: -50 })
  })
  it('falls back to a 60 dB span when there are no readings', () => {
    expect(signalDomainFor([null], -95)).toEqual({ lowDbm: -95, highDbm: -35 })
  })
})

describe('legend helpers', () => {
  it('builds a gradient through every stop', () => {
    const css = rampGradientCss()
    for (const c of SIGNAL_RAMP) expect(css).toContain(c)
    expect(css.startsWith('linear-gradient(to right')).toBe(true)
  })
  it('spaces ticks evenly', () =>
    expect(legendTicksDbm({ lowDbm: -100, highDbm: -40 }, 4)).toEqual([-100, -80, -60, -40]))
})
