import { type PreparedObstacles } from './obstacles.js'

/** Reusable output of {@link worstObstacleClearance} (mutated in place, no allocation per call). */
export interface ObstacleClearanceScratch {
  /** Smallest clearance / F1 found; +Infinity when no obstacle is beside the path. */
  fraction: number
  /** Owner index of the worst obstacle, −1 when none. */
  obstacleIndex: number
  /** Clearance at the worst obstacle, metres. */
  clearanceM: number
  /** F1 radius at the worst obstacle, metres. */
  f1RadiusM: number
  /** Horizontal distance of the worst obstacle from the station, metres. */
  distanceM: number
}

/**
 * Creates a scratch object for {@link worstObstacleClearance}.
 * @returns a scratch with no obstacle found
 * @throws never
 */
export function createClearanceScratch(): ObstacleClearanceScratch {
  return { fraction: Infinity, obstacleIndex: -1, clearanceM: Infinity, f1RadiusM: 0, distanceM: 0 }
}

/** Distance from point (px, py) to the segment from the origin to (ax, ay); len2 = ax² + ay² > 0. */
function distanceToPathM(px: number, py: number, ax: number, ay: number, len2: number): number {
  const dot = px * ax + py * ay
  if (dot <= 0) return Math.sqrt(px * px + py * py)
  if (dot >= len2) return Math.sqrt((px - ax) * (px - ax) + (py - ay) * (py - ay))
  return Math.abs(px * ay - py * ax) / Math.sqrt(len2)
}

/** Distance from the origin-to-(ax, ay) path's end points to the segment (x1, y1)–(x2, y2). */
function pathEndsToSegmentM(x1: number, y1: number, x2: number, y2: number, ax: number, ay: number): number {
  const ex = x2 - x1
  const ey = y2 - y1
  const e2 = ex * ex + ey * ey
  let best = Infinity
  for (let k = 0; k < 2; k++) {
    const qx = k === 0 ? 0 : ax
    const qy = k === 0 ? 0 : ay
    let t = e2 > 0 ? ((qx - x1) * ex + (qy - y1) * ey) / e2 : 0
    t = t < 0 ? 0 : t > 1 ? 1 : t
    const dx = qx - (x1 + t * ex)
    const dy = qy - (y1 + t * ey)
    const d = Math.sqrt(dx * dx + dy * dy)
    if (d < best) best = d
  }
  return best
}

/**
 * Exact clearance of one obstacle for one path, recorded into out; returns its slack: how far (m) the
 * obstacle body stays outside the widest F1 radius of the path (<= 0 when it may matter).
 */
function evaluateObstacle(
  prep: PreparedObstacles,
  o: number,
  ax: number,
  ay: number,
  len2: number,
  pathM: number,
  f1Max: number,
  hg: number,
  dh: number,
  lambda: number,
  twoKR: number,
  wantSlack: boolean,
  out: ObstacleClearanceScratch,
): number {
  const { segX1, segY1, segX2, segY2, segTopM, ptX, ptY, ptRadiusM, ptTopM } = prep
  let nearestM = Infinity
  // interval tests compare numerators with denominators, so a division happens only on a hit
  for (let s = prep.segStart[o]!, sEnd = prep.segEnd[o]!; s < sEnd; s++) {
    const x1 = segX1[s]!
    const y1 = segY1[s]!
    const ex = segX2[s]! - x1
    const ey = segY2[s]! - y1
    let denom = ax * ey - ay * ex
    let tNum = x1 * ey - y1 * ex
    let uNum = x1 * ay - y1 * ax
    if (denom < 0) (denom = -denom), (tNum = -tNum), (uNum = -uNum)
    // edge crossed by the ground track when t = tNum/denom is in (0, 1) and u = uNum/denom in [0, 1]
    if (tNum > 0 && tNum < denom && uNum >= 0 && uNum <= denom) {
      nearestM = 0
      const t = tNum / denom
      const d1 = t * pathM
      const d2 = pathM - d1
      // straight ray, parabolic bulge (ITU-R P.526 §4) and F1 radius (P.526 eq. 2)
      const c = hg + dh * t - segTopM[s]! - (d1 * d2) / twoKR
      const f1 = Math.sqrt((lambda * d1 * d2) / pathM)
      record(out, c / f1, o, c, f1, d1)
    } else if (wantSlack && nearestM > 0) {
      // non-crossing segments are nearest at an end point of one of the two (vertices are points below)
      const d = pathEndsToSegmentM(x1, y1, x1 + ex, y1 + ey, ax, ay)
      if (d < nearestM) nearestM = d
    }
  }
  // points and vertices beside the path: distance from the ray to the obstacle body
  for (let p = prep.ptStart[o]!, pEnd = prep.ptEnd[o]!; p < pEnd; p++) {
    const px = ptX[p]!
    const py = ptY[p]!
    const r = ptRadiusM[p]!
    if (wantSlack && nearestM > 0) {
      const d = distanceToPathM(px, py, ax, ay, len2) - r
      if (d < nearestM) nearestM = d
    }
    const dot = px * ax + py * ay
    if (!(dot > 0 && dot < len2)) continue
    const cross = Math.abs(px * ay - py * ax)
    // further aside than the widest F1 plus the footprint: cannot bring the fraction below 1
    if (cross >= (f1Max + r) * pathM) continue
    const gap = cross / pathM - r
    const t = dot / len2
    const d1 = t * pathM
    const d2 = pathM - d1
    const cv = hg + dh * t - ptTopM[p]! - (d1 * d2) / twoKR
    const c = gap <= 0 ? cv : cv >= 0 ? Math.sqrt(gap * gap + cv * cv) : gap
    const f1 = Math.sqrt((lambda * d1 * d2) / pathM)
    record(out, c / f1, o, c, f1, d1)
  }
  return nearestM - f1Max
}

