import { localOffsetM } from '@shared/geo/localOffset'
import { earthBulgeM } from '@shared/fresnel/earthBulge'
import { fresnelZoneRadiusM, REQUIRED_CLEARANCE_FRACTION } from '@shared/fresnel/zone'
import type { CourseObstacle, LonLat } from '@shared/types/course'

/** The two ends of the radio path at one moment. Heights are above the station's ground. */
export interface ProfileEnds {
  freqMHz: number
  stationLat: number
  stationLon: number
  antennaHeightM: number
  aircraftLat: number
  aircraftLon: number
  aircraftHeightM: number
}

/** An obstacle where it crosses the path: from/to along the path, top above the station's ground. */
export interface ProfileObstacle {
  label: string
  fromM: number
  toM: number
  topM: number
}

/** Everything the Fresnel profile chart draws, in metres. */
export interface FresnelProfile {
  pathLengthM: number
  distanceM: number[]
  /** Ground under the path: flat at the station's elevation, raised by the earth's bulge (k = 4/3). */
  groundM: number[]
  lineOfSightM: number[]
  f1UpperM: number[]
  f1LowerM: number[]
  /** Lower edge of the 60 % of the first zone that should stay clear. */
  f60LowerM: number[]
  obstacles: ProfileObstacle[]
  /** Smallest clearance over the path as a share of the first zone radius (negative: line of sight blocked). */
  minClearanceFraction: number
  /** What sets that minimum: 'ground' or an obstacle label. */
  limitedBy: string
  limitedAtM: number
  meetsRule: boolean
}

type Xy = [number, number]

function toLocal(stationLat: number, stationLon: number, c: LonLat): Xy {
  const o = localOffsetM(stationLat, stationLon, c[1], c[0])
  return [o.eastM, o.northM]
}

/** Parameter t along a→b where segment p→q crosses it, or null. */
function crossing(b: Xy, p: Xy, q: Xy): number | null {
  const den = b[0] * (q[1] - p[1]) - b[1] * (q[0] - p[0])
  if (Math.abs(den) < 1e-9) return null
  const t = (p[0] * (q[1] - p[1]) - p[1] * (q[0] - p[0])) / den
  const u = (p[0] * b[1] - p[1] * b[0]) / den
  return t >= 0 && t <= 1 && u >= 0 && u <= 1 ? t : null
}

function insideRing(pt: Xy, ring: Xy[]): boolean {
  let inside = false
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!
    const [xj, yj] = ring[j]!
    if (yi > pt[1] !== yj > pt[1] && pt[0] < ((xj - xi) * (pt[1] - yi)) / (yj - yi) + xi) inside = !inside
  }
  return inside
}

/**
 * Where each course obstacle meets the straight path from the station to the aircraft.
 * Point obstacles count when they stand within the first zone's radius of the path (plus 5 m).
 */
