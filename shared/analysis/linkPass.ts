import { checkFitSelectionRule, type FitSelection, type FitSelectionRule } from '../propagation/fitSelection.js'
import { type LogDistanceSums } from '../propagation/logDistanceFit.js'
import { type FlightGeometry } from './geometryPass.js'

/** What one pass after dropout detection gathers: fit selection, fit sums and time/distance with link. */
export interface LinkPass {
  /** Counts of selectFitSamples for the same rule and context (the mask itself is not kept). */
  includedCount: number
  excluded: FitSelection['excluded']
  /** Sums of fitLogDistanceFromLog10 over the selected samples, in the same order (identical fit). */
  sums: LogDistanceSums
  /** Message fitLogDistanceFromLog10 would throw for the first selected sample with a non-finite value, else null. */
  invalid: string | null
  /** Time between consecutive samples outside dropouts, steps longer than maxGapMs left out, ms. */
  timeWithLinkMs: number
  /** Furthest ground distance outside dropouts with a received power, m (−Infinity when none). */
  maxDistanceWithLinkM: number
}

/**
 * One pass over the samples after dropout detection: applies the fit selection rule (as selectFitSamples with the
 * dropout mask and clearance fractions), accumulates the log-distance fit sums of the selected samples (as
 * fitLogDistanceFromLog10 over log10 slant range) and sums the time and furthest distance with link.
 * @param geo per-sample geometry (distance, log10 slant range, best power, clearance)
 * @param timeMs sample times, ms
 * @param inDropout 1 where a sample lies inside a dropout
 * @param rule fit selection rule (checked as selectFitSamples checks it)
 * @param maxGapMs steps longer than this do not count as time with link, ms
 * @returns counts, sums and link totals
 * @throws RangeError when the rule is out of range
 */
export function linkPass(
  geo: FlightGeometry,
  timeMs: Float64Array,
  inDropout: Uint8Array,
  rule: FitSelectionRule,
  maxGapMs: number,
): LinkPass {
  checkFitSelectionRule(rule)
  const { distanceM, rxBestDbm, log10SlantRangeM, clearanceFraction } = geo
  const len = distanceM.length
  const floor = rule.excludeAtFloor && rule.floorDbm !== null ? rule.floorDbm : -Infinity
  const minD = Math.max(rule.minDistanceM, Number.MIN_VALUE)
  const excludeInDropout = rule.excludeInDropout
  const excludeObstructed = rule.excludeObstructed
  const obstructedBelow = rule.obstructedBelowFraction
  let missing = 0
  let tooClose = 0
  let atFloor = 0
  let dropped = 0
  let obstructed = 0
  let included = 0
  let invalid: string | null = null
  let n = 0
  let x0 = NaN
  let y0 = NaN
  let sx = 0
  let sy = 0
  let sxxRaw = 0
  let sxyRaw = 0
  let syyRaw = 0
  let xMin = Infinity
  let xMax = -Infinity
  let timeWithLinkMs = 0
  let maxDistanceWithLinkM = -Infinity
  let prevOut = false
  for (let i = 0; i < len; i++) {
    const d = distanceM[i]!
    const p = rxBestDbm[i]!
    const out = inDropout[i] === 0
    if (out) {
      if (d > maxDistanceWithLinkM && p === p) maxDistanceWithLinkM = d
      if (prevOut) {
        const dt = timeMs[i]! - timeMs[i - 1]!
        if (dt <= maxGapMs) timeWithLinkMs += dt
      }
    }
    prevOut = out
    // selection reasons in selectFitSamples' order; v − v is 0 only for finite v
    if (d - d !== 0 || p - p !== 0) missing++
    else if (d < minD) tooClose++
    else if (p <= floor) atFloor++
    else if (excludeInDropout && !out) dropped++
    else if (excludeObstructed && clearanceFraction[i]! < obstructedBelow) obstructed++
    else {
      included++
      // after an invalid value the fit is off (it would have thrown there); only the counts go on
      if (invalid !== null) continue
      const x = log10SlantRangeM[i]!
      if (x - x !== 0) {
        invalid = `log10DistanceM[${i}] must be finite, got ${x}`
        continue
      }
      if (n === 0) (x0 = x), (y0 = p)
      const dx = x - x0
      const dy = p - y0
      sx += dx
      sy += dy
      sxxRaw += dx * dx
      sxyRaw += dx * dy
      syyRaw += dy * dy
      n++
      if (x < xMin) xMin = x
      if (x > xMax) xMax = x
    }
  }
  return {
    includedCount: included,
    excluded: { missing, tooClose, atFloor, inDropout: dropped, obstructed },
    sums: { n, x0, y0, sx, sy, sxxRaw, sxyRaw, syyRaw, xMin, xMax },
    invalid,
    timeWithLinkMs,
    maxDistanceWithLinkM,
  }
}
