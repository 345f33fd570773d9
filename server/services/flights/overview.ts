import type pg from 'pg'
import type { SampleRow } from '../../../shared/import/rowConverter.js'
import { pgPool } from '../../db.js'

/**
 * A flight's overview: a few thousand samples chosen while the rows stream past at import (or re-analysis) time and
 * stored beside the flight, so whole-flight views never scan the samples. Per time bucket it keeps the weakest and
 * strongest signal and the bucket's first and last sample; it also keeps dropout edges (both sides of a telemetry gap
 * and every change between heard and lost).
 */

/** Bump when the choice of points changes: stored overviews of another version are rebuilt on first read. */
export const OVERVIEW_FORMAT_VERSION = 1
/** Time buckets kept at most (each gives up to four points). */
export const OVERVIEW_BUCKETS = 900
/** Edge points put into the overview itself (the full edge list is kept apart for zoomed windows). */
export const OVERVIEW_EDGE_POINTS = 400
/** Edges remembered for zoomed windows; past this they are thinned evenly. */
export const OVERVIEW_EDGE_CAP = 20_000
/** A time step longer than this marks a telemetry gap whose edges are always kept, ms. */
export const GAP_MS = 1000

/** Point kinds (bit flags). */
export const KIND_END = 0
export const KIND_EXTREME = 1
export const KIND_EDGE = 2

/** One chosen sample; null where the log had no value. */
export interface OverviewPoint {
  seq: number
  tMs: number
  lat: number
  lon: number
  altM: number | null
  rssi1Dbm: number | null
  rssi2Dbm: number | null
  lq: number | null
  snr: number | null
  distM: number | null
  /** KIND_* flags: an extreme (min/max of its bucket), an edge, or neither (a bucket end). */
  kind: number
}

/** The stored overview: chosen points as columns, plus every edge's seq and time (for zoomed windows). */
export interface OverviewData {
  total: number
  firstMs: number
  lastMs: number
  seq: number[]
  tMs: number[]
  lat: number[]
  lon: number[]
  altM: (number | null)[]
  rssi1Dbm: (number | null)[]
  rssi2Dbm: (number | null)[]
  lq: (number | null)[]
  snr: (number | null)[]
  distM: (number | null)[]
  kind: number[]
  edgeSeq: number[]
  edgeMs: number[]
}

// record layout in the Float64Arrays below
const F = 10
const SEQ = 0
const T = 1
const R1 = 5
const R2 = 6
const MIN = 0
const MAX = F
const FIRST = 2 * F
const LAST = 3 * F

interface Bucket {
  rec: Float64Array
  lo: number
  hi: number
}

/** The stronger of the two receivers; -Infinity when neither was heard (a missing value counts as lost). */
function score(r1: number, r2: number): number {
  const b = r2 > r1 || r1 !== r1 ? r2 : r1
  return b === b ? b : -Infinity
}

function copyRec(to: Float64Array, at: number, from: Float64Array, fromAt = 0): void {
  for (let i = 0; i < F; i++) to[at + i] = from[fromAt + i]!
}

const nul = (v: number) => (v === v ? v : null)

/** Streams samples (in seq order) and keeps the overview points; memory stays bounded for any flight length. */
export class OverviewBuilder {
  private buckets = new Map<number, Bucket>()
  // starts fine (short flights keep every row) and doubles whenever the buckets run out
  private widthMs = 1
  private t0 = NaN
  private curKey = NaN
  private cur: Bucket | null = null
  private scratch = new Float64Array(F)
  private prev = new Float64Array(F)
  private prevLost = false
  private prevEdge = false
  private n = 0
  private edges = new Float64Array(256 * F)
  private edgeCount = 0
  /** After thinning, only every edgeStride-th new edge is kept. */
  private edgeStride = 1
  private edgeSeen = 0
  private firstMs = Infinity
  private lastMs = -Infinity

  /** @param sensitivityDbm signal below this counts as lost (the flight's setup) */
  constructor(private readonly sensitivityDbm: number) {}

  /** Offers one parsed row (import path). */
  addRow(seq: number, r: SampleRow, distM: number): void {
    const s = this.scratch
    s[0] = seq
    s[1] = Math.round(r.tMs)
    s[2] = r.lat
    s[3] = r.lon
    s[4] = r.altM
    s[5] = r.rssi1Dbm
    s[6] = r.rssi2Dbm
    s[7] = r.lq
    s[8] = r.snr
    s[9] = distM >= 0 ? Math.round(distM * 10) / 10 : distM
    this.take()
  }

  /** Offers one stored row (values as read back; null for missing). */
  addValues(seq: number, tMs: number, lat: number, lon: number, altM: number | null, r1: number | null, r2: number | null, lq: number | null, snr: number | null, distM: number | null): void {
    const s = this.scratch
    const n = (v: number | null) => (v === null ? NaN : v)
    s[0] = seq
    s[1] = tMs
    s[2] = lat
    s[3] = lon
    s[4] = n(altM)
    s[5] = n(r1)
    s[6] = n(r2)
    s[7] = n(lq)
    s[8] = n(snr)
    s[9] = n(distM)
    this.take()
  }