export function obstaclesOnPath(ends: ProfileEnds, obstacles: readonly CourseObstacle[]): ProfileObstacle[] {
  const b = toLocal(ends.stationLat, ends.stationLon, [ends.aircraftLon, ends.aircraftLat])
  const len = Math.hypot(b[0], b[1])
  if (!(len > 0)) return []
  const freqHz = ends.freqMHz * 1e6
  const barM = Math.max(2, len / 150)
  const out: ProfileObstacle[] = []
  for (const o of obstacles) {
    if (o.kind === 'point') {
      const p = toLocal(ends.stationLat, ends.stationLon, o.coordinates)
      const t = (p[0] * b[0] + p[1] * b[1]) / (len * len)
      if (t <= 0 || t >= 1) continue
      const lateral = Math.abs(p[0] * b[1] - p[1] * b[0]) / len
      if (lateral > fresnelZoneRadiusM(freqHz, t * len, (1 - t) * len) + 5) continue
      out.push({ label: o.label, fromM: t * len - barM / 2, toM: t * len + barM / 2, topM: o.heightM })
      continue
    }
    const pts = o.coordinates.map((c) => toLocal(ends.stationLat, ends.stationLon, c))
    const closed = o.kind === 'polygon' ? [...pts, pts[0]!] : pts
    const ts: number[] = []
    for (let i = 0; i + 1 < closed.length; i++) {
      const t = crossing(b, closed[i]!, closed[i + 1]!)
      if (t !== null) ts.push(t)
    }
    ts.sort((x, y) => x - y)
    if (o.kind === 'line') {
      for (const t of ts) out.push({ label: o.label, fromM: t * len - barM / 2, toM: t * len + barM / 2, topM: o.heightM })
      continue
    }
    // polygon: pair entries and exits; an end inside the outline opens or closes an interval
    const cuts = [...(insideRing([0, 0], pts) ? [0] : []), ...ts, ...(insideRing(b, pts) ? [1] : [])]
    for (let i = 0; i + 1 < cuts.length; i += 2) {
      out.push({ label: o.label, fromM: cuts[i]! * len, toM: cuts[i + 1]! * len, topM: o.heightM })
    }
  }
  return out
}

/**
 * The Fresnel profile of the path at one moment: ground with the earth's bulge, the line of sight,
 * the first zone and its 60 % envelope, obstacles, and the worst clearance.
 * @param steps points along the path (default 120)
 */
export function fresnelProfile(
  ends: ProfileEnds,
  obstacles: readonly CourseObstacle[],
  steps = 120,
): FresnelProfile {
  const pathLengthM = localOffsetLength(ends)
  const freqHz = ends.freqMHz * 1e6
  const bars = obstaclesOnPath(ends, obstacles)
  const xs = Array.from({ length: steps + 1 }, (_, i) => (pathLengthM * i) / steps)
  for (const o of bars) xs.push(Math.max(0, o.fromM), Math.min(pathLengthM, o.toM))
  xs.sort((a, b) => a - b)
  const p: FresnelProfile = {
    pathLengthM,
    distanceM: xs,
    groundM: [],
    lineOfSightM: [],
    f1UpperM: [],
    f1LowerM: [],
    f60LowerM: [],
    obstacles: bars,
    minClearanceFraction: Infinity,
    limitedBy: 'ground',
    limitedAtM: 0,
    meetsRule: true,
  }
  for (const x of xs) {
    const d2 = Math.max(0, pathLengthM - x)
    const bulge = earthBulgeM(x, d2)
    const los = ends.antennaHeightM + ((ends.aircraftHeightM - ends.antennaHeightM) * x) / (pathLengthM || 1)
    const r = pathLengthM > 0 ? fresnelZoneRadiusM(freqHz, x, d2) : 0
    p.groundM.push(bulge)
    p.lineOfSightM.push(los)
    p.f1UpperM.push(los + r)
    p.f1LowerM.push(los - r)
    p.f60LowerM.push(los - REQUIRED_CLEARANCE_FRACTION * r)
    if (r <= 0) continue
    let top = bulge
    let by = 'ground'
    for (const o of bars) {
      if (x >= o.fromM && x <= o.toM && o.topM + bulge > top) {
        top = o.topM + bulge
        by = o.label
      }
    }
    const fraction = (los - top) / r
    if (fraction < p.minClearanceFraction) {
      p.minClearanceFraction = fraction
      p.limitedBy = by
      p.limitedAtM = x
    }
  }
  if (!Number.isFinite(p.minClearanceFraction)) p.minClearanceFraction = 1
  p.meetsRule = p.minClearanceFraction >= REQUIRED_CLEARANCE_FRACTION
  return p
}

function localOffsetLength(ends: ProfileEnds): number {
  const o = localOffsetM(ends.stationLat, ends.stationLon, ends.aircraftLat, ends.aircraftLon)
  return Math.hypot(o.eastM, o.northM)
}
