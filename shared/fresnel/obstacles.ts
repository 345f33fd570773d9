import { requireFinite, requireInRange, requireNonNegative } from '../units/guards.js'
import { createLocalProjection, projectToLocal } from '../geo/localProjection.js'

/** A geographic position in degrees. */
export interface GeoPoint {
  latDeg: number
  lonDeg: number
}

/** Fields shared by all obstacle shapes. */
interface ObstacleBase {
  /** Height of the obstacle top above its base, metres (>= 0). */
  heightM: number
  /** Name shown to the user, e.g. "barn" or "tree line". */
  label: string
  /** Ground elevation at the obstacle above mean sea level, metres (default: the station's). */
  baseElevationM?: number
}

/** A mast, tree or building corner; radiusM gives it a footprint (default 0). */
export interface PointObstacle extends ObstacleBase {
  kind: 'point'
  position: GeoPoint
  radiusM?: number
}

/** A wall, hedge or tree line. */
export interface LineObstacle extends ObstacleBase {
  kind: 'line'
  path: GeoPoint[]
}

/** A building or wood outline (closed automatically). */
export interface PolygonObstacle extends ObstacleBase {
  kind: 'polygon'
  ring: GeoPoint[]
}

/** Any obstacle near the radio path. */
export type Obstacle = PointObstacle | LineObstacle | PolygonObstacle

/** Obstacles projected to a flat east/north plane around the ground station, as typed arrays. */
export interface PreparedObstacles {
  labels: string[]
  /** Edge endpoints (metres east/north of the station), top height above datum, owner index. */
  segX1: Float64Array
  segY1: Float64Array
  segX2: Float64Array
  segY2: Float64Array
  segTopM: Float64Array
  segOwner: Int32Array
  /** Points and vertices: position, footprint radius, top above datum, owner index. */
  ptX: Float64Array
  ptY: Float64Array
  ptRadiusM: Float64Array
  ptTopM: Float64Array
  ptOwner: Int32Array
  /** Per obstacle: first edge, edge end (exclusive), first point, point end (exclusive). */
  segStart: Int32Array
  segEnd: Int32Array
  ptStart: Int32Array
  ptEnd: Int32Array
  /** Per obstacle: bounding circle (centre east/north, radius) for a quick reject. */
  circleX: Float64Array
  circleY: Float64Array
  circleR: Float64Array
}

/**
 * Projects obstacles to east/north metres around the station (geo/localProjection plane) for fast path tests.
 * @param obstacles points, lines (>= 2 vertices) and polygons (>= 3 vertices), heights in metres >= 0
 * @param origin ground station position in degrees
 * @param originGroundElevationM station ground elevation above mean sea level in metres, finite (the datum)
 * @returns edges and vertices as typed arrays; tops are heights above the datum
 * @throws RangeError/TypeError when an obstacle is malformed
 */
export function prepareObstacles(
  obstacles: readonly Obstacle[],
  origin: GeoPoint,
  originGroundElevationM: number,
): PreparedObstacles {
  requireFinite('originGroundElevationM', originGroundElevationM)
  const seg: number[][] = [[], [], [], [], [], []]
  const pt: number[][] = [[], [], [], [], []]
  const labels: string[] = []
  const ranges: number[][] = [[], [], [], []]
  const circles: number[][] = [[], [], []]
  // the same flight-wide plane as the per-sample pass, so paths and obstacles agree
  const proj = createLocalProjection(origin.latDeg, origin.lonDeg)
  const project = (p: GeoPoint) => projectToLocal(proj, p.latDeg, p.lonDeg)
  const closeObstacle = (xy: { eastM: number; northM: number }[], extraM: number) => {
    ranges[1]!.push(seg[0]!.length)
    ranges[3]!.push(pt[0]!.length)
    let cx = 0
    let cy = 0
    for (const v of xy) (cx += v.eastM / xy.length), (cy += v.northM / xy.length)
    let r = 0
    for (const v of xy) r = Math.max(r, Math.hypot(v.eastM - cx, v.northM - cy))
    circles[0]!.push(cx), circles[1]!.push(cy), circles[2]!.push(r + extraM)
  }
  obstacles.forEach((o, idx) => {
    if (typeof o.label !== 'string') throw new TypeError(`obstacles[${idx}].label must be a string`)
    requireNonNegative(`obstacles[${idx}].heightM`, o.heightM)
    const base = o.baseElevationM === undefined ? originGroundElevationM : o.baseElevationM
    requireFinite(`obstacles[${idx}].baseElevationM`, base)
    const top = base - originGroundElevationM + o.heightM
    labels.push(o.label)
    ranges[0]!.push(seg[0]!.length)
    ranges[2]!.push(pt[0]!.length)
    const addPoint = (x: number, y: number, r: number) => {
      pt[0]!.push(x), pt[1]!.push(y), pt[2]!.push(r), pt[3]!.push(top), pt[4]!.push(idx)
    }
    if (o.kind === 'point') {
      const p = project(o.position)
      const r = requireNonNegative(`obstacles[${idx}].radiusM`, o.radiusM ?? 0)
      addPoint(p.eastM, p.northM, r)
      closeObstacle([p], r)
      return
    }
    const verts = o.kind === 'line' ? o.path : o.kind === 'polygon' ? o.ring : null
    if (verts === null) throw new TypeError(`obstacles[${idx}].kind must be point, line or polygon`)
    const min = o.kind === 'line' ? 2 : 3
    requireInRange(`obstacles[${idx}] vertex count`, verts.length, min, 1e6)
    const xy = verts.map(project)
    const edges = o.kind === 'polygon' ? xy.length : xy.length - 1
    for (let k = 0; k < edges; k++) {
      const a = xy[k]!
      const b = xy[(k + 1) % xy.length]!
      seg[0]!.push(a.eastM), seg[1]!.push(a.northM), seg[2]!.push(b.eastM), seg[3]!.push(b.northM)
      seg[4]!.push(top), seg[5]!.push(idx)
    }
    // vertices catch a path that passes beside the obstacle without crossing it
    for (const v of xy) addPoint(v.eastM, v.northM, 0)
    closeObstacle(xy, 0)
  })
  return {
    labels,
    segX1: Float64Array.from(seg[0]!),
    segY1: Float64Array.from(seg[1]!),
    segX2: Float64Array.from(seg[2]!),
    segY2: Float64Array.from(seg[3]!),
    segTopM: Float64Array.from(seg[4]!),
    segOwner: Int32Array.from(seg[5]!),
    ptX: Float64Array.from(pt[0]!),
    ptY: Float64Array.from(pt[1]!),
    ptRadiusM: Float64Array.from(pt[2]!),
    ptTopM: Float64Array.from(pt[3]!),
    ptOwner: Int32Array.from(pt[4]!),
    segStart: Int32Array.from(ranges[0]!),
    segEnd: Int32Array.from(ranges[1]!),
    ptStart: Int32Array.from(ranges[2]!),
    ptEnd: Int32Array.from(ranges[3]!),
    circleX: Float64Array.from(circles[0]!),
    circleY: Float64Array.from(circles[1]!),
    circleR: Float64Array.from(circles[2]!),
  }
}

// the per-path clearance functions live beside, in obstacleClearance.ts; re-exported for existing imports
export {
  createClearanceScratch,
  createObstacleTracker,
  type ObstacleClearanceScratch,
  type ObstacleTracker,
  trackedObstacleClearance,
  worstObstacleClearance,
} from './obstacleClearance.js'
