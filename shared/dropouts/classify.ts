import { requireFinite, requireNonNegative, requirePositive } from '../units/guards.js'
import { REQUIRED_CLEARANCE_FRACTION } from '../fresnel/zone.js'
import { nearestTwoRayNullM, twoRayPathDifferenceM } from '../propagation/twoRay.js'
import { type DetectedDropout } from './detect.js'

/** Probable cause of a dropout. */
export type DropoutCause = 'obstruction' | 'beam' | 'range' | 'reflection' | 'gap' | 'unexplained'

/** Order in which causes are preferred when several match. */
export const DROPOUT_CAUSE_ORDER: readonly DropoutCause[] = [
  'obstruction',
  'beam',
  'range',
  'reflection',
  'gap',
  'unexplained',
]

/** Per-sample context for classification (all arrays of the flight's length). */
export interface DropoutContext {
  timeMs: Float64Array
  /** Best-antenna received power, dBm (NaN = missing). */
  rxPowerDbm: Float64Array | Float32Array
  /** Ground distance from the station, m. */
  distanceM: Float64Array
  /** Logged altitude, m; height above the station ground is altitudeM − altitudeOffsetM. */
  altitudeM: Float64Array
  /** Station ground elevation for AMSL logs, 0 for AGL logs, m. */
  altitudeOffsetM: number
  /** Worst F1 clearance fraction (ground, terrain, obstacles). */
  clearanceFraction: Float64Array | Float32Array
  /** Index of the limiting obstacle (−1 ground, −2 terrain, >= 0 into obstacleLabels). */
  limitingObstacle: Int32Array | Int16Array
  obstacleLabels: readonly string[]
  /** Gain lost to antenna pointing against the best boresight gain, dB (>= 0): per sample, or computed on demand. */
  pointingLossDb: Float64Array | Float32Array | ((index: number) => number)
  /** Model-predicted margin above sensitivity, dB: per sample, or computed on demand for a sample index. */
  predictedMarginDb: Float64Array | Float32Array | ((index: number) => number)
  /** Ground antenna height above its ground, m. */
  antennaHeightM: number
  wavelengthM: number
  sensitivityDbm: number
}

/** Thresholds of the classification rules. */
export interface DropoutClassificationOptions {
  /** Margin the model must predict for the link to count as in range, dB (>= 0). */
  fadeMarginDb: number
  /** Clearance fraction under which the path counts as obstructed (default 0.6, common practice). */
  clearanceRuleFraction?: number
  /** Pointing loss from which the aircraft counts as outside the beam, dB (default 3, the half-power edge). */
  beamEdgeLossDb?: number
  /** Look-back window for a sudden fade, ms (default 2000). */
  suddenWindowMs?: number
  /** Two-ray nulls up to this index are checked, k >= 1 (default 3: the outermost, widest fades). */
  maxNullIndex?: number
}

/** Numbers behind a classification, for display on hover. */
export interface DropoutEvidence {
  distanceM: number
  heightM: number
  minClearanceFraction: number | null
  limitingObstacle: string | null
  maxPointingLossDb: number
  predictedMarginDb: number | null
  signalBeforeDbm: number | null
  suddenFade: boolean
  nearestNullM: number | null
  nearNull: boolean
}

/** A dropout with its probable cause and evidence. */
export interface ClassifiedDropout extends DetectedDropout {
  cause: DropoutCause
  /** Every rule that matched, in preference order. */
  causes: DropoutCause[]
  evidence: DropoutEvidence
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null)

function nullIndexAt(distanceM: number, heightM: number, ctx: DropoutContext): number {
  const delta = twoRayPathDifferenceM(distanceM, ctx.antennaHeightM, heightM)
  return Math.max(1, Math.round(delta / ctx.wavelengthM))
}

/**
 * Classifies a dropout by the first matching rule: obstruction (F1 clearance < 60 %), beam (pointing loss >= 3 dB),
 * range (model margin < fade margin), reflection (sudden fade or two-ray null while in range), gap, unexplained.
 * A gap-only event (no weak signal or link quality inside it) is a `gap` first; rules that also match stay in `causes`.
 * @param event detected dropout with sample indices into ctx arrays
 * @param ctx per-sample context of the flight
 * @param options fadeMarginDb >= 0 and optional thresholds
 * @returns the event with cause, all matching causes and evidence
 * @throws RangeError when the event indices or options are out of range
 */
