import { requireInRange, requirePositive, requireNonNegative } from '../units/guards.js'
import { medianOf } from '../stats/median.js'
import { studentTQuantile } from '../stats/studentT.js'

/** One flight's samples for a matched-distance comparison. */
export interface DistanceSeries {
  /** Ground-station distance per sample, metres (NaN = missing). */
  distanceM: Float64Array
  /** Received power per sample, dBm (NaN = missing). */
  rxPowerDbm: Float64Array
  /** Optional mask: non-zero = use the sample (e.g. a fit selection). */
  include?: Uint8Array
}

/** Options of {@link matchedDistanceAdvantage}. */
export interface MatchedAdvantageOptions {
  /** Bin width, metres, > 0 (default 50). */
  binWidthM?: number
  /** Samples nearer than this are ignored, metres, >= 0 (default 0). */
  minDistanceM?: number
  /** Minimum samples per flight for a bin to count, >= 1 (default 5). */
  minSamplesPerBin?: number
  /** Two-sided confidence level, in (0, 1) (default 0.95). */
  confidenceLevel?: number
}

/** One shared distance bin. */
export interface AdvantageBin {
  startM: number
  endM: number
  medianADbm: number
  medianBDbm: number
  /** medianB − medianA, dB. */
  differenceDb: number
  countA: number
  countB: number
}

/** Advantage of flight B over flight A at matched distances. */
export interface MatchedAdvantage {
  /** Mean over shared bins of (median B − median A), dB; null without shared bins. */
  meanDifferenceDb: number | null
  /** Confidence bounds of the mean, dB; null with fewer than 2 shared bins. */
  lowerDb: number | null
  upperDb: number | null
  confidenceLevel: number
  binCount: number
  binWidthM: number
  bins: AdvantageBin[]
  /** Lag-1 autocorrelation of the per-bin differences used for the interval, in [0, 0.9]; null with fewer than 2 bins. */
  lag1Correlation?: number | null
  /** Bins worth of independent information behind the interval, m(1 − ρ)/(1 + ρ); null with fewer than 2 bins. */
  effectiveBinCount?: number | null
}

function binSeries(s: DistanceSeries, name: string, binWidthM: number, minDistanceM: number) {
  const len = s.distanceM.length
  if (s.rxPowerDbm.length !== len) throw new RangeError(`${name}.rxPowerDbm length must match distanceM`)
  if (s.include && s.include.length !== len) throw new RangeError(`${name}.include length must match`)
  // counting sort of samples into bins so each bin is one contiguous slice
  let maxBin = -1
  const binOf = new Int32Array(len)
  for (let i = 0; i < len; i++) {
    const d = s.distanceM[i]!
    const ok = Number.isFinite(d) && d >= minDistanceM && Number.isFinite(s.rxPowerDbm[i]!)
    const b = ok && (!s.include || s.include[i] !== 0) ? Math.floor(d / binWidthM) : -1
    binOf[i] = b
    if (b > maxBin) maxBin = b
  }
  const starts = new Int32Array(maxBin + 2)
  for (let i = 0; i < len; i++) if (binOf[i]! >= 0) starts[binOf[i]! + 1]!++
  for (let b = 0; b <= maxBin; b++) starts[b + 1]! += starts[b]!
  const fill = starts.slice(0, maxBin + 1)
  const values = new Float64Array(starts[maxBin + 1] ?? 0)
  for (let i = 0; i < len; i++) {
    const b = binOf[i]!
    if (b >= 0) values[fill[b]!++] = s.rxPowerDbm[i]!
  }
  return { starts, values, binCount: maxBin + 1 }
}

/**
 * Matched-distance advantage of flight B over flight A: per-bin medians, mean difference with a t confidence interval
 * that allows for shadowing shared by neighbouring bins (lag-1 autocorrelation, effective bin count).
 * @param a reference flight (distance in m, power in dBm)
 * @param b compared flight, same course
 * @param options binWidthM (> 0, default 50 m), minDistanceM (>= 0), minSamplesPerBin (>= 1, default 5), confidenceLevel (default 0.95)
 * @returns mean difference in dB with bounds and bin details; bounds null with fewer than 2 shared bins
 * @throws RangeError when lengths differ or an option is out of range
 */
