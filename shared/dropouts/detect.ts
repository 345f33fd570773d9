import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../units/guards.js'

/** Thresholds and timing for dropout detection. */
export interface DropoutDetectionOptions {
  /** Receiver sensitivity, dBm: samples below it count as lost. */
  sensitivityDbm: number
  /** Floor value the log writes when nothing is heard, dBm, or null. */
  floorDbm: number | null
  /** Link quality below this share counts as lost, percent in [0, 100] (default 50). */
  minLinkQualityPct?: number
  /** A time step longer than this is a telemetry gap, ms (default 1000). */
  maxGapMs?: number
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
}

/**
 * Finds link dropouts from weak signal, low link quality and telemetry gaps; merges close events and drops short ones.
 * @param timeMs sample times in ms, finite and non-decreasing
 * @param rxPowerDbm received power per sample in dBm (best antenna); NaN means not logged and is not a loss by itself
 * @param linkQualityPct link quality per sample in percent, or undefined; NaN entries are ignored
 * @param options sensitivity/floor in dBm, minLinkQualityPct [0, 100], maxGapMs > 0, minDurationMs >= 0, mergeWithinMs >= 0
 * @returns events in time order and the membership mask
 * @throws RangeError when lengths differ, times go backwards or an option is out of range
 */
export function detectDropouts(
  timeMs: Float64Array,
  rxPowerDbm: Float64Array,
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
  const maxGap = requirePositive('maxGapMs', options.maxGapMs ?? 1000)
  const minDur = requireNonNegative('minDurationMs', options.minDurationMs ?? 0)
  const mergeWithin = requireNonNegative('mergeWithinMs', options.mergeWithinMs ?? 1000)
  const raw: DetectedDropout[] = []
  let open: DetectedDropout | null = null
  for (let i = 0; i < len; i++) {
    const t = timeMs[i]!
    if (!Number.isFinite(t)) throw new RangeError(`timeMs[${i}] must be finite, got ${t}`)
    if (i > 0) {
      const prev = timeMs[i - 1]!
      if (t < prev) throw new RangeError(`timeMs must be non-decreasing, timeMs[${i}] < timeMs[${i - 1}]`)
      if (t - prev > maxGap) {
        raw.push(event(i - 1, i, prev, t, false, false, true))
      }
    }
    const p = rxPowerDbm[i]!
    const weak = p < sens || p <= floor
    const q = linkQualityPct ? linkQualityPct[i]! : NaN
    const poorLq = q < minLq
    if (weak || poorLq) {
      if (open === null) open = event(i, i, t, t, weak, poorLq, false)
      else {
        open.endIndex = i
        open.fromSignal ||= weak
        open.fromLinkQuality ||= poorLq
      }
      open.endMs = t
    } else if (open !== null) {
      // the link is back at this sample: the event lasted until now
      open.endMs = t
      raw.push(open)
      open = null
    }
  }
  if (open !== null) raw.push(open)
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
  return { events: kept, inDropout }
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
