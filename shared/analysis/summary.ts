import { type ClassifiedDropout, type DropoutCause } from '../dropouts/classify.js'
import { REQUIRED_CLEARANCE_FRACTION } from '../fresnel/zone.js'
import { knifeEdgeLossDb } from '../fresnel/knifeEdge.js'
import { LIMITING_GROUND, LIMITING_TERRAIN } from './clearancePass.js'
import { type FlightGeometry } from './geometryPass.js'
import { type FlightAnalysis } from './types.js'

const orNull = (v: number): number | null => (Number.isFinite(v) ? v : null)

/**
 * Distance range, height and slant extremes of a flight.
 * @param geo per-sample geometry
 * @returns extremes in metres, null when no sample has a fix
 * @throws never
 */
export function summariseDistances(geo: FlightGeometry): FlightAnalysis['distances'] {
  let minD = Infinity
  let maxD = -Infinity
  let maxS = -Infinity
  let maxH = -Infinity
  for (let i = 0; i < geo.distanceM.length; i++) {
    const d = geo.distanceM[i]!
    if (d !== d) continue
    if (d < minD) minD = d
    if (d > maxD) maxD = d
    const s = geo.slantRangeM[i]!
    if (s > maxS) maxS = s
    const h = geo.heightM[i]!
    if (h > maxH) maxH = h
  }
  return { minDistanceM: orNull(minD), maxDistanceM: orNull(maxD), maxSlantRangeM: orNull(maxS), maxHeightM: orNull(maxH) }
}

/**
 * Clearance statistics: worst fraction, share below the 60 % rule and which obstacles limit it.
 * @param clr per-sample clearance fractions and limiting codes
 * @param labels obstacle labels by index
 * @returns JSON-safe statistics
 * @throws never
 */
export function summariseClearance(
  clr: Pick<FlightGeometry, 'clearanceFraction' | 'limitingObstacle'>,
  labels: readonly string[]): FlightAnalysis['clearance'] {
  let min = Infinity
  let below = 0
  let valid = 0
  const byLabel: Record<string, number> = {}
  for (let i = 0; i < clr.clearanceFraction.length; i++) {
    const f = clr.clearanceFraction[i]!
    if (f !== f) continue
    valid++
    if (f < min) min = f
    if (f < REQUIRED_CLEARANCE_FRACTION) {
      below++
      const code = clr.limitingObstacle[i]!
      const label = code === LIMITING_GROUND ? 'ground' : code === LIMITING_TERRAIN ? 'terrain' : (labels[code] ?? 'unknown')
      byLabel[label] = (byLabel[label] ?? 0) + 1
    }
  }
  return {
    minFraction: orNull(min),
    samplesBelowRule: below,
    shareBelowRule: valid > 0 ? below / valid : null,
    belowRuleByObstacle: byLabel,
    // ITU-R P.526 J(ν) at the worst moment, ν = −√2·fraction
    worstKnifeEdgeLossDb: Number.isFinite(min) ? knifeEdgeLossDb(-Math.SQRT2 * min) : null,
  }
}

/**
 * Time with link and furthest distance with link held.
 * @param timeMs sample times, ms
 * @param geo per-sample geometry
 * @param inDropout dropout membership per sample
 * @param maxGapMs steps longer than this do not count as time with link, ms
 * @returns time with link (ms) and furthest ground distance with link (m, null when never held)
 * @throws never
 */
export function summariseLink(
  timeMs: Float64Array,
  geo: FlightGeometry,
  inDropout: Uint8Array,
  maxGapMs: number,
): { timeWithLinkMs: number; maxDistanceWithLinkM: number | null } {
  let withLink = 0
  let maxD = -Infinity
  for (let i = 0; i < timeMs.length; i++) {
    const d = geo.distanceM[i]!
    if (inDropout[i] === 0 && d > maxD && geo.rxBestDbm[i]! === geo.rxBestDbm[i]!) maxD = d
    if (i > 0 && inDropout[i] === 0 && inDropout[i - 1] === 0) {
      const dt = timeMs[i]! - timeMs[i - 1]!
      if (dt <= maxGapMs) withLink += dt
    }
  }
  return { timeWithLinkMs: withLink, maxDistanceWithLinkM: orNull(maxD) }
}

/**
 * Counts dropouts per primary cause.
 * @param dropouts classified dropouts
 * @returns a count for every cause (0 when absent)
 * @throws never
 */
export function countByCause(dropouts: readonly ClassifiedDropout[]): Record<DropoutCause, number> {
  const out: Record<DropoutCause, number> = { obstruction: 0, beam: 0, range: 0, reflection: 0, gap: 0, unexplained: 0 }
  for (const d of dropouts) out[d.cause]++
  return out
}