export function matchedDistanceAdvantage(
  a: DistanceSeries,
  b: DistanceSeries,
  options: MatchedAdvantageOptions = {},
): MatchedAdvantage {
  const binWidthM = requirePositive('binWidthM', options.binWidthM ?? 50)
  const minDistanceM = requireNonNegative('minDistanceM', options.minDistanceM ?? 0)
  const minSamples = requireInRange('minSamplesPerBin', options.minSamplesPerBin ?? 5, 1, 1e9)
  const level = requireInRange('confidenceLevel', options.confidenceLevel ?? 0.95, 1e-9, 1 - 1e-9)
  const ba = binSeries(a, 'a', binWidthM, minDistanceM)
  const bb = binSeries(b, 'b', binWidthM, minDistanceM)
  const bins: AdvantageBin[] = []
  const shared = Math.min(ba.binCount, bb.binCount)
  for (let k = 0; k < shared; k++) {
    const a0 = ba.starts[k]!
    const a1 = ba.starts[k + 1]!
    const b0 = bb.starts[k]!
    const b1 = bb.starts[k + 1]!
    if (a1 - a0 < minSamples || b1 - b0 < minSamples) continue
    // the median resists the deep multipath fades that drag a mean down
    const medianADbm = medianOf(ba.values, a0, a1)
    const medianBDbm = medianOf(bb.values, b0, b1)
    bins.push({
      startM: k * binWidthM,
      endM: (k + 1) * binWidthM,
      medianADbm,
      medianBDbm,
      differenceDb: medianBDbm - medianADbm,
      countA: a1 - a0,
      countB: b1 - b0,
    })
  }
  const m = bins.length
  if (m === 0) {
    return { meanDifferenceDb: null, lowerDb: null, upperDb: null, confidenceLevel: level, binCount: 0, binWidthM, bins, lag1Correlation: null, effectiveBinCount: null }
  }
  let sum = 0
  for (const bin of bins) sum += bin.differenceDb
  const mean = sum / m
  if (m < 2) {
    return { meanDifferenceDb: mean, lowerDb: null, upperDb: null, confidenceLevel: level, binCount: 1, binWidthM, bins, lag1Correlation: null, effectiveBinCount: null }
  }
  const { halfWidthDb, lag1Correlation, effectiveBinCount } = correlatedMeanHalfWidth(bins, mean, level)
  const half = halfWidthDb
  return {
    meanDifferenceDb: mean,
    lowerDb: mean - half,
    upperDb: mean + half,
    confidenceLevel: level,
    binCount: m,
    binWidthM,
    bins,
    lag1Correlation,
    effectiveBinCount,
  }
}

/** Largest lag-1 correlation the interval allows for: beyond it n_eff would rest on a handful of bins. */
const MAX_LAG1_CORRELATION = 0.9

/**
 * Half-width of the mean's interval when neighbouring bins share shadowing: lag-1 autocorrelation ρ of the
 * differences (with the usual small-sample bias correction (1 + 4ρ)/m, Marriott & Pope 1954), clamped to [0, 0.9],
 * gives n_eff = m(1 − ρ)/(1 + ρ) and a t interval on n_eff − 1 degrees of freedom.
 */
function correlatedMeanHalfWidth(bins: readonly AdvantageBin[], mean: number, level: number) {
  const m = bins.length
  let ss = 0
  let lag = 0
  for (let k = 0; k < m; k++) {
    const dk = bins[k]!.differenceDb - mean
    ss += dk * dk
    // bins are in distance order; a skipped bin still counts as a neighbour: shadowing spans it
    if (k > 0) lag += dk * (bins[k - 1]!.differenceDb - mean)
  }
  const raw = ss > 0 ? lag / ss : 0
  const corrected = raw + (1 + 4 * raw) / m
  const rho = corrected > 0 ? (corrected < MAX_LAG1_CORRELATION ? corrected : MAX_LAG1_CORRELATION) : 0
  const nEff = (m * (1 - rho)) / (1 + rho)
  const df = Math.max(1, nEff - 1)
  // one-sample t interval (Student 1908) with the variance of the mean inflated by (1 + ρ)/(1 − ρ)
  const halfWidthDb = studentTQuantile(0.5 + level / 2, df) * Math.sqrt(ss / (m - 1) / nEff)
  return { halfWidthDb, lag1Correlation: rho, effectiveBinCount: nEff }
}