  private take(): void {
    const s = this.scratch
    const t = s[T]!
    const sc = score(s[R1]!, s[R2]!)
    const lost = sc < this.sensitivityDbm
    if (t < this.firstMs) this.firstMs = t
    if (t > this.lastMs) this.lastMs = t
    let edge = false
    if (this.n === 0) {
      this.t0 = t
      edge = true
    } else {
      if (t - this.prev[T]! > GAP_MS) {
        if (!this.prevEdge) this.pushEdge(this.prev)
        edge = true
      }
      if (lost !== this.prevLost) edge = true
    }
    if (edge) this.pushEdge(s)
    this.n++
    this.bucketAdd(s, t, sc)
    this.prevLost = lost
    this.prevEdge = edge
    // swap instead of copying: the old prev becomes the next scratch
    this.scratch = this.prev
    this.prev = s
  }

  private bucketAdd(s: Float64Array, t: number, sc: number): void {
    let key = Math.floor((t - this.t0) / this.widthMs)
    if (key !== this.curKey || !this.cur) {
      let b = this.buckets.get(key)
      if (!b) {
        if (this.buckets.size >= OVERVIEW_BUCKETS) {
          this.mergeBuckets()
          key = Math.floor((t - this.t0) / this.widthMs)
          b = this.buckets.get(key)
        }
        if (!b) {
          b = { rec: new Float64Array(4 * F), lo: sc, hi: sc }
          copyRec(b.rec, MIN, s)
          copyRec(b.rec, MAX, s)
          copyRec(b.rec, FIRST, s)
          copyRec(b.rec, LAST, s)
          this.buckets.set(key, b)
          this.curKey = key
          this.cur = b
          return
        }
      }
      this.curKey = key
      this.cur = b
    }
    const b = this.cur
    if (sc < b.lo) {
      b.lo = sc
      copyRec(b.rec, MIN, s)
    }
    if (sc > b.hi) {
      b.hi = sc
      copyRec(b.rec, MAX, s)
    }
    if (s[SEQ]! < b.rec[FIRST + SEQ]!) copyRec(b.rec, FIRST, s)
    else if (s[SEQ]! > b.rec[LAST + SEQ]!) copyRec(b.rec, LAST, s)
  }

  /** Doubles the bucket width and merges each pair of neighbouring buckets. */
  private mergeBuckets(): void {
    this.widthMs *= 2
    const next = new Map<number, Bucket>()
    const keys = [...this.buckets.keys()].sort((a, b) => a - b)
    for (const k of keys) {
      const b = this.buckets.get(k)!
      const nk = Math.floor(k / 2)
      const into = next.get(nk)
      if (!into) {
        next.set(nk, b)
        continue
      }
      // `into` holds the earlier half (keys are visited in order)
      if (b.lo < into.lo) {
        into.lo = b.lo
        copyRec(into.rec, MIN, b.rec, MIN)
      }
      if (b.hi > into.hi) {
        into.hi = b.hi
        copyRec(into.rec, MAX, b.rec, MAX)
      }
      if (b.rec[FIRST + SEQ]! < into.rec[FIRST + SEQ]!) copyRec(into.rec, FIRST, b.rec, FIRST)
      if (b.rec[LAST + SEQ]! > into.rec[LAST + SEQ]!) copyRec(into.rec, LAST, b.rec, LAST)
    }
    this.buckets = next
    this.cur = null
    this.curKey = NaN
  }

  private pushEdge(rec: Float64Array): void {
    if (this.edgeStride > 1 && this.edgeSeen++ % this.edgeStride !== 0) return
    if (this.edgeCount * F === this.edges.length) {
      if (this.edgeCount < OVERVIEW_EDGE_CAP) {
        const next = new Float64Array(Math.min(OVERVIEW_EDGE_CAP, this.edgeCount * 2) * F)
        next.set(this.edges)
        this.edges = next
      } else {
        // too many edges to keep them all: keep every other one from here on
        let w = 0
        for (let i = 0; i < this.edgeCount; i += 2) copyRec(this.edges, F * w++, this.edges, F * i)
        this.edgeCount = w
        this.edgeStride *= 2
        this.edgeSeen = 1
      }
    }
    copyRec(this.edges, F * this.edgeCount++, rec)
  }

