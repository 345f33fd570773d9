import { matchedDistanceAdvantage, type MatchedAdvantage } from '../propagation/matchedAdvantage.js'
import { requireInRange, requirePositive } from '../units/guards.js'

/** One flight's samples for a comparison: distance and best-antenna signal. */
export interface ComparedSeries {
  /** Ground distance from the station, m (NaN = no fix). */
  distanceM: Float64Array
  /** Best-antenna signal, dBm (NaN = not logged). */
  rxDbm: Float64Array
  /** The log's no-signal value, dBm, or null. */
  floorDbm: number | null
  sensitivityDbm: number
}

/** Options of {@link censoredMatchedAdvantage}. */
export interface CensoredAdvantageOptions {
  /** Bin width, m (default 50). */
  binWidthM?: number
  /** Samples nearer than this are ignored, m (default 30: near field and overhead nulls). */
  minDistanceM?: number
  /** A bin counts only when at most this share of either flight's samples is unheard, [0, 1] (default 0.1). */
  maxUnheardShare?: number
  /** Minimum heard samples per flight per bin (default 5). */
  minSamplesPerBin?: number
}

/** The matched advantage plus how many bins the censoring guard left out. */
export interface CensoredAdvantage extends MatchedAdvantage {
  censoredBinCount: number
}

function unheard(s: ComparedSeries, i: number): boolean {
  const v = s.rxDbm[i]!
  if (!Number.isFinite(v)) return true
  return (s.floorDbm !== null && v <= s.floorDbm) || v < s.sensitivityDbm
}

function binCounts(s: ComparedSeries, binWidthM: number, minDistanceM: number, bins: number) {
  const total = new Int32Array(bins)
  const lost = new Int32Array(bins)
  for (let i = 0; i < s.distanceM.length; i++) {
    const d = s.distanceM[i]!
    if (!Number.isFinite(d) || d < minDistanceM) continue
    const b = Math.floor(d / binWidthM)
    if (b >= bins) continue
    total[b]!++
    if (unheard(s, i)) lost[b]!++
  }
  return { total, lost }
}

function maxDistance(s: ComparedSeries): number {
  let m = 0
  for (const d of s.distanceM) if (Number.isFinite(d) && d > m) m = d
  return m
}

/**
 * Matched-distance advantage of `other` over `base` that leaves out distance bins where either flight lost the
 * link often: a median over only the heard samples of such a bin would be biased upward (censoring), and the
 * advantage with it. Uses the core's per-bin medians and t interval.
 * @param base baseline flight (m, dBm)
 * @param other compared flight, same course
 * @param options bin width (m), minimum distance (m), unheard share [0, 1], minimum samples per bin
 * @returns the advantage (dB, with 95 % interval and bins) and the number of censored bins
 * @throws RangeError when an option is out of range or lengths differ
 */
export function censoredMatchedAdvantage(
  base: ComparedSeries,
  other: ComparedSeries,
  options: CensoredAdvantageOptions = {},
): CensoredAdvantage {
  const binWidthM = requirePositive('binWidthM', options.binWidthM ?? 50)
  const minDistanceM = requireInRange('minDistanceM', options.minDistanceM ?? 30, 0, 1e7)
  const maxShare = requireInRange('maxUnheardShare', options.maxUnheardShare ?? 0.1, 0, 1)
  const bins = Math.floor(Math.max(maxDistance(base), maxDistance(other)) / binWidthM) + 1
  const a = binCounts(base, binWidthM, minDistanceM, bins)
  const b = binCounts(other, binWidthM, minDistanceM, bins)
  const usable = new Uint8Array(bins)
  let censored = 0
  for (let k = 0; k < bins; k++) {
    if (a.total[k]! === 0 || b.total[k]! === 0) continue
    const ok = a.lost[k]! <= maxShare * a.total[k]! && b.lost[k]! <= maxShare * b.total[k]!
    usable[k] = ok ? 1 : 0
    if (!ok) censored++
  }
  const mask = (s: ComparedSeries) => {
    const inc = new Uint8Array(s.distanceM.length)
    for (let i = 0; i < inc.length; i++) {
      const d = s.distanceM[i]!
      if (!Number.isFinite(d) || d < minDistanceM || unheard(s, i)) continue
      const k = Math.floor(d / binWidthM)
      if (k < bins && usable[k] === 1) inc[i] = 1
    }
    return inc
  }
  const result = matchedDistanceAdvantage(
    { distanceM: base.distanceM, rxPowerDbm: base.rxDbm, include: mask(base) },
    { distanceM: other.distanceM, rxPowerDbm: other.rxDbm, include: mask(other) },
    { binWidthM, minDistanceM, minSamplesPerBin: options.minSamplesPerBin ?? 5 },
  )
  return { ...result, censoredBinCount: censored }
}
