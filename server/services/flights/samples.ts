import { z } from 'zod'
import type { FlightSamplesDto } from '../../../shared/types/flight.js'
import { pgPool } from '../../db.js'
import { LinkSetup } from '../../models/LinkSetup.js'
import { findTeamFlight } from './flights.js'

/** Query of GET /api/flights/:id/samples. */
export const samplesQuerySchema = z.object({
  fromMs: z.coerce.number().int().min(0).optional(),
  toMs: z.coerce.number().int().min(0).optional(),
  maxPoints: z.coerce.number().int().min(10).max(20_000).optional().default(2000),
})
export type SamplesQuery = z.infer<typeof samplesQuerySchema>

/** A time step longer than this marks a telemetry gap whose edges are always kept, ms. */
const GAP_MS = 1000

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
  keep_min?: boolean
  keep_ends?: boolean
  edge?: boolean
}

const COLS = 'seq, t_ms, lat, lon, alt_m, rssi1_dbm, rssi2_dbm, lq, snr, dist_m'

// Per time bucket keep the weakest and strongest signal (min/max-preserving) plus the bucket's first and last
// sample; always keep dropout edges: both sides of a telemetry gap and every change between heard and lost.
const DECIMATE_SQL = `
WITH w AS (
  SELECT ${COLS},
         width_bucket(t_ms, $2::bigint, $3::bigint + 1, $4::int) AS b,
         t_ms - lag(t_ms) OVER o AS gap_before,
         lead(t_ms) OVER o - t_ms AS gap_after,
         (coalesce(greatest(rssi1_dbm, rssi2_dbm), -1e9) < $5) AS lost,
         lag(coalesce(greatest(rssi1_dbm, rssi2_dbm), -1e9) < $5) OVER o AS lost_before
    FROM samples WHERE flight_id = $1 AND t_ms BETWEEN $2 AND $3
  WINDOW o AS (ORDER BY seq)
), r AS (
  SELECT *,
         row_number() OVER (PARTITION BY b ORDER BY greatest(rssi1_dbm, rssi2_dbm) ASC NULLS FIRST, seq) AS rmin,
         row_number() OVER (PARTITION BY b ORDER BY greatest(rssi1_dbm, rssi2_dbm) DESC NULLS LAST, seq) AS rmax,
         row_number() OVER (PARTITION BY b ORDER BY seq) AS rfirst,
         row_number() OVER (PARTITION BY b ORDER BY seq DESC) AS rlast
    FROM w
)
SELECT ${COLS}, (rmin = 1 OR rmax = 1) AS keep_min, (rfirst = 1 OR rlast = 1) AS keep_ends,
       (gap_before > ${GAP_MS} OR gap_after > ${GAP_MS} OR lost IS DISTINCT FROM lost_before) AS edge
  FROM r
 WHERE rmin = 1 OR rmax = 1 OR rfirst = 1 OR rlast = 1
    OR gap_before > ${GAP_MS} OR gap_after > ${GAP_MS} OR lost IS DISTINCT FROM lost_before
 ORDER BY seq`

/** Trims to at most n rows: bucket ends go first, then edges are thinned evenly; min/max picks stay longest. */
function capRows(rows: SampleRowDb[], n: number): SampleRowDb[] {
  if (rows.length <= n) return rows
  let kept = rows.filter((r) => r.keep_min || r.edge)
  if (kept.length <= n) {
    const room = n - kept.length
    const ends = rows.filter((r) => !r.keep_min && !r.edge)
    const step = ends.length / Math.max(room, 1)
    const pick = new Set(room > 0 ? Array.from({ length: room }, (_, i) => ends[Math.floor(i * step)]!.seq) : [])
    return rows.filter((r) => r.keep_min || r.edge || pick.has(r.seq))
  }
  const step = kept.length / n
  kept = Array.from({ length: n }, (_, i) => kept[Math.floor(i * step)]!)
  return kept
}

const nul = (v: number | null) => (v === null || Number.isNaN(v) ? null : v)

/**
 * Samples of a time window, decimated to at most maxPoints for maps and charts, as columns.
 * @param teamId the caller's team
 * @param id flight id
 * @param q window (ms from the first sample) and point budget
 */
export async function flightSamples(teamId: number, id: number, q: SamplesQuery): Promise<FlightSamplesDto> {
  const flight = await findTeamFlight(teamId, id)
  const fromMs = q.fromMs ?? 0
  const toMs = q.toMs ?? Number.MAX_SAFE_INTEGER
  const pool = pgPool()
  const { rows: cnt } = await pool.query<{ n: string; lo: string | null; hi: string | null }>(
    'SELECT count(*) AS n, min(t_ms) AS lo, max(t_ms) AS hi FROM samples WHERE flight_id = $1 AND t_ms BETWEEN $2 AND $3',
    [id, fromMs, toMs],
  )
  const total = Number(cnt[0]!.n)
  let rows: SampleRowDb[]
  if (total <= q.maxPoints) {
    rows = (
      await pool.query<SampleRowDb>(`SELECT ${COLS} FROM samples WHERE flight_id = $1 AND t_ms BETWEEN $2 AND $3 ORDER BY seq`, [
        id,
        fromMs,
        toMs,
      ])
    ).rows
  } else {
    const setup = await LinkSetup.findByPk(flight.setupId, { attributes: ['sensitivityDbm'] })
    const buckets = Math.max(1, Math.floor(q.maxPoints / 4))
    const lo = Number(cnt[0]!.lo)
    const hi = Number(cnt[0]!.hi)
    rows = capRows((await pool.query<SampleRowDb>(DECIMATE_SQL, [id, lo, hi, buckets, setup?.sensitivityDbm ?? -1e9])).rows, q.maxPoints)
  }
  return {
    total,
    decimated: rows.length < total,
    tMs: rows.map((r) => Number(r.t_ms)),
    lat: rows.map((r) => r.lat),
    lon: rows.map((r) => r.lon),
    altM: rows.map((r) => nul(r.alt_m)),
    rssi1Dbm: rows.map((r) => nul(r.rssi1_dbm)),
    rssi2Dbm: rows.map((r) => nul(r.rssi2_dbm)),
    lq: rows.map((r) => nul(r.lq)),
    snr: rows.map((r) => nul(r.snr)),
    distM: rows.map((r) => nul(r.dist_m)),
  }
}
