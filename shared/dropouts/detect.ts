import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../units/guards.js'
import { medianOf } from '../stats/median.js'

/** Thresholds and timing for dropout detection. */
export interface DropoutDetectionOptions {
  /** Receiver sensitivity, dBm: samples below it count as lost. */
  sensitivityDbm: number
  /** Floor value the log writes when nothing is heard, dBm, or null. */
  floorDbm: number | null
  /** Link quality below this share counts as lost, percent in [0, 100] (default 50). */
  minLinkQualityPct?: number
  /** A time step longer than this is a telemetry gap, ms; when absent it is derived from the log (see gapThresholdMs). */
  maxGapMs?: number
  /** Derived threshold: this many typical frame intervals (median step), > 0 (default 5). */
  gapStepFactor?: number
  /** Derived threshold never falls below this, ms, > 0 (default 1000). */
  minGapMs?: number
  /** Events shorter than this are dropped after merging, ms (default 0). */
  minDurationMs?: number
  /** Events closer than this are merged, ms (default 1000). */
  mergeWithinMs?: number
}

/** One detected loss of link, before classification. */
export interface DetectedDropout {
  /** First sample index of the event (for a gap: the last sample before it). */
  startIndex: number
  /** Last sample index of the event, inclusive (for a gap: the first sample after it). */
  endIndex: number
  /** Event start and end, ms on the log's clock. */
  startMs: number
  endMs: number
  durationMs: number
  /** Which detectors fired inside the event. */
  fromSignal: boolean
  fromLinkQuality: boolean
  fromGap: boolean
}

/** Detected events and a per-sample membership mask. */
export interface DropoutDetection {
  events: DetectedDropout[]
  /** 1 where a sample lies inside an event. */
  inDropout: Uint8Array
  /** Time step above which a gap was reported, ms (see gapThresholdMs). */
  gapThresholdMs: number
}

/** Steps looked at for the typical frame interval: enough for a stable median, bounded for million-row logs. */
const STEP_PROBES = 4097

/**
 * Typical frame interval of a log: the median of up to 4097 evenly spread time steps (NaN with fewer than 2 samples).
 * @param timeMs sample times, ms, non-decreasing
 * @returns median step, ms
 */
export function typicalStepMs(timeMs: Float64Array): number {
  const steps = timeMs.length - 1
  if (steps < 1) return NaN
  const probes = Math.min(steps, STEP_PROBES)
  const stride = steps / probes
  const dt = new Float64Array(probes)
  for (let k = 0; k < probes; k++) {
    const i = Math.floor(k * stride) + 1
    dt[k] = timeMs[i]! - timeMs[i - 1]!
  }
  try {
    return medianOf(dt)
  } catch {
    return NaN
  }
}

/**
 * Time step above which a log counts as having a telemetry gap: options.maxGapMs when given, else
 * max(minGapMs, gapStepFactor × typical step), so a 1 Hz log is not all gaps and a 50 Hz log's 2 s hole is one.
 * @param timeMs sample times, ms, non-decreasing
 * @param options maxGapMs > 0 (fixed), or gapStepFactor > 0 (default 5) and minGapMs > 0 (default 1000)
 * @returns threshold, ms
 * @throws RangeError when an option is out of range
 */
export function gapThresholdMs(
  timeMs: Float64Array,
  options: Pick<DropoutDetectionOptions, 'maxGapMs' | 'gapStepFactor' | 'minGapMs'> = {},
): number {
  if (options.maxGapMs !== undefined) return requirePositive('maxGapMs', options.maxGapMs)
  const factor = requirePositive('gapStepFactor', options.gapStepFactor ?? 5)
  const floor = requirePositive('minGapMs', options.minGapMs ?? 1000)
  const step = typicalStepMs(timeMs)
  return step === step && factor * step > floor ? factor * step : floor
}

/**
 * Finds link dropouts from weak signal, low link quality and telemetry gaps; merges close events and drops short ones.
 * @param timeMs sample times in ms, finite and non-decreasing
 * @param rxPowerDbm received power per sample in dBm (best antenna); NaN means not logged and is not a loss by itself
 * @param linkQualityPct link quality per sample in percent, or undefined; NaN entries are ignored
 * @param options sensitivity/floor in dBm, minLinkQualityPct [0, 100], gap threshold (gapThresholdMs), minDurationMs >= 0, mergeWithinMs >= 0
 * @returns events in time order and the membership mask
 * @throws RangeError when lengths differ, times go backwards or an option is out of range
 */
