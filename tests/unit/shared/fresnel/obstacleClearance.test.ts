import { describe, expect, it } from 'vitest'
import { createLocalProjection } from '../../../../shared/geo/localProjection.js'
import { lineOfSightClearance } from '../../../../shared/fresnel/clearance.js'
import { type Obstacle, prepareObstacles } from '../../../../shared/fresnel/obstacles.js'
import {
  createClearanceScratch,
  createObstacleTracker,
  trackedObstacleClearance,
  worstObstacleClearance,
} from '../../../../shared/fresnel/obstacleClearance.js'
import { wavelengthM } from '../../../../shared/rf/wavelength.js'

const station = { latDeg: 47.4, lonDeg: 8.5 }
const proj = createLocalProjection(station.latDeg, station.lonDeg)
const f = 2.4e9
const lambda = wavelengthM(f)
const twoKR = 2 * (4 / 3) * 6_371_000
/** Geographic position of a point given in metres east/north of the station (inverts the projection's series). */
function at(eastM: number, northM: number) {
  let dLat = northM / proj.north0
  for (let i = 0; i < 5; i++) dLat = northM / (proj.north0 + dLat * (proj.north1 + dLat * proj.north2))
  const eastScale = proj.east0 + dLat * (proj.east1 + dLat * proj.east2)
  return { latDeg: station.latDeg + dLat, lonDeg: station.lonDeg + eastM / eastScale }
}

describe('worstObstacleClearance', () => {
  const scratch = createClearanceScratch()
  it('gives the vertical clearance of a wall the path crosses, as lineOfSightClearance does', () => {
    const wall: Obstacle = { kind: 'line', label: 'wall', heightM: 12, path: [at(-50, 800), at(50, 800)] }
    const prep = prepareObstacles([wall], station, 0)
    const got = worstObstacleClearance(prep, 0, 3000, 2, 60, lambda, twoKR, scratch)
    const want = lineOfSightClearance({ freqHz: f, groundAntennaHeightM: 2, aircraftHeightM: 60, pathLengthM: 3000 }, 800, 12)
    expect(got).toBeCloseTo(want.clearanceFraction, 9)
    expect(scratch.obstacleIndex).toBe(0)
    expect(scratch.distanceM).toBeCloseTo(800, 6)
  })
  it('measures a mast beside the path by its distance to the ray', () => {
    const prep = prepareObstacles([{ kind: 'point', label: 'mast', heightM: 100, position: at(3, 1000) }], station, 0)
    const got = worstObstacleClearance(prep, 0, 2000, 2, 102, lambda, twoKR, scratch)
    // the mast top is above the ray, so the gap is purely sideways: 3 m against F1 at mid-path
    expect(got).toBeCloseTo(3 / (0.5 * Math.sqrt(lambda * 2000)), 4)
  })
  it('ignores obstacles far from the path', () => {
    const prep = prepareObstacles([{ kind: 'point', label: 'far', heightM: 500, position: at(2000, 0) }], station, 0)
    expect(worstObstacleClearance(prep, 0, 2000, 2, 50, lambda, twoKR, scratch)).toBe(Infinity)
    expect(scratch.obstacleIndex).toBe(-1)
  })
  it('sees a polygon the path enters at its higher crossing', () => {
    const barn: Obstacle = { kind: 'polygon', label: 'barn', heightM: 15, ring: [at(-20, 400), at(20, 400), at(20, 440), at(-20, 440)] }
    const prep = prepareObstacles([barn], station, 0)
    const got = worstObstacleClearance(prep, 0, 1000, 2, 22, lambda, twoKR, scratch)
    const want = lineOfSightClearance({ freqHz: f, groundAntennaHeightM: 2, aircraftHeightM: 22, pathLengthM: 1000 }, 400, 15)
    expect(got).toBeCloseTo(want.clearanceFraction, 5)
    expect(got).toBeLessThan(0)
  })
})

describe('trackedObstacleClearance', () => {
  it('gives the same fractions as worstObstacleClearance along a wandering flight', () => {
    const obstacles: Obstacle[] = [
      { kind: 'point', label: 'mast', heightM: 30, radiusM: 2, position: at(150, 400) },
      { kind: 'line', label: 'hedge', heightM: 6, path: [at(-900, -300), at(200, -350), at(900, -200)] },
      { kind: 'polygon', label: 'barn', heightM: 12, ring: [at(300, 300), at(360, 300), at(360, 340), at(300, 340)] },
    ]
    const prep = prepareObstacles(obstacles, station, 0)
    const tracker = createObstacleTracker(prep)
    const a = createClearanceScratch()
    const b = createClearanceScratch()
    let seed = 4242
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647
    let x = 50
    let y = 50
    let heading = 0
    let compared = 0
    for (let i = 0; i < 20_000; i++) {
      heading += (rnd() - 0.5) * 0.2
      x += 3 * Math.sin(heading)
      y += 3 * Math.cos(heading)
      if (Math.hypot(x, y) > 1500) heading += Math.PI
      const h = 10 + 40 * rnd()
      const slow = worstObstacleClearance(prep, x, y, 2, h, lambda, twoKR, a)
      const fast = trackedObstacleClearance(tracker, x, y, 2, h, lambda, twoKR, b)
      // identical where the zone is obstructed; both at least 1 (zone clear) elsewhere
      if (slow < 1 || fast < 1) {
        expect(fast).toBeCloseTo(slow, 12)
        expect(b.obstacleIndex).toBe(a.obstacleIndex)
        compared++
      } else expect(Math.min(slow, fast)).toBeGreaterThanOrEqual(1)
    }
    expect(compared).toBeGreaterThan(100)
  })
})