function resetScratch(out: ObstacleClearanceScratch): void {
  out.fraction = Infinity
  out.obstacleIndex = -1
  out.clearanceM = Infinity
  out.f1RadiusM = 0
  out.distanceM = 0
}

/**
 * Worst first-Fresnel-zone clearance fraction of one station→aircraft path over prepared obstacles.
 * @param prep obstacles from {@link prepareObstacles}
 * @param aircraftEastM aircraft east of the station in metres, finite
 * @param aircraftNorthM aircraft north of the station in metres, finite
 * @param groundAntennaHeightM antenna height above datum in metres
 * @param aircraftHeightM aircraft height above datum in metres
 * @param wavelengthMetres carrier wavelength in metres, > 0
 * @param twoKEarthRadiusM 2·k·Re in metres (bulge denominator), > 0
 * @param out scratch written with the worst obstacle
 * @returns the worst fraction (also in out.fraction); exact below 1, +Infinity when no obstacle comes within one F1 radius
 * @throws never (the caller validates once per flight)
 */
export function worstObstacleClearance(
  prep: PreparedObstacles,
  aircraftEastM: number,
  aircraftNorthM: number,
  groundAntennaHeightM: number,
  aircraftHeightM: number,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
  out: ObstacleClearanceScratch,
): number {
  resetScratch(out)
  const ax = aircraftEastM
  const ay = aircraftNorthM
  const len2 = ax * ax + ay * ay
  if (!(len2 > 0)) return Infinity
  const pathM = Math.sqrt(len2)
  // F1 is largest at mid-path, ½√(λD): an obstacle further than that from the ground track cannot
  // bring the fraction below 1, so its edges and vertices are skipped
  const f1Max = 0.5 * Math.sqrt(wavelengthMetres * pathM)
  const dh = aircraftHeightM - groundAntennaHeightM
  for (let o = 0; o < prep.circleR.length; o++) {
    const reach = f1Max + prep.circleR[o]!
    if (distanceToPathM(prep.circleX[o]!, prep.circleY[o]!, ax, ay, len2) >= reach) continue
    evaluateObstacle(prep, o, ax, ay, len2, pathM, f1Max, groundAntennaHeightM, dh, wavelengthMetres, twoKEarthRadiusM, false, out)
  }
  return out.fraction
}

/** Per-flight state that lets consecutive paths skip obstacles they cannot reach. */
export interface ObstacleTracker {
  prep: PreparedObstacles
  /** Per obstacle: slack (m) when last evaluated, track movement then, and F1 bound then. */
  slackM: Float64Array
  movedAtM: Float64Array
  f1MaxAtM: Float64Array
  /** Per obstacle: slack + movement + F1 bound when last evaluated; due again once movement + F1 bound reach it. */
  dueM: Float64Array
  /** Smallest dueM: below it no obstacle is due and the path needs no work. */
  nextDueM: number
  /** Cumulative L1 movement of the aircraft over the flight so far, m. */
  movedM: number
  lastEastM: number
  lastNorthM: number
}

/**
 * Creates the per-flight state for {@link trackedObstacleClearance}.
 * @param prep obstacles from {@link prepareObstacles}
 * @returns a tracker with every obstacle due for evaluation
 * @throws never
 */
