import type { MapDropout, TimeBand } from './flightViewTypes'

/** A map marker standing for one or more dropouts of one cause at (nearly) one place. */
export interface MapDropoutGroup extends MapDropout {
  /** Every dropout the marker stands for, the first one being `index`. */
  indices: number[]
}

/** Grid cell for merging map markers, degrees of latitude (about 11 m). */
export const MARKER_CELL_DEG = 1e-4

/**
 * Merges dropout markers of the same cause that fall in one small grid cell (repeated passes over a course put
 * many on top of each other): one marker each, its hover text counting the others, a click choosing the first.
 * @param dropouts markers in dropout order
 * @param cellDeg cell size in degrees of latitude (longitude cells are as wide on the ground)
 */
export function groupMapDropouts(dropouts: MapDropout[], cellDeg = MARKER_CELL_DEG): MapDropoutGroup[] {
  const groups = new Map<string, MapDropoutGroup>()
  for (const d of dropouts) {
    const lonCell = cellDeg / Math.max(0.05, Math.cos((d.lat * Math.PI) / 180))
    const key = `${d.cause}|${Math.floor(d.lat / cellDeg)}|${Math.floor(d.lon / lonCell)}`
    const g = groups.get(key)
    if (g) g.indices.push(d.index)
    else groups.set(key, { ...d, indices: [d.index] })
  }
  return [...groups.values()].map((g) =>
    g.indices.length > 1 ? { ...g, text: `${g.text}\n…and ${g.indices.length - 1} more dropouts of this cause here` } : g,
  )
}

/**
 * Joins bands of the same cause that lie closer than `minGapMs` (less than a pixel apart on the chart), so a long
 * flight with thousands of dropouts draws hundreds of shapes, not thousands; a joined band keeps the first index.
 * @param bands bands in time order
 * @param minGapMs gaps at or below this are closed
 */
export function mergeTimeBands(bands: TimeBand[], minGapMs: number): TimeBand[] {
  const out: TimeBand[] = []
  const open = new Map<string, TimeBand>()
  for (const b of [...bands].sort((x, y) => x.startMs - y.startMs)) {
    const last = open.get(b.cause)
    if (last && b.startMs - last.endMs <= minGapMs) {
      last.endMs = Math.max(last.endMs, b.endMs)
      continue
    }
    const copy = { ...b }
    out.push(copy)
    open.set(b.cause, copy)
  }
  return out
}