export function classifyDropout(
  event: DetectedDropout,
  ctx: DropoutContext,
  options: DropoutClassificationOptions,
): ClassifiedDropout {
  const fadeMargin = requireNonNegative('fadeMarginDb', options.fadeMarginDb)
  const ruleFraction = requireFinite('clearanceRuleFraction', options.clearanceRuleFraction ?? REQUIRED_CLEARANCE_FRACTION)
  const beamEdge = requireNonNegative('beamEdgeLossDb', options.beamEdgeLossDb ?? 3)
  const window = requirePositive('suddenWindowMs', options.suddenWindowMs ?? 2000)
  const maxK = requirePositive('maxNullIndex', options.maxNullIndex ?? 3)
  const len = ctx.timeMs.length
  const { startIndex: i0, endIndex: i1 } = event
  if (!(Number.isInteger(i0) && Number.isInteger(i1) && 0 <= i0 && i0 <= i1 && i1 < len)) {
    throw new RangeError(`event indices must satisfy 0 <= startIndex <= endIndex < ${len}`)
  }
  // the onset sample carries the geometry at the moment the link went
  const onset = i0
  let minClear = Infinity
  let limiting = -3
  let maxPointing = 0
  const pointing = ctx.pointingLossDb
  for (let i = i0; i <= i1; i++) {
    const c = ctx.clearanceFraction[i]!
    if (c < minClear) (minClear = c), (limiting = ctx.limitingObstacle[i]!)
    const p = typeof pointing === 'function' ? pointing(i) : pointing[i]!
    if (p > maxPointing) maxPointing = p
  }
  const predicted = ctx.predictedMarginDb
  const margin = typeof predicted === 'function' ? predicted(onset) : predicted[onset]!
  // strongest signal in the look-back window, to tell a sudden fade from a slow decay
  let before = -Infinity
  const tOnset = ctx.timeMs[onset]!
  for (let i = onset - 1; i >= 0 && tOnset - ctx.timeMs[i]! <= window; i--) {
    const p = ctx.rxPowerDbm[i]!
    if (p > before) before = p
  }
  if (event.fromGap && !event.fromSignal && !event.fromLinkQuality) before = -Infinity
  const suddenFade = before >= ctx.sensitivityDbm + fadeMargin
  const d = ctx.distanceM[onset]!
  const h = ctx.altitudeM[onset]! - ctx.altitudeOffsetM
  let nearestNull: number | null = null
  let nearNull = false
  if (d > 0 && h > 0 && ctx.antennaHeightM > 0) {
    nearestNull = nearestTwoRayNullM(d, ctx.wavelengthM, ctx.antennaHeightM, h)
    if (nearestNull !== null) {
      const k = nullIndexAt(nearestNull, h, ctx)
      // within a quarter of the spacing to the next null, d_k/(k+1) (two-ray far-field spacing)
      nearNull = k <= maxK && Math.abs(d - nearestNull) <= (0.25 * nearestNull) / (k + 1)
    }
  }
  const causes: DropoutCause[] = []
  if (minClear < ruleFraction) causes.push('obstruction')
  if (maxPointing >= beamEdge) causes.push('beam')
  const inRange = Number.isFinite(margin) && margin >= fadeMargin
  if (Number.isFinite(margin) && !inRange) causes.push('range')
  const gapOnly = event.fromGap && !event.fromSignal && !event.fromLinkQuality
  if (inRange && !gapOnly && (suddenFade || nearNull)) causes.push('reflection')
  // missing telemetry is the fact of a gap-only event; geometry at its edges only says what may have contributed
  if (gapOnly) causes.unshift('gap')
  else if (event.fromGap) causes.push('gap')
  if (causes.length === 0) causes.push('unexplained')
  const label =
    limiting >= 0 ? (ctx.obstacleLabels[limiting] ?? null) : limiting === -1 ? 'ground' : limiting === -2 ? 'terrain' : null
  return {
    ...event,
    cause: causes[0]!,
    causes,
    evidence: {
      distanceM: d,
      heightM: h,
      minClearanceFraction: finiteOrNull(minClear),
      limitingObstacle: Number.isFinite(minClear) ? label : null,
      maxPointingLossDb: maxPointing,
      predictedMarginDb: finiteOrNull(margin),
      signalBeforeDbm: finiteOrNull(before),
      suddenFade,
      nearestNullM: nearestNull,
      nearNull,
    },
  }
}
