import { describe, expect, it } from 'vitest'
import { lineOfSightClearance } from '../../../../shared/fresnel/clearance.js'
import { earthBulgeM } from '../../../../shared/fresnel/earthBulge.js'
import { fresnelZoneRadiusM } from '../../../../shared/fresnel/zone.js'

const path = { freqHz: 2.4e9, groundAntennaHeightM: 2, aircraftHeightM: 102, pathLengthM: 2000 }

describe('lineOfSightClearance', () => {
  it('interpolates the ray linearly and subtracts obstacle and bulge', () => {
    const c = lineOfSightClearance(path, 500, 10)
    expect(c.rayHeightM).toBeCloseTo(27, 12)
    expect(c.clearanceFlatM).toBeCloseTo(17, 12)
    expect(c.clearanceM).toBeCloseTo(17 - earthBulgeM(500, 1500), 12)
    expect(c.clearanceFraction).toBeCloseTo(c.clearanceM / fresnelZoneRadiusM(2.4e9, 500, 1500), 12)
  })
  it('meets the 60 % rule just above 0.6 F1 and fails just below', () => {
    const f1 = fresnelZoneRadiusM(2.4e9, 1000, 1000)
    const bulge = earthBulgeM(1000, 1000)
    const ray = 52
    expect(lineOfSightClearance(path, 1000, ray - bulge - 0.61 * f1).meetsClearanceRule).toBe(true)
    expect(lineOfSightClearance(path, 1000, ray - bulge - 0.59 * f1).meetsClearanceRule).toBe(false)
  })
  it('gives a knife-edge loss only when the edge intrudes into the zone', () => {
    expect(lineOfSightClearance(path, 1000, 0).knifeEdgeLossDb).toBe(0)
    expect(lineOfSightClearance(path, 1000, 60).knifeEdgeLossDb).toBeGreaterThan(6)
  })
  it('rejects an obstacle beyond the aircraft', () => expect(() => lineOfSightClearance(path, 2500, 1)).toThrow(/obstacleDistanceM/))
})