export function createObstacleTracker(prep: PreparedObstacles): ObstacleTracker {
  const n = prep.circleR.length
  return {
    prep,
    slackM: new Float64Array(n).fill(-Infinity),
    movedAtM: new Float64Array(n),
    f1MaxAtM: new Float64Array(n),
    dueM: new Float64Array(n).fill(-Infinity),
    nextDueM: -Infinity,
    movedM: 0,
    lastEastM: NaN,
    lastNorthM: NaN,
  }
}

/**
 * Same result as {@link worstObstacleClearance} for a sequence of paths (one flight, in order), faster:
 * the distance from a path to an obstacle changes by at most the aircraft's movement, so an obstacle
 * known to lie s metres outside the widest F1 is skipped until the aircraft has moved s metres
 * (less any growth of F1).
 * @param tracker state from {@link createObstacleTracker}, used for one flight only
 * @param aircraftEastM aircraft east of the station in metres, finite
 * @param aircraftNorthM aircraft north of the station in metres, finite
 * @param groundAntennaHeightM antenna height above datum in metres
 * @param aircraftHeightM aircraft height above datum in metres
 * @param wavelengthMetres carrier wavelength in metres, > 0
 * @param twoKEarthRadiusM 2·k·Re in metres, > 0
 * @param out scratch written with the worst obstacle
 * @param pathLengthM √(east² + north²) when the caller already has it (default: computed here)
 * @returns the worst fraction; exact below 1, +Infinity when no obstacle comes within one F1 radius
 * @throws never (the caller validates once per flight)
 */
export function trackedObstacleClearance(
  tracker: ObstacleTracker,
  aircraftEastM: number,
  aircraftNorthM: number,
  groundAntennaHeightM: number,
  aircraftHeightM: number,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
  out: ObstacleClearanceScratch,
  pathLengthM = NaN,
): number {
  resetScratch(out)
  const ax = aircraftEastM
  const ay = aircraftNorthM
  // L1 movement bounds the Euclidean one, so the skip stays conservative
  const lx = tracker.lastEastM
  if (lx === lx) tracker.movedM += Math.abs(ax - lx) + Math.abs(ay - tracker.lastNorthM)
  tracker.lastEastM = ax
  tracker.lastNorthM = ay
  const len2 = ax * ax + ay * ay
  if (!(len2 > 0)) return Infinity
  const pathM = pathLengthM === pathLengthM ? pathLengthM : Math.sqrt(len2)
  const f1Max = 0.5 * Math.sqrt(wavelengthMetres * pathM)
  const moved = tracker.movedM
  // slack − (moved − movedAt) − (f1Max − f1MaxAt) > 0 for every obstacle, as one comparison with the soonest due
  const level = moved + f1Max
  if (level < tracker.nextDueM) return Infinity
  // the rare work lives in its own function so this front stays small enough to inline into callers' loops
  return evaluateDueObstacles(tracker, ax, ay, len2, pathM, f1Max, level, groundAntennaHeightM, aircraftHeightM, wavelengthMetres, twoKEarthRadiusM, out)
}

function evaluateDueObstacles(
  tracker: ObstacleTracker,
  ax: number,
  ay: number,
  len2: number,
  pathM: number,
  f1Max: number,
  level: number,
  groundAntennaHeightM: number,
  aircraftHeightM: number,
  wavelengthMetres: number,
  twoKEarthRadiusM: number,
  out: ObstacleClearanceScratch,
): number {
  const moved = tracker.movedM
  const { prep, slackM, movedAtM, f1MaxAtM, dueM } = tracker
  const dh = aircraftHeightM - groundAntennaHeightM
  let nextDue = Infinity
  for (let o = 0; o < slackM.length; o++) {
    if (level < dueM[o]!) {
      if (dueM[o]! < nextDue) nextDue = dueM[o]!
      continue
    }
    const slack = evaluateObstacle(prep, o, ax, ay, len2, pathM, f1Max, groundAntennaHeightM, dh, wavelengthMetres, twoKEarthRadiusM, true, out)
    slackM[o] = slack
    movedAtM[o] = moved
    f1MaxAtM[o] = f1Max
    const due = slack + level
    dueM[o] = due
    if (due < nextDue) nextDue = due
  }
  tracker.nextDueM = nextDue
  return out.fraction
}
function record(out: ObstacleClearanceScratch, f: number, o: number, c: number, f1: number, d1: number): void {
  if (f < out.fraction) {
    out.fraction = f
    out.obstacleIndex = o
    out.clearanceM = c
    out.f1RadiusM = f1
    out.distanceM = d1
  }
}
