import type { SamplesDto } from '@/api/flights'
import type { TimeWindow } from './sampleWindow'

const COLUMNS = ['tMs', 'lat', 'lon', 'altM', 'rssi1Dbm', 'rssi2Dbm', 'lq', 'snr', 'distM'] as const

/** An empty set of columns. */
export function emptySamples(): SamplesDto {
  return { tMs: [], lat: [], lon: [], altM: [], rssi1Dbm: [], rssi2Dbm: [], lq: [], snr: [], distM: [] }
}

function lowerBound(t: readonly number[], x: number): number {
  let lo = 0
  let hi = t.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (t[mid]! < x) lo = mid + 1
    else hi = mid
  }
  return lo
}

/**
 * The overview with a finer window spliced in: overview samples before the window, every detail
 * sample inside it, overview samples after it. Keeps the whole flight on screen while the zoomed part
 * shows full detail.
 */
export function spliceWindow(overview: SamplesDto, detail: SamplesDto | null, win: TimeWindow | null): SamplesDto {
  if (!detail || !win || detail.tMs.length === 0) return overview
  const a = lowerBound(overview.tMs, win.fromMs)
  const b = lowerBound(overview.tMs, win.toMs + 1)
  const out = emptySamples() as unknown as Record<(typeof COLUMNS)[number], unknown[]>
  for (const c of COLUMNS) {
    const o = (overview[c] ?? []) as unknown[]
    const d = (detail[c] ?? []) as unknown[]
    out[c] = [...o.slice(0, a), ...d, ...o.slice(b)]
  }
  return out as unknown as SamplesDto
}
