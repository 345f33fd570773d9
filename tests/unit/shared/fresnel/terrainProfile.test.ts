import { describe, expect, it } from 'vitest'
import { lineOfSightClearance } from '../../../../shared/fresnel/clearance.js'
import { terrainProfileClearance } from '../../../../shared/fresnel/terrainProfile.js'

const path = { freqHz: 915e6, groundAntennaHeightM: 3, aircraftHeightM: 120, pathLengthM: 5000 }

describe('terrainProfileClearance', () => {
  it('picks the profile point with the lowest clearance fraction', () => {
    const d = Float64Array.of(0, 1000, 2000, 3000, 4000, 5000)
    const h = Float64Array.of(0, 10, 30, 20, 15, 0)
    const worst = terrainProfileClearance(path, d, h)!
    const fractions = [1, 2, 3, 4].map((i) => lineOfSightClearance(path, d[i]!, h[i]!).clearanceFraction)
    expect(worst.clearanceFraction).toBe(Math.min(...fractions))
    expect(worst.index).toBe(1 + fractions.indexOf(Math.min(...fractions)))
  })
  it('returns null when no point lies between the ends', () =>
    expect(terrainProfileClearance(path, Float64Array.of(0, 5000), Float64Array.of(0, 0))).toBeNull())
  it('rejects profiles of different lengths', () =>
    expect(() => terrainProfileClearance(path, new Float64Array(2), new Float64Array(3))).toThrow(/profileElevationM/))
})