export function detectDropouts(
  timeMs: Float64Array,
  rxPowerDbm: Float64Array | Float32Array,
  linkQualityPct: Float64Array | undefined,
  options: DropoutDetectionOptions,
): DropoutDetection {
  const len = timeMs.length
  if (rxPowerDbm.length !== len) throw new RangeError('rxPowerDbm must have the same length as timeMs')
  if (linkQualityPct && linkQualityPct.length !== len) {
    throw new RangeError('linkQualityPct must have the same length as timeMs')
  }
  const sens = requireFinite('sensitivityDbm', options.sensitivityDbm)
  const floor = options.floorDbm === null ? -Infinity : requireFinite('floorDbm', options.floorDbm)
  const minLq = requireInRange('minLinkQualityPct', options.minLinkQualityPct ?? 50, 0, 100)
  const maxGap = gapThresholdMs(timeMs, options)
  const minDur = requireNonNegative('minDurationMs', options.minDurationMs ?? 0)
  const mergeWithin = requireNonNegative('mergeWithinMs', options.mergeWithinMs ?? 1000)
  const raw: DetectedDropout[] = []
  const lq = linkQualityPct ?? null
  // the open run of lost samples lives in locals; an object is made only when it closes
  let runStart = -1
  let runEnd = -1
  let runSignal = false
  let runLq = false
  let prev = -Infinity
  for (let i = 0; i < len; i++) {
    const t = timeMs[i]!
    // one test for NaN, ±Infinity and time going backwards (t − t is 0 only for finite t)
    if (!(t >= prev && t - t === 0)) {
      throw new RangeError(`timeMs must be finite and non-decreasing, got timeMs[${i}] = ${t}`)
    }
    if (t - prev > maxGap && i > 0) raw.push(event(i - 1, i, prev, t, false, false, true))
    prev = t
    const p = rxPowerDbm[i]!
    const weak = p < sens || p <= floor
    const poorLq = lq !== null && lq[i]! < minLq
    if (weak || poorLq) {
      if (runStart < 0) runStart = i
      runEnd = i
      if (weak) runSignal = true
      if (poorLq) runLq = true
    } else if (runStart >= 0) {
      // the link is back at this sample: the event lasted until now
      raw.push(event(runStart, runEnd, timeMs[runStart]!, t, runSignal, runLq, false))
      runStart = -1
      runSignal = runLq = false
    }
  }
  if (runStart >= 0) raw.push(event(runStart, runEnd, timeMs[runStart]!, timeMs[runEnd]!, runSignal, runLq, false))
  raw.sort((a, b) => a.startMs - b.startMs || a.startIndex - b.startIndex)
  const events: DetectedDropout[] = []
  for (const e of raw) {
    const last = events[events.length - 1]
    if (last && e.startMs - last.endMs <= mergeWithin) {
      last.endIndex = Math.max(last.endIndex, e.endIndex)
      last.endMs = Math.max(last.endMs, e.endMs)
      last.fromSignal ||= e.fromSignal
      last.fromLinkQuality ||= e.fromLinkQuality
      last.fromGap ||= e.fromGap
    } else events.push({ ...e })
  }
  const kept: DetectedDropout[] = []
  const inDropout = new Uint8Array(len)
  for (const e of events) {
    e.durationMs = e.endMs - e.startMs
    if (e.durationMs < minDur) continue
    kept.push(e)
    inDropout.fill(1, e.startIndex, e.endIndex + 1)
  }
  return { events: kept, inDropout, gapThresholdMs: maxGap }
}

/**
 * Count and total time of signal-only dropouts, without building events: what detectDropouts reports for the same
 * series with no link quality and no gap detection, for the per-antenna figures of diversity logs.
 * @param timeMs sample times in ms, finite and non-decreasing (checked by the caller's detectDropouts pass)
 * @param rxPowerDbm received power per sample in dBm; NaN is not a loss by itself
 * @param options sensitivity/floor in dBm, minDurationMs >= 0, mergeWithinMs >= 0 (link quality and gaps ignored)
 * @returns number of events and their summed duration, ms
 * @throws RangeError when lengths differ or an option is out of range
 */
export function signalDropoutTotals(
  timeMs: Float64Array,
  rxPowerDbm: Float64Array | Float32Array,
  options: Pick<DropoutDetectionOptions, 'sensitivityDbm' | 'floorDbm' | 'minDurationMs' | 'mergeWithinMs'>,
): { count: number; totalMs: number } {
  const len = timeMs.length
  if (rxPowerDbm.length !== len) throw new RangeError('rxPowerDbm must have the same length as timeMs')
  const sens = requireFinite('sensitivityDbm', options.sensitivityDbm)
  const floor = options.floorDbm === null ? -Infinity : requireFinite('floorDbm', options.floorDbm)
  const minDur = requireNonNegative('minDurationMs', options.minDurationMs ?? 0)
  const mergeWithin = requireNonNegative('mergeWithinMs', options.mergeWithinMs ?? 1000)
  let count = 0
  let totalMs = 0
  // the merged event being built: [openStart, openEnd] ms; runs arrive in time order
  let openStart = NaN
  let openEnd = NaN
  let runStartMs = NaN
  let runEndMs = NaN
  const close = (startMs: number, endMs: number) => {
    if (openStart === openStart && startMs - openEnd <= mergeWithin) {
      if (endMs > openEnd) openEnd = endMs
      return
    }
    if (openStart === openStart && openEnd - openStart >= minDur) (count++, (totalMs += openEnd - openStart))
    openStart = startMs
    openEnd = endMs
  }
  for (let i = 0; i < len; i++) {
    const p = rxPowerDbm[i]!
    if (p < sens || p <= floor) {
      if (runStartMs !== runStartMs) runStartMs = timeMs[i]!
      runEndMs = timeMs[i]!
    } else if (runStartMs === runStartMs) {
      close(runStartMs, timeMs[i]!)
      runStartMs = NaN
    }
  }
  if (runStartMs === runStartMs) close(runStartMs, runEndMs)
  if (openStart === openStart && openEnd - openStart >= minDur) (count++, (totalMs += openEnd - openStart))
  return { count, totalMs }
}

function event(
  startIndex: number,
  endIndex: number,
  startMs: number,
  endMs: number,
  fromSignal: boolean,
  fromLinkQuality: boolean,
  fromGap: boolean,
): DetectedDropout {
  return { startIndex, endIndex, startMs, endMs, durationMs: endMs - startMs, fromSignal, fromLinkQuality, fromGap }
}
