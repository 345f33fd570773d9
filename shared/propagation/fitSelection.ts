import { requireFinite, requireInRange, requireNonNegative } from '../units/guards.js'

/** Which samples a log-distance fit may use; reported with every fit. */
export interface FitSelectionRule {
  /** Drop samples nearer than this ground-station distance, metres (near field, antenna nulls overhead). */
  minDistanceM: number
  /** Drop samples at or below the log's floor value (the receiver reports the floor when it hears nothing). */
  excludeAtFloor: boolean
  /** Floor value of the log in dBm, or null when the log has none. */
  floorDbm: number | null
  /** Drop samples that lie inside a detected dropout. */
  excludeInDropout: boolean
  /** Drop samples whose first-Fresnel-zone clearance fraction is below obstructedBelowFraction. */
  excludeObstructed: boolean
  /** Clearance fraction under which a sample counts as obstructed (common practice 0.6). */
  obstructedBelowFraction: number
}

/** Default rule: 10 m minimum distance, floor, dropouts and obstructed samples excluded. */
export const DEFAULT_FIT_SELECTION_RULE: Readonly<FitSelectionRule> = Object.freeze({
  minDistanceM: 10,
  excludeAtFloor: true,
  floorDbm: null,
  excludeInDropout: true,
  excludeObstructed: true,
  obstructedBelowFraction: 0.6,
})

/** Outcome of applying a selection rule: the mask and why samples were left out. */
export interface FitSelection {
  /** 1 where the sample is used, 0 where excluded. */
  include: Uint8Array
  includedCount: number
  /** Excluded counts by first matching reason, in this order. */
  excluded: { missing: number; tooClose: number; atFloor: number; inDropout: number; obstructed: number }
  rule: FitSelectionRule
}

/** Per-sample context the rule can consult. */
export interface FitSelectionContext {
  /** 1 where a sample lies inside a dropout. */
  inDropout?: Uint8Array
  /** First-Fresnel-zone clearance fraction per sample (Infinity when nothing is near the path). */
  clearanceFraction?: Float64Array | Float32Array
}

/**
 * Checks a selection rule's numbers, for callers that apply the rule inside their own pass.
 * @param rule selection rule
 * @throws RangeError when minDistanceM < 0, obstructedBelowFraction is not finite or floorDbm is not finite
 */
export function checkFitSelectionRule(rule: FitSelectionRule): void {
  requireNonNegative('rule.minDistanceM', rule.minDistanceM)
  requireInRange('rule.obstructedBelowFraction', rule.obstructedBelowFraction, -1e6, 1e6)
  if (rule.floorDbm !== null) requireFinite('rule.floorDbm', rule.floorDbm)
}

/**
 * Applies a fit selection rule to per-sample distances and received powers.
 * @param distanceM ground-station distances in metres (NaN = missing fix)
 * @param rxPowerDbm received power in dBm (NaN = missing)
 * @param rule selection rule; minDistanceM >= 0, obstructedBelowFraction finite
 * @param context optional dropout mask and clearance fractions, same length as distanceM
 * @returns include mask, count and exclusion counts by reason
 * @throws RangeError when lengths differ or the rule is out of range
 */
export function selectFitSamples(
  distanceM: Float64Array,
  rxPowerDbm: Float64Array | Float32Array,
  rule: FitSelectionRule = DEFAULT_FIT_SELECTION_RULE,
  context: FitSelectionContext = {},
): FitSelection {
  const len = distanceM.length
  if (rxPowerDbm.length !== len) throw new RangeError('rxPowerDbm must have the same length as distanceM')
  checkFitSelectionRule(rule)
  const { inDropout, clearanceFraction } = context
  if (inDropout && inDropout.length !== len) throw new RangeError('context.inDropout length must match')
  if (clearanceFraction && clearanceFraction.length !== len) {
    throw new RangeError('context.clearanceFraction length must match')
  }
  const include = new Uint8Array(len)
  const excluded = { missing: 0, tooClose: 0, atFloor: 0, inDropout: 0, obstructed: 0 }
  const floor = rule.excludeAtFloor && rule.floorDbm !== null ? rule.floorDbm : -Infinity
  const minD = Math.max(rule.minDistanceM, Number.MIN_VALUE)
  let count = 0
  for (let i = 0; i < len; i++) {
    const d = distanceM[i]!
    const p = rxPowerDbm[i]!
    if (!Number.isFinite(d) || !Number.isFinite(p)) excluded.missing++
    else if (d < minD) excluded.tooClose++
    else if (p <= floor) excluded.atFloor++
    else if (rule.excludeInDropout && inDropout && inDropout[i] !== 0) excluded.inDropout++
    else if (rule.excludeObstructed && clearanceFraction && clearanceFraction[i]! < rule.obstructedBelowFraction) {
      excluded.obstructed++
    } else {
      include[i] = 1
      count++
    }
  }
  return { include, includedCount: count, excluded, rule: { ...rule } }
}
