import { describe, expect, it } from 'vitest'
import { groundClearanceFraction } from '../../../../shared/fresnel/groundClearance.js'
import { lineOfSightClearance } from '../../../../shared/fresnel/clearance.js'
import { wavelengthM } from '../../../../shared/rf/wavelength.js'

const twoKR = 2 * (4 / 3) * 6_371_000

/** Brute-force minimum over 2000 points of the same flat-ground clearance. */
function bruteForce(d: number, hg: number, ha: number, f: number): number {
  let worst = Infinity
  for (let i = 1; i < 2000; i++) {
    const c = lineOfSightClearance(
      { freqHz: f, groundAntennaHeightM: hg, aircraftHeightM: ha, pathLengthM: d },
      (i / 2000) * d,
      0,
    )
    worst = Math.min(worst, c.clearanceFraction)
  }
  return worst
}

describe('groundClearanceFraction', () => {
  it('finds the worst point of a short low path within 1 %', () => {
    const got = groundClearanceFraction(1500, 2, 20, wavelengthM(2.4e9), twoKR)
    expect(got / bruteForce(1500, 2, 20, 2.4e9)).toBeCloseTo(1, 2)
  })
  it('finds the worst point of a long path where the bulge matters within 2 %', () => {
    const got = groundClearanceFraction(20_000, 3, 100, wavelengthM(915e6), twoKR)
    expect(got / bruteForce(20_000, 3, 100, 915e6)).toBeCloseTo(1, 1)
    expect(got).toBeLessThanOrEqual(bruteForce(20_000, 3, 100, 915e6) * 1.02)
  })
  it('is +Infinity for a zero-length path', () => expect(groundClearanceFraction(0, 2, 10, 0.1, twoKR)).toBe(Infinity))
})

describe('groundClearanceFraction with a cap', () => {
  it('returns the cap when the path is clearer than that and the exact value below it', () => {
    const lam = wavelengthM(2.4e9)
    const exactHigh = groundClearanceFraction(1000, 2, 120, lam, twoKR)
    const exactLow = groundClearanceFraction(3000, 2, 8, lam, twoKR)
    expect(exactHigh).toBeGreaterThan(1)
    expect(groundClearanceFraction(1000, 2, 120, lam, twoKR, 1)).toBe(1)
    expect(exactLow).toBeLessThan(1)
    expect(groundClearanceFraction(3000, 2, 8, lam, twoKR, 1)).toBe(exactLow)
  })
})
