import { type ClassifiedDropout, type DropoutCause } from '../dropouts/classify.js'
import { knifeEdgeLossDb } from '../fresnel/knifeEdge.js'
import { type FlightGeometry } from './geometryPass.js'
import { type FlightAnalysis } from './types.js'

const orNull = (v: number): number | null => (Number.isFinite(v) ? v : null)

/**
 * Distance range, height and slant extremes of a flight, from the accumulators of the per-sample pass.
 * @param geo per-sample geometry with its extremes
 * @returns extremes in metres, null when no sample has a fix
 * @throws never
 */
export function summariseDistances(geo: FlightGeometry): FlightAnalysis['distances'] {
  return {
    minDistanceM: orNull(geo.minDistanceM),
    maxDistanceM: orNull(geo.maxDistanceM),
    maxSlantRangeM: orNull(geo.maxSlantRangeM),
    maxHeightM: orNull(geo.maxHeightM),
  }
}

/**
 * Clearance statistics: worst fraction, share below the 60 % rule and which obstacles limit it.
 * @param geo per-sample geometry with its clearance accumulators
 * @param labels obstacle labels by index
 * @returns JSON-safe statistics
 * @throws never
 */
export function summariseClearance(geo: FlightGeometry, labels: readonly string[]): FlightAnalysis['clearance'] {
  const byLabel: Record<string, number> = {}
  let below = 0
  geo.belowRuleByCode.forEach((count, code) => {
    if (count === 0) return
    below += count
    // codes are offset by 3: 0 none, 1 terrain, 2 ground, 3.. obstacles
    const label = code === 2 ? 'ground' : code === 1 ? 'terrain' : (labels[code - 3] ?? 'unknown')
    byLabel[label] = (byLabel[label] ?? 0) + count
  })
  const min = geo.minClearanceFraction
  return {
    minFraction: orNull(min),
    samplesBelowRule: below,
    shareBelowRule: geo.clearanceSampleCount > 0 ? below / geo.clearanceSampleCount : null,
    belowRuleByObstacle: byLabel,
    // ITU-R P.526 J(ν) at the worst moment, ν = −√2·fraction
    worstKnifeEdgeLossDb: Number.isFinite(min) ? knifeEdgeLossDb(-Math.SQRT2 * min) : null,
  }
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
