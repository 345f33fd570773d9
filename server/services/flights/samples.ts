import { z } from 'zod'
import type { FlightSamplesDto } from '../../../shared/types/flight.js'
import { pgPool } from '../../db.js'
import { notFound } from '../../errors.js'
import { Flight } from '../../models/Flight.js'
import { LinkSetup } from '../../models/LinkSetup.js'
import {
  KIND_EDGE,
  KIND_END,
  KIND_EXTREME,
  loadOverview,
  overviewPoints,
  rebuildOverview,
  type OverviewData,
  type OverviewPoint,
} from './overview.js'

/** Query of GET /api/flights/:id/samples. */
export const samplesQuerySchema = z.object({
  fromMs: z.coerce.number().int().min(0).optional(),
  toMs: z.coerce.number().int().min(0).optional(),
  maxPoints: z.coerce.number().int().min(10).max(20_000).optional().default(2000),
})
export type SamplesQuery = z.infer<typeof samplesQuerySchema>

interface SampleRowDb {
  seq: number
  t_ms: string
  lat: number
  lon: number
  alt_m: number | null
  rssi1_dbm: number | null
  rssi2_dbm: number | null
  lq: number | null
  snr: number | null
  dist_m: number | null
}

const COLS = 'seq, t_ms, lat, lon, alt_m, rssi1_dbm, rssi2_dbm, lq, snr, dist_m'

// A zoomed window in one pass over the (flight_id, t_ms) index range and a hash aggregate: per time bucket the first
// and last seq and the seq of the weakest and strongest signal (arrays compare element-wise, so the seq rides along
// with its score; a missing signal is the weakest). No window functions, no sorts of the window's rows.
const BUCKET_SQL = `
SELECT min(seq) AS f, max(seq) AS l,
       (min(ARRAY[coalesce(greatest(rssi1_dbm, rssi2_dbm), '-Infinity')::float8, seq::float8]))[2]::int AS mn,
       -(max(ARRAY[coalesce(greatest(rssi1_dbm, rssi2_dbm), '-Infinity')::float8, -seq::float8]))[2]::int AS mx
  FROM samples WHERE flight_id = $1 AND t_ms BETWEEN $2 AND $3
 GROUP BY width_bucket(t_ms, $2::bigint, $3::bigint + 1, $4::int)`

const nul = (v: number | null) => (v === null || Number.isNaN(v) ? null : v)

function fromDb(r: SampleRowDb, kind = KIND_END): OverviewPoint {
  return {
    seq: r.seq,
    tMs: Number(r.t_ms),
    lat: r.lat,
    lon: r.lon,
    altM: nul(r.alt_m),
    rssi1Dbm: nul(r.rssi1_dbm),
    rssi2Dbm: nul(r.rssi2_dbm),
    lq: nul(r.lq),
    snr: nul(r.snr),
    distM: nul(r.dist_m),
    kind,
  }
}

const isKept = (p: OverviewPoint) => (p.kind & (KIND_EXTREME | KIND_EDGE)) !== 0

/** Trims to at most n points: bucket ends go first, then edges are thinned evenly; min/max picks stay longest. */
function capRows(rows: OverviewPoint[], n: number): OverviewPoint[] {
  if (rows.length <= n) return rows
  const kept = rows.filter(isKept)
  if (kept.length <= n) {
    const room = n - kept.length
    const ends = rows.filter((r) => !isKept(r))
    const step = ends.length / Math.max(room, 1)
    const pick = new Set(room > 0 ? Array.from({ length: room }, (_, i) => ends[Math.floor(i * step)]!.seq) : [])
    return rows.filter((r) => isKept(r) || pick.has(r.seq))
  }
  const step = kept.length / n
  return Array.from({ length: n }, (_, i) => kept[Math.floor(i * step)]!)
}

const score = (p: OverviewPoint) => Math.max(p.rssi1Dbm ?? -Infinity, p.rssi2Dbm ?? -Infinity)

/**
 * Re-buckets stored overview points (in seq order) for a smaller budget: per bucket the weakest, strongest, first
 * and last point, plus every edge point; the overview already holds each finer bucket's extremes, so the extremes
 * picked here are the flight's.
 */
function rebucket(points: OverviewPoint[], loMs: number, hiMs: number, maxPoints: number): OverviewPoint[] {
  const buckets = Math.max(1, Math.floor(maxPoints / 4))
  const widthMs = (hiMs - loMs + 1) / buckets
  const picks = new Map<number, OverviewPoint>()
  const pick = (p: OverviewPoint, kind: number) => {
    const had = picks.get(p.seq)
    picks.set(p.seq, { ...p, kind: (had?.kind ?? 0) | kind })
  }
  let key = -1
  let first: OverviewPoint | null = null
  let last: OverviewPoint | null = null
  let mn: OverviewPoint | null = null
  let mx: OverviewPoint | null = null
  const close = () => {
    if (!first) return
    pick(first, KIND_END)
    pick(last!, KIND_END)
    pick(mn!, KIND_EXTREME)
    pick(mx!, KIND_EXTREME)
  }
  for (const p of points) {
    if (p.kind & KIND_EDGE) pick(p, KIND_EDGE)
    const k = Math.min(buckets - 1, Math.floor((p.tMs - loMs) / widthMs))
    if (k !== key) {
      close()
      key = k
      first = mn = mx = p
    }
    last = p
    if (score(p) < score(mn!)) mn = p
    if (score(p) > score(mx!)) mx = p
  }
  close()
  return [...picks.values()].sort((a, b) => a.seq - b.seq)
}

