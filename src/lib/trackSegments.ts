import type { SamplesDto } from '@/api/flights'
import { bestSignal } from './series'
import { NO_SIGNAL_COLOUR, rampColour, type SignalDomain } from './signalScale'

/** Number of colour steps the track is drawn in: enough to look continuous, few enough to stay fast. */
export const TRACK_COLOUR_STEPS = 24

/** Track segments grouped by colour: one multi-line per colour keeps the map to a few dozen layers. */
export interface ColouredSegments {
  colour: string
  /** Each segment is two [lat, lon] points. */
  segments: [[number, number], [number, number]][]
}

/** Telemetry gaps longer than this are not bridged with a line, ms. */
export const MAX_BRIDGE_MS = 5000

/**
 * Splits a track into segments coloured by the signal at each segment's start.
 * @param samples columns with lat/lon/signal; samples without a fix are skipped
 */
export function colouredSegments(samples: SamplesDto, domain: SignalDomain): ColouredSegments[] {
  const bins = new Map<string, ColouredSegments>()
  const { tMs, lat, lon, rssi1Dbm, rssi2Dbm } = samples
  const span = domain.highDbm - domain.lowDbm
  for (let i = 0; i + 1 < tMs.length; i++) {
    const a = lat[i]
    const o = lon[i]
    const a2 = lat[i + 1]
    const o2 = lon[i + 1]
    if (a == null || o == null || a2 == null || o2 == null) continue
    if ((a === 0 && o === 0) || (a2 === 0 && o2 === 0)) continue
    if (tMs[i + 1]! - tMs[i]! > MAX_BRIDGE_MS) continue
    const s = bestSignal(rssi1Dbm[i], rssi2Dbm?.[i])
    const colour =
      s === null
        ? NO_SIGNAL_COLOUR
        : rampColour(Math.round(((s - domain.lowDbm) / span) * (TRACK_COLOUR_STEPS - 1)) / (TRACK_COLOUR_STEPS - 1))
    let bin = bins.get(colour)
    if (!bin) bins.set(colour, (bin = { colour, segments: [] }))
    bin.segments.push([
      [a, o],
      [a2, o2],
    ])
  }
  return [...bins.values()]
}

/** Index of the sample nearest to a map position (plain scan: a few thousand points). */
export function nearestSampleToPoint(samples: SamplesDto, latDeg: number, lonDeg: number): number {
  let best = -1
  let bestD = Infinity
  const k = Math.cos((latDeg * Math.PI) / 180)
  for (let i = 0; i < samples.tMs.length; i++) {
    const a = samples.lat[i]
    const o = samples.lon[i]
    if (a == null || o == null) continue
    const d = (a - latDeg) ** 2 + ((o - lonDeg) * k) ** 2
    if (d < bestD) {
      bestD = d
      best = i
    }
  }
  return best
}
