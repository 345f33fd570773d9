import { describe, expect, it } from 'vitest'
import { offsetToLatLonDeg } from '@shared/demo/localInverse'
import { fresnelZoneRadiusM } from '@shared/fresnel/zone'
import type { CourseObstacle } from '@shared/types/course'
import { fresnelProfile, obstaclesOnPath, type ProfileEnds } from '@/lib/fresnelProfile'

const ST = { lat: 52.1, lon: -1.3 }
function at(eastM: number, northM: number): [number, number] {
  const p = offsetToLatLonDeg(ST.lat, ST.lon, eastM, northM)
  return [p.lonDeg, p.latDeg]
}
const aircraft = at(0, 1000)
const ends: ProfileEnds = {
  freqMHz: 2400,
  stationLat: ST.lat,
  stationLon: ST.lon,
  antennaHeightM: 2,
  aircraftLat: aircraft[1],
  aircraftLon: aircraft[0],
  aircraftHeightM: 2,
}

describe('obstaclesOnPath', () => {
  it('finds a line crossing the path at its distance', () => {
    const wall: CourseObstacle = { id: 'w', kind: 'line', label: 'hedge', heightM: 3, coordinates: [at(-50, 400), at(50, 400)] }
    const [o] = obstaclesOnPath(ends, [wall])
    expect((o!.fromM + o!.toM) / 2).toBeCloseTo(400, 0)
    expect(o!.topM).toBe(3)
  })
  it('gives a polygon its entry and exit distances', () => {
    const barn: CourseObstacle = {
      id: 'b',
      kind: 'polygon',
      label: 'barn',
      heightM: 8,
      coordinates: [at(-20, 600), at(20, 600), at(20, 650), at(-20, 650)],
    }
    const [o] = obstaclesOnPath(ends, [barn])
    expect(o!.fromM).toBeCloseTo(600, 0)
    expect(o!.toM).toBeCloseTo(650, 0)
  })
  it('ignores a point obstacle far to the side of the path', () => {
    const mast: CourseObstacle = { id: 'm', kind: 'point', label: 'mast', heightM: 20, coordinates: at(300, 500) }
    expect(obstaclesOnPath(ends, [mast])).toEqual([])
  })
})

describe('fresnelProfile', () => {
  it('flags the ground as the limit for a low path, with clearance below the 60 % rule', () => {
    const p = fresnelProfile(ends, [])
    // 2 m antennas over 1 km at 2.4 GHz: mid-path F1 = sqrt(λ·500·500/1000) ≈ 5.6 m (ITU-R P.526 eq. 2)
    const f1Mid = fresnelZoneRadiusM(2.4e9, 500, 500)
    expect(p.limitedBy).toBe('ground')
    expect(p.meetsRule).toBe(false)
    expect(p.minClearanceFraction).toBeLessThan(2 / f1Mid)
    expect(p.pathLengthM).toBeCloseTo(1000, 0)
  })
  it('is clear when both ends are high', () => {
    const p = fresnelProfile({ ...ends, antennaHeightM: 40, aircraftHeightM: 120 }, [])
    expect(p.meetsRule).toBe(true)
  })
  it('names the obstacle that blocks the line of sight', () => {
    const wood: CourseObstacle = { id: 'w', kind: 'line', label: 'tree line', heightM: 30, coordinates: [at(-50, 500), at(50, 500)] }
    const p = fresnelProfile({ ...ends, antennaHeightM: 10, aircraftHeightM: 10 }, [wood])
    expect(p.limitedBy).toBe('tree line')
    expect(p.minClearanceFraction).toBeLessThan(0)
    expect(p.limitedAtM).toBeGreaterThan(490)
    expect(p.limitedAtM).toBeLessThan(510)
  })
  it('draws the first zone symmetric about the line of sight', () => {
    const p = fresnelProfile(ends, [], 10)
    const i = 5
    expect(p.f1UpperM[i]! - p.lineOfSightM[i]!).toBeCloseTo(p.lineOfSightM[i]! - p.f1LowerM[i]!, 9)
  })
})

describe('fresnelProfile over course terrain', () => {
  // 1 km path sampled every 100 m; the station's ground is 50 m above sea level
  const flatAt = (m: number) => ({ distanceM: Array.from({ length: 11 }, (_, i) => i * 100), elevationM: Array.from({ length: 11 }, () => m), datumM: 50 })
  const high = { ...ends, antennaHeightM: 10, aircraftHeightM: 40 }

  it('draws level terrain at the datum like the flat ground, and finds the same clearance', () => {
    const flat = fresnelProfile(high, [])
    const t = fresnelProfile(high, [], 120, flatAt(50))
    expect(t.ground).toBe('terrain')
    expect(flat.ground).toBe('flat')
    expect(t.limitedBy).toBe('terrain')
    expect(t.groundM[0]).toBeCloseTo(0, 9)
    // the terrain points are 100 m apart, the flat check is finer: equal within the sampling
    expect(t.minClearanceFraction).toBeCloseTo(flat.minClearanceFraction, 1)
  })

  it('raises the ground line with a hill and finds the line of sight blocked at its top', () => {
    const hill = flatAt(50)
    hill.elevationM[6] = 50 + 30
    const p = fresnelProfile(high, [], 120, hill)
    const i = p.distanceM.findIndex((d) => Math.abs(d - 600) < 1e-6)
    expect(p.groundM[i]!).toBeGreaterThan(30)
    expect(p.limitedBy).toBe('terrain')
    expect(p.limitedAtM).toBeCloseTo(600, 6)
    // ray at 600 m: 10 + 30·0.6 = 28 m, below the 30 m hilltop (plus bulge)
    expect(p.minClearanceFraction).toBeLessThan(0)
    expect(p.meetsRule).toBe(false)
  })

  it('stands obstacles on the terrain, so a hedge on a rise limits the clearance', () => {
    const rise = flatAt(50)
    for (const i of [3, 4, 5, 6]) rise.elevationM[i] = 58
    const hedge: CourseObstacle = { id: 'h', kind: 'line', label: 'hedge', heightM: 6, coordinates: [at(-50, 450), at(50, 450)] }
    const p = fresnelProfile(high, [hedge], 120, rise)
    expect(p.obstacles[0]!.baseM).toBeCloseTo(8, 6)
    expect(p.limitedBy).toBe('hedge')
    const onFlat = fresnelProfile(high, [hedge], 120, flatAt(50))
    expect(p.minClearanceFraction).toBeLessThan(onFlat.minClearanceFraction)
  })

  it('fills gaps in the data from the nearest sample, and falls back to flat ground without any data', () => {
    const gappy = flatAt(50)
    gappy.elevationM[6] = 80
    ;(gappy.elevationM as (number | null)[])[7] = null
    const p = fresnelProfile(high, [], 120, gappy)
    const i = p.distanceM.findIndex((d) => Math.abs(d - 700) < 1e-6)
    expect(p.groundM[i]! - p.groundM[p.distanceM.findIndex((d) => Math.abs(d - 600) < 1e-6)]!).toBeCloseTo(0, 0)
    const none = { ...flatAt(50), elevationM: Array.from({ length: 11 }, () => null) }
    expect(fresnelProfile(high, [], 120, none).ground).toBe('flat')
  })
})