function toDto(rows: OverviewPoint[], total: number): FlightSamplesDto {
  return {
    total,
    decimated: rows.length < total,
    tMs: rows.map((r) => r.tMs),
    lat: rows.map((r) => r.lat),
    lon: rows.map((r) => r.lon),
    altM: rows.map((r) => r.altM),
    rssi1Dbm: rows.map((r) => r.rssi1Dbm),
    rssi2Dbm: rows.map((r) => r.rssi2Dbm),
    lq: rows.map((r) => r.lq),
    snr: rows.map((r) => r.snr),
    distM: rows.map((r) => r.distM),
  }
}

async function allRows(id: number, fromMs: number, toMs: number): Promise<OverviewPoint[]> {
  const { rows } = await pgPool().query<SampleRowDb>(
    `SELECT ${COLS} FROM samples WHERE flight_id = $1 AND t_ms BETWEEN $2 AND $3 ORDER BY seq`,
    [id, fromMs, toMs],
  )
  return rows.map((r) => fromDb(r))
}

/** A zoomed window: bucket picks from one aggregate pass, plus the stored edges that fall inside it. */
async function windowRows(id: number, loMs: number, hiMs: number, maxPoints: number, ov: OverviewData | null): Promise<OverviewPoint[]> {
  const pool = pgPool()
  const buckets = Math.max(1, Math.floor(maxPoints / 4))
  const { rows: bk } = await pool.query<{ f: number; l: number; mn: number; mx: number }>(BUCKET_SQL, [id, loMs, hiMs, buckets])
  const kinds = new Map<number, number>()
  const mark = (seq: number, kind: number) => kinds.set(seq, (kinds.get(seq) ?? 0) | kind)
  for (const b of bk) {
    mark(b.f, KIND_END)
    mark(b.l, KIND_END)
    mark(b.mn, KIND_EXTREME)
    mark(b.mx, KIND_EXTREME)
  }
  if (ov) ov.edgeMs.forEach((t, i) => t >= loMs && t <= hiMs && mark(ov.edgeSeq[i]!, KIND_EDGE))
  const { rows } = await pool.query<SampleRowDb>(`SELECT ${COLS} FROM samples WHERE flight_id = $1 AND seq = ANY($2::int[]) ORDER BY seq`, [
    id,
    [...kinds.keys()],
  ])
  return rows.map((r) => fromDb(r, kinds.get(r.seq) ?? KIND_END))
}

/**
 * Samples of a time window, decimated to at most maxPoints for maps and charts, as columns. The whole flight is
 * answered from its stored overview; a zoomed window from one index range scan.
 * @param teamId the caller's team
 * @param id flight id
 * @param q window (ms from the first sample) and point budget
 */
export async function flightSamples(teamId: number, id: number, q: SamplesQuery): Promise<FlightSamplesDto> {
  const flight = await Flight.findOne({ where: { id, teamId }, attributes: ['id', 'setupId', 'status'] })
  if (!flight) throw notFound(`Flight ${id}`)
  const fromMs = q.fromMs ?? 0
  const toMs = q.toMs ?? Number.MAX_SAFE_INTEGER
  let ov = await loadOverview(id)
  if (!ov && (flight.status === 'ready' || flight.status === 'failed')) {
    // imported before overviews were stored: build it once
    const setup = await LinkSetup.findByPk(flight.setupId, { attributes: ['sensitivityDbm'] })
    ov = await rebuildOverview(id, setup?.sensitivityDbm ?? -1e9)
  }
  if (ov && fromMs <= ov.firstMs && toMs >= ov.lastMs) {
    if (ov.total <= q.maxPoints) return toDto(await allRows(id, fromMs, toMs), ov.total)
    return toDto(capRows(rebucket(overviewPoints(ov), ov.firstMs, ov.lastMs, q.maxPoints), q.maxPoints), ov.total)
  }
  const { rows: cnt } = await pgPool().query<{ n: string; lo: string | null; hi: string | null }>(
    'SELECT count(*) AS n, min(t_ms) AS lo, max(t_ms) AS hi FROM samples WHERE flight_id = $1 AND t_ms BETWEEN $2 AND $3',
    [id, fromMs, toMs],
  )
  const total = Number(cnt[0]!.n)
  if (total <= q.maxPoints) return toDto(await allRows(id, fromMs, toMs), total)
  const rows = await windowRows(id, Number(cnt[0]!.lo), Number(cnt[0]!.hi), q.maxPoints, ov)
  return toDto(capRows(rows, q.maxPoints), total)
}
