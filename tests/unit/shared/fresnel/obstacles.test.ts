import { describe, expect, it } from 'vitest'
import { createLocalProjection, projectToLocal } from '../../../../shared/geo/localProjection.js'
import { type Obstacle, prepareObstacles } from '../../../../shared/fresnel/obstacles.js'

const station = { latDeg: 47.4, lonDeg: 8.5 }
const proj = createLocalProjection(station.latDeg, station.lonDeg)
/** Geographic position of a point given in metres east/north of the station (inverts the projection's series). */
function at(eastM: number, northM: number) {
  let dLat = northM / proj.north0
  for (let i = 0; i < 5; i++) dLat = northM / (proj.north0 + dLat * (proj.north1 + dLat * proj.north2))
  const eastScale = proj.east0 + dLat * (proj.east1 + dLat * proj.east2)
  return { latDeg: station.latDeg + dLat, lonDeg: station.lonDeg + eastM / eastScale }
}

describe('prepareObstacles', () => {
  it('projects points, edges and vertices around the station', () => {
    const obstacles: Obstacle[] = [
      { kind: 'point', label: 'mast', heightM: 20, position: at(100, 0) },
      { kind: 'polygon', label: 'barn', heightM: 8, ring: [at(0, 10), at(10, 10), at(10, 20)] },
    ]
    const p = prepareObstacles(obstacles, station, 400)
    expect(p.labels).toEqual(['mast', 'barn'])
    expect(p.segX1.length).toBe(3)
    expect(p.ptX.length).toBe(4)
    expect(p.ptX[0]).toBeCloseTo(projectToLocal(proj, at(100, 0).latDeg, at(100, 0).lonDeg).eastM, 9)
  })
  it('raises an obstacle standing on higher ground', () => {
    const p = prepareObstacles([{ kind: 'point', label: 'tree', heightM: 10, baseElevationM: 415, position: at(5, 5) }], station, 400)
    expect(p.ptTopM[0]).toBe(25)
  })
  it('rejects a line with one vertex', () =>
    expect(() => prepareObstacles([{ kind: 'line', label: 'x', heightM: 1, path: [at(0, 0)] }], station, 0)).toThrow(/vertex count/))
  it('rejects a negative height naming the obstacle', () =>
    expect(() => prepareObstacles([{ kind: 'point', label: 'x', heightM: -1, position: at(0, 0) }], station, 0)).toThrow(/obstacles\[0\]\.heightM/))
})
