import { describe, expect, it } from 'vitest'
import {
  meridianRadiusM,
  primeVerticalRadiusM,
  sphericalScaleError,
  WGS84_A_M,
  WGS84_B_M,
  WGS84_E2,
} from '../../../../shared/geo/wgs84.js'

describe('meridianRadiusM and primeVerticalRadiusM', () => {
  it('are a(1 − e²) and a at the equator', () => {
    expect(meridianRadiusM(0)).toBeCloseTo(WGS84_A_M * (1 - WGS84_E2), 6)
    expect(primeVerticalRadiusM(0)).toBe(WGS84_A_M)
  })
  it('both equal a²/b at the pole', () => {
    expect(meridianRadiusM(90)).toBeCloseTo((WGS84_A_M * WGS84_A_M) / WGS84_B_M, 5)
    expect(primeVerticalRadiusM(90)).toBeCloseTo((WGS84_A_M * WGS84_A_M) / WGS84_B_M, 5)
  })
  it('rejects a latitude beyond 90°', () => expect(() => meridianRadiusM(95)).toThrow(/latDeg/))
})

describe('sphericalScaleError', () => {
  it('is positive north–south at the equator and negative near the poles', () => {
    expect(sphericalScaleError(0, 'north-south')).toBeGreaterThan(0)
    expect(sphericalScaleError(89, 'east-west')).toBeLessThan(0)
  })
  it('rejects a zero sphere radius', () => expect(() => sphericalScaleError(0, 'east-west', 0)).toThrow(/sphereRadiusM/))
})
