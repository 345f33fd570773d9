import { describe, expect, it } from 'vitest'
import { KIND_EDGE, OVERVIEW_BUCKETS, OverviewBuilder, OVERVIEW_EDGE_POINTS, overviewPoints } from '../../../../../server/services/flights/overview.js'

/** Feeds a generated 20 Hz log: a slow fade with ripple, a 4 s gap at row gapAt, rows lostFrom..lostTo below -100 dBm. */
function build(rows: number, opts: { gapAt?: number; lostFrom?: number; lostTo?: number; r2?: boolean } = {}) {
  const b = new OverviewBuilder(-100)
  const all: Array<{ t: number; s: number }> = []
  let t = 0
  for (let i = 0; i < rows; i++) {
    t += i === opts.gapAt ? 4000 : 50
    const lost = opts.lostFrom !== undefined && i >= opts.lostFrom && i < (opts.lostTo ?? 0)
    const r1 = lost ? -115 : -50 - (40 * i) / rows - ((i * 7919) % 13) * 0.7
    const r2 = opts.r2 ? r1 + ((i % 5) - 2) : null
    b.addValues(i, t, 52 + i * 1e-6, -1.3, 40, r1, r2, 90, 8, i * 0.5)
    all.push({ t, s: Math.max(r1, r2 ?? -Infinity) })
  }
  return { o: b.result(), all }
}

describe('OverviewBuilder', () => {
  it('keeps every row of a short flight', () => {
    const { o } = build(500)
    expect(o.total).toBe(500)
    expect(o.seq).toEqual(Array.from({ length: 500 }, (_, i) => i))
    expect(o.distM[10]).toBe(5)
  })

  it('keeps a long flight to about four points per bucket with the extremes, the gap sides and the dropout edges', () => {
    const { o, all } = build(300_000, { gapAt: 100_000, lostFrom: 200_000, lostTo: 200_030, r2: true })
    expect(o.total).toBe(300_000)
    expect(o.seq.length).toBeLessThanOrEqual(4 * OVERVIEW_BUCKETS + OVERVIEW_EDGE_POINTS)
    expect(o.seq.length).toBeGreaterThan(OVERVIEW_BUCKETS)
    const best = o.rssi1Dbm.map((v, i) => Math.max(v ?? -Infinity, o.rssi2Dbm[i] ?? -Infinity))
    const lo = all.reduce((m, a) => Math.min(m, a.s), Infinity)
    const hi = all.reduce((m, a) => Math.max(m, a.s), -Infinity)
    expect(Math.min(...best)).toBe(lo)
    expect(Math.max(...best)).toBe(hi)
    for (const seq of [99_999, 100_000, 200_000, 200_030]) expect(o.seq).toContain(seq)
    expect(o.edgeSeq).toEqual([0, 99_999, 100_000, 200_000, 200_030])
    expect(o.edgeMs[1]).toBe(all[99_999]!.t)
    expect([...o.seq].sort((a, b) => a - b)).toEqual(o.seq)
    expect(overviewPoints(o).find((p) => p.seq === 200_000)!.kind & KIND_EDGE).toBe(KIND_EDGE)
    expect(o.firstMs).toBe(50)
    expect(o.lastMs).toBe(all[all.length - 1]!.t)
  })

  it('thins a flapping link to a bounded edge list and keeps missing values as null', () => {
    const b = new OverviewBuilder(-100)
    for (let i = 0; i < 100_000; i++) b.addValues(i, i * 20, 52, -1.3, null, i % 2 ? -110 : -60, null, null, null, null)
    const o = b.result()
    expect(o.edgeSeq.length).toBeLessThanOrEqual(20_000)
    expect(o.edgeSeq.length).toBeGreaterThan(5_000)
    expect(o.altM.every((v) => v === null)).toBe(true)
    expect(o.seq.length).toBeLessThanOrEqual(4 * OVERVIEW_BUCKETS + OVERVIEW_EDGE_POINTS)
  })
})
