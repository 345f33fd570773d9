/**
 * Index of the sample closest in time to tMs (binary search over ascending times).
 * @returns -1 for an empty series
 */
export function nearestIndex(tMs: ArrayLike<number>, t: number): number {
  const n = tMs.length
  if (n === 0) return -1
  let lo = 0
  let hi = n - 1
  if (t <= tMs[0]!) return 0
  if (t >= tMs[hi]!) return hi
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1
    if (tMs[mid]! <= t) lo = mid
    else hi = mid
  }
  return t - tMs[lo]! <= tMs[hi]! - t ? lo : hi
}

/** The value shown for a sample's signal: the stronger of the two receive antennas when there are two. */
export function bestSignal(a: number | null | undefined, b: number | null | undefined): number | null {
  const okA = a != null && Number.isFinite(a)
  const okB = b != null && Number.isFinite(b)
  if (okA && okB) return Math.max(a, b)
  if (okA) return a
  if (okB) return b
  return null
}

/** Formats ms from the start as m:ss (or h:mm:ss). */
export function formatElapsed(ms: number): string {
  const total = Math.max(0, Math.round(ms / 1000))
  const h = Math.floor(total / 3600)
  const m = Math.floor((total % 3600) / 60)
  const s = String(total % 60).padStart(2, '0')
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${s}` : `${m}:${s}`
}