  /** The overview of every row offered so far. */
  result(): OverviewData {
    const picked = new Map<number, OverviewPoint>()
    const put = (rec: Float64Array, at: number, kind: number) => {
      const seq = rec[at + SEQ]!
      const had = picked.get(seq)
      if (had) {
        had.kind |= kind
        return
      }
      picked.set(seq, {
        seq,
        tMs: rec[at + 1]!,
        lat: rec[at + 2]!,
        lon: rec[at + 3]!,
        altM: nul(rec[at + 4]!),
        rssi1Dbm: nul(rec[at + 5]!),
        rssi2Dbm: nul(rec[at + 6]!),
        lq: nul(rec[at + 7]!),
        snr: nul(rec[at + 8]!),
        distM: nul(rec[at + 9]!),
        kind,
      })
    }
    for (const b of this.buckets.values()) {
      put(b.rec, MIN, KIND_EXTREME)
      put(b.rec, MAX, KIND_EXTREME)
      put(b.rec, FIRST, KIND_END)
      put(b.rec, LAST, KIND_END)
    }
    const step = Math.max(1, this.edgeCount / OVERVIEW_EDGE_POINTS)
    for (let i = 0; i < this.edgeCount; i += step) put(this.edges, F * Math.floor(i), KIND_EDGE)
    const pts = [...picked.values()].sort((a, b) => a.seq - b.seq)
    const edgeSeq: number[] = []
    const edgeMs: number[] = []
    for (let i = 0; i < this.edgeCount; i++) {
      edgeSeq.push(this.edges[F * i + SEQ]!)
      edgeMs.push(this.edges[F * i + T]!)
    }
    return {
      total: this.n,
      firstMs: this.n ? this.firstMs : 0,
      lastMs: this.n ? this.lastMs : 0,
      seq: pts.map((p) => p.seq),
      tMs: pts.map((p) => p.tMs),
      lat: pts.map((p) => p.lat),
      lon: pts.map((p) => p.lon),
      altM: pts.map((p) => p.altM),
      rssi1Dbm: pts.map((p) => p.rssi1Dbm),
      rssi2Dbm: pts.map((p) => p.rssi2Dbm),
      lq: pts.map((p) => p.lq),
      snr: pts.map((p) => p.snr),
      distM: pts.map((p) => p.distM),
      kind: pts.map((p) => p.kind),
      edgeSeq,
      edgeMs,
    }
  }
}

/** The overview's points as rows. */
export function overviewPoints(o: OverviewData): OverviewPoint[] {
  return o.seq.map((seq, i) => ({
    seq,
    tMs: o.tMs[i]!,
    lat: o.lat[i]!,
    lon: o.lon[i]!,
    altM: o.altM[i]!,
    rssi1Dbm: o.rssi1Dbm[i]!,
    rssi2Dbm: o.rssi2Dbm[i]!,
    lq: o.lq[i]!,
    snr: o.snr[i]!,
    distM: o.distM[i]!,
    kind: o.kind[i]!,
  }))
}

/**
 * Stores (or replaces) a flight's overview.
 * @param flightId the flight
 * @param data the built overview
 * @param client a connection inside the caller's transaction, or the pool
 * @param replace false: keep an overview already there (a lazy rebuild must not overwrite a fresher import's)
 */
export async function saveOverview(flightId: number, data: OverviewData, client: pg.PoolClient | pg.Pool = pgPool(), replace = true): Promise<void> {
  await client.query(
    `INSERT INTO flight_overviews (flight_id, format_version, sample_count, data) VALUES ($1, $2, $3, $4)
     ON CONFLICT (flight_id) DO ${replace ? 'UPDATE SET format_version = $2, sample_count = $3, data = $4, built_at = now()' : 'NOTHING'}`,
    [flightId, OVERVIEW_FORMAT_VERSION, data.total, JSON.stringify(data)],
  )
}

/**
 * A flight's stored overview, or null when it has none of the current format.
 * @param flightId the flight
 */
export async function loadOverview(flightId: number): Promise<OverviewData | null> {
  const { rows } = await pgPool().query<{ data: OverviewData }>(
    'SELECT data FROM flight_overviews WHERE flight_id = $1 AND format_version = $2',
    [flightId, OVERVIEW_FORMAT_VERSION],
  )
  return rows[0]?.data ?? null
}

const READ_BATCH = 50_000

/**
 * Builds a flight's overview from its stored samples (flights imported before overviews existed) and stores it
 * unless one was stored meanwhile.
 * @param flightId the flight
 * @param sensitivityDbm the setup's sensitivity (below it counts as lost)
 */
export async function rebuildOverview(flightId: number, sensitivityDbm: number): Promise<OverviewData> {
  const b = new OverviewBuilder(sensitivityDbm)
  for (let from = 0; ; from += READ_BATCH) {
    const { rows } = await pgPool().query<{ seq: number; t: string; la: number; lo: number; a: number | null; r1: number | null; r2: number | null; q: number | null; s: number | null; d: number | null }>(
      `SELECT seq, t_ms AS t, lat AS la, lon AS lo, alt_m AS a, rssi1_dbm AS r1, rssi2_dbm AS r2, lq AS q, snr AS s, dist_m AS d
         FROM samples WHERE flight_id = $1 AND seq >= $2 AND seq < $3 ORDER BY seq`,
      [flightId, from, from + READ_BATCH],
    )
    for (const r of rows) b.addValues(r.seq, Number(r.t), r.la, r.lo, r.a, r.r1, r.r2, r.q, r.s, r.d)
    if (rows.length < READ_BATCH) break
  }
  const data = b.result()
  await saveOverview(flightId, data, pgPool(), false)
  return data
}
