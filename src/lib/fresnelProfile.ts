import { localOffsetM } from '@shared/geo/localOffset'
import { earthBulgeM } from '@shared/fresnel/earthBulge'
import { fresnelZoneRadiusM, REQUIRED_CLEARANCE_FRACTION } from '@shared/fresnel/zone'
import { lineOfSightClearance, type LinkPath } from '@shared/fresnel/clearance'
import { terrainProfileClearance } from '@shared/fresnel/terrainProfile'
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
  /** Ground under the obstacle, above the station's ground (0 on the flat drawing). */
  baseM?: number
}

/**
 * The course terrain along the path, as GET /api/courses/:id/terrain/profile answers it, and the datum the
 * heights are measured from (the course's ground elevation at the station, as the analysis uses).
 */
export interface PathTerrain {
  /** Distances from the station, evenly spaced to the aircraft, metres. */
  distanceM: readonly number[]
  /** Terrain above mean sea level, metres; null outside the uploaded data. */
  elevationM: readonly (number | null)[]
  /** The station's ground elevation above mean sea level, metres. */
  datumM: number
}

/** Everything the Fresnel profile chart draws, in metres. */
export interface FresnelProfile {
  pathLengthM: number
  distanceM: number[]
  /** Where the ground line comes from: flat at the station's elevation, or the course terrain. */
  ground: 'flat' | 'terrain'
  /** Ground under the path above the station's ground, raised by the earth's bulge (k = 4/3). */
  groundM: number[]
  lineOfSightM: number[]
  f1UpperM: number[]
  f1LowerM: number[]
  /** Lower edge of the 60 % of the first zone that should stay clear. */
  f60LowerM: number[]
  obstacles: ProfileObstacle[]
  /** Smallest clearance over the path as a share of the first zone radius (negative: line of sight blocked). */
  minClearanceFraction: number
  /** What sets that minimum: 'ground', 'terrain' or an obstacle label. */
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
  terrain: PathTerrain | null = null,
): FresnelProfile {
  const pathLengthM = localOffsetLength(ends)
  if (terrain && pathLengthM > 0) {
    const t = terrainProfileOnPath(ends, obstacles, terrain, pathLengthM)
    if (t) return t
  }
  const freqHz = ends.freqMHz * 1e6
  const bars = obstaclesOnPath(ends, obstacles)
  const xs = Array.from({ length: steps + 1 }, (_, i) => (pathLengthM * i) / steps)
  for (const o of bars) xs.push(Math.max(0, o.fromM), Math.min(pathLengthM, o.toM))
  xs.sort((a, b) => a - b)
  const p: FresnelProfile = {
    pathLengthM,
    ground: 'flat',
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
    const { bulge, los, r } = pushPathPoint(p, ends, freqHz, x, 0)
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

/**
 * Appends one point of the drawn profile at x: ground (terrain height above the datum plus the earth's bulge),
 * the line of sight and the first-zone envelope. A zero-length path has no zone (radius 0).
 */
function pushPathPoint(
  p: FresnelProfile,
  ends: ProfileEnds,
  freqHz: number,
  x: number,
  terrainM: number,
): { bulge: number; los: number; r: number } {
  const d2 = Math.max(0, p.pathLengthM - x)
  const bulge = earthBulgeM(x, d2)
  const los = ends.antennaHeightM + ((ends.aircraftHeightM - ends.antennaHeightM) * x) / (p.pathLengthM || 1)
  const r = p.pathLengthM > 0 ? fresnelZoneRadiusM(freqHz, x, d2) : 0
  p.groundM.push(terrainM + bulge)
  p.lineOfSightM.push(los)
  p.f1UpperM.push(los + r)
  p.f1LowerM.push(los - r)
  p.f60LowerM.push(los - REQUIRED_CLEARANCE_FRACTION * r)
  return { bulge, los, r }
}

function localOffsetLength(ends: ProfileEnds): number {
  const o = localOffsetM(ends.stationLat, ends.stationLon, ends.aircraftLat, ends.aircraftLon)
  return Math.hypot(o.eastM, o.northM)
}

/** Terrain heights above the datum at the profile's points, gaps (no data) filled from the nearest known point. */
function terrainAboveDatum(terrain: PathTerrain): number[] | null {
  const rel = terrain.elevationM.map((e) => (e === null || !Number.isFinite(e) ? null : e - terrain.datumM))
  const known = rel.flatMap((v, i) => (v === null ? [] : [i]))
  if (known.length === 0) return null
  return rel.map((v, i) => {
    if (v !== null) return v
    const nearest = known.reduce((a, b) => (Math.abs(b - i) < Math.abs(a - i) ? b : a))
    return rel[nearest]!
  })
}

/** Linear interpolation of ys over increasing xs, clamped at the ends. */
function interpolate(xs: readonly number[], ys: readonly number[], x: number): number {
  if (x <= xs[0]!) return ys[0]!
  for (let i = 1; i < xs.length; i++) {
    if (x <= xs[i]!) {
      const span = xs[i]! - xs[i - 1]!
      return span > 0 ? ys[i - 1]! + ((ys[i]! - ys[i - 1]!) * (x - xs[i - 1]!)) / span : ys[i]!
    }
  }
  return ys[ys.length - 1]!
}

/**
 * The profile over the course terrain: the ground line is the terrain above the datum plus the earth's bulge,
 * obstacles stand on it, and the clearance comes from the shared core (terrain as knife edges, obstacles on top).
 * @returns null when the terrain has no data along the path (the caller draws flat ground)
 */
function terrainProfileOnPath(
  ends: ProfileEnds,
  obstacles: readonly CourseObstacle[],
  terrain: PathTerrain,
  pathLengthM: number,
): FresnelProfile | null {
  const rel = terrainAboveDatum(terrain)
  const last = terrain.distanceM[terrain.distanceM.length - 1] ?? 0
  if (!rel || rel.length < 2 || !(last > 0)) return null
  // the server measures along the geodesic, this screen in its local plane: stretch onto this path's length
  const tx = terrain.distanceM.map((d) => (d / last) * pathLengthM)
  const freqHz = ends.freqMHz * 1e6
  const path: LinkPath = { freqHz, groundAntennaHeightM: ends.antennaHeightM, aircraftHeightM: ends.aircraftHeightM, pathLengthM }
  const bars = obstaclesOnPath(ends, obstacles).map((o) => ({ ...o, baseM: interpolate(tx, rel, (o.fromM + o.toM) / 2) }))
  const xs = [...tx]
  for (const o of bars) xs.push(Math.max(0, o.fromM), Math.min(pathLengthM, o.toM))
  xs.sort((a, b) => a - b)
  const p: FresnelProfile = {
    pathLengthM,
    ground: 'terrain',
    distanceM: xs,
    groundM: [],
    lineOfSightM: [],
    f1UpperM: [],
    f1LowerM: [],
    f60LowerM: [],
    obstacles: bars,
    minClearanceFraction: 1,
    limitedBy: 'terrain',
    limitedAtM: 0,
    meetsRule: true,
  }
  for (const x of xs) pushPathPoint(p, ends, freqHz, x, interpolate(tx, rel, x))
  const worst = terrainProfileClearance(path, Float64Array.from(tx), Float64Array.from(rel))
  let min = worst?.clearanceFraction ?? Infinity
  if (worst) p.limitedAtM = worst.distanceM
  for (const o of bars) {
    for (const x of [o.fromM, (o.fromM + o.toM) / 2, o.toM]) {
      if (!(x > 0 && x < pathLengthM)) continue
      const c = lineOfSightClearance(path, x, interpolate(tx, rel, x) + o.topM)
      if (c.clearanceFraction < min) {
        min = c.clearanceFraction
        p.limitedBy = o.label
        p.limitedAtM = x
      }
    }
  }
  p.minClearanceFraction = Number.isFinite(min) ? min : 1
  p.meetsRule = p.minClearanceFraction >= REQUIRED_CLEARANCE_FRACTION
  return p
}
