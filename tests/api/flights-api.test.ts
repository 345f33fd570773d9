import fs from 'node:fs'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import type { Express } from 'express'
import { pgPool } from '../../server/db.js'
import { groundDistanceM } from '../../shared/geo/localOffset.js'
import { headerSignature } from '../../shared/import/headerSignature.js'
import { signedIn, signedInToTeam, type SignedIn } from './helpers.js'
import { makeCourse, makeSetup } from './fixtures-db.js'
import { LOGS, mappingText, storedCounts, upload, waitForStatus } from './flights-helpers.js'
import { useFlightSuite } from './flights-suite.js'

const MAPPING = mappingText('comma.csv')
const HEADER = 'time_ms,lat,lon,alt_m,rssi_dbm,lq,snr,sats'

/** A generated log: 10 Hz, out to ~2 km and back; optional 5 s telemetry gap and a stretch below sensitivity. */
function makeLog(rows: number, opts: { gapAt?: number; lostFrom?: number; lostTo?: number } = {}): Buffer {
  const lines = [HEADER]
  let t = 0
  for (let i = 0; i < rows; i++) {
    t += i === opts.gapAt ? 5000 : 100
    const u = i < rows / 2 ? i / (rows / 2) : (rows - i) / (rows / 2)
    const lost = opts.lostFrom !== undefined && i >= opts.lostFrom && i < (opts.lostTo ?? 0)
    const rssi = lost ? -118 : -45 - 40 * u - (i % 7) * 0.5
    lines.push(`${t},${(52.0412 + u * 0.012).toFixed(7)},${(-1.3127 + u * 0.02).toFixed(7)},${(40 + u * 50).toFixed(1)},${rssi.toFixed(1)},${lost ? 0 : 95},8,9`)
  }
  return Buffer.from(lines.join('\n') + '\n')
}

let app: Express
let s: SignedIn
let courseId: number
let setupId: number

useFlightSuite((x) => {
  ;({ app, s, courseId, setupId } = x)
})

async function importReady(file: string | Buffer, name = 'Flight', who: SignedIn = s): Promise<number> {
  const res = await upload(who, file, { courseId, setupId, mapping: MAPPING, name })
  expect(res.status, JSON.stringify(res.body)).toBe(202)
  const st = await waitForStatus(who, res.body.id)
  expect(st.status, JSON.stringify(st.failure)).toBe('ready')
  return res.body.id as number
}

describe('POST /api/flights (concurrency)', () => {
  it('stores five uploads sent at once, each with its exact row count', async () => {
    const sizes = [3000, 4100, 5200, 6300, 7400]
    const res = await Promise.all(sizes.map((n, i) => upload(s, makeLog(n), { courseId, setupId, mapping: MAPPING, name: `Parallel ${i}` })))
    expect(res.map((r) => r.status)).toEqual([202, 202, 202, 202, 202])
    const st = await Promise.all(res.map((r) => waitForStatus(s, r.body.id)))
    expect(st.map((x) => x.status)).toEqual(['ready', 'ready', 'ready', 'ready', 'ready'])
    for (const [i, r] of res.entries()) {
      const { rows } = await pgPool().query('SELECT count(*)::int AS n FROM samples WHERE flight_id = $1', [r.body.id])
      expect(rows[0].n).toBe(sizes[i])
      const f = await s.agent.get(`/api/flights/${r.body.id}`)
      expect(f.body.rowCount).toBe(sizes[i])
    }
    expect((await storedCounts()).samples).toBe(sizes.reduce((a, b) => a + b, 0))
  })
})

describe('GET /api/flights', () => {
  it('filters by text, course and date, sorts on a whitelisted key and pages', async () => {
    const a = await importReady(makeLog(200), 'Alpha north leg')
    const b = await importReady(makeLog(300), 'Bravo ridge')
    const c = await importReady(makeLog(100), 'Charlie 50%_off')
    const all = await s.agent.get('/api/flights?sort=rowCount')
    expect(all.body.total).toBe(3)
    expect(all.body.items.map((f: { id: number }) => f.id)).toEqual([c, a, b])
    expect(all.body.items[0]).not.toHaveProperty('analysis')
    const page = await s.agent.get('/api/flights?sort=-name&page=2&pageSize=1')
    expect(page.body).toMatchObject({ total: 3, items: [{ id: b }] })
    const q = await s.agent.get('/api/flights?q=ridge')
    expect(q.body.items.map((f: { id: number }) => f.id)).toEqual([b])
    const literal = await s.agent.get(`/api/flights?q=${encodeURIComponent('%_')}`)
    expect(literal.body.items.map((f: { id: number }) => f.id)).toEqual([c])
    const otherCourse = await makeCourse(s.team.id, s.user.id, { name: 'Other field' })
    expect((await s.agent.get(`/api/flights?courseId=${otherCourse.id}`)).body.total).toBe(0)
    expect((await s.agent.get('/api/flights?from=2026-05-17')).body.total).toBe(0)
    expect((await s.agent.get('/api/flights?from=2026-05-16&to=2026-05-16')).body.total).toBe(3)
    // the three share a flight date: ties go by id, so pages of one never repeat or skip a flight
    const paged = []
    for (const page of [1, 2, 3]) paged.push((await s.agent.get(`/api/flights?sort=-flownOn&pageSize=1&page=${page}`)).body.items[0].id)
    expect(paged).toEqual([a, b, c])
  })

  it('answers 400 VALIDATION_FAILED for a sort key outside the whitelist or a repeated parameter', async () => {
    for (const qs of ['sort=password', 'sort=name;drop', 'page=0', 'pageSize=1000', 'sort=name&sort=flownOn']) {
      const res = await s.agent.get(`/api/flights?${qs}`)
      expect([res.status, res.body.error.code], qs).toEqual([400, 'VALIDATION_FAILED'])
    }
  })
})

describe('GET /api/flights/:id/samples', () => {
  it('decimates to at most maxPoints, keeping the weakest and strongest signal and both edges of a gap and a dropout', async () => {
    const id = await importReady(makeLog(12_000, { gapAt: 3000, lostFrom: 7000, lostTo: 7040 }))
    const res = await s.agent.get(`/api/flights/${id}/samples?maxPoints=300`)
    expect(res.status).toBe(200)
    const d = res.body
    expect(d.total).toBe(12_000)
    expect(d.decimated).toBe(true)
    expect(d.tMs.length).toBeLessThanOrEqual(300)
    for (const k of ['lat', 'lon', 'altM', 'rssi1Dbm', 'rssi2Dbm', 'lq', 'snr', 'distM']) expect(d[k].length).toBe(d.tMs.length)
    const { rows } = await pgPool().query('SELECT min(rssi1_dbm) AS lo, max(rssi1_dbm) AS hi FROM samples WHERE flight_id = $1', [id])
    expect(Math.min(...d.rssi1Dbm)).toBeCloseTo(rows[0].lo, 3)
    expect(Math.max(...d.rssi1Dbm)).toBeCloseTo(rows[0].hi, 3)
    // gap: sample 2999 at 299,900 ms and sample 3000 at 304,900 ms (generated above)
    expect(d.tMs).toContain(299_900)
    expect(d.tMs).toContain(304_900)
    // dropout: rows 7000..7039 below sensitivity (row i at (i + 1) * 100 + 4900 ms, less the first row's 100 ms);
    // the first lost and the first heard-again samples are both kept
    const lostStart = 7000 * 100 + 4900
    expect(d.tMs).toContain(lostStart)
    expect(d.tMs).toContain(lostStart + 40 * 100)
    expect([...d.tMs].sort((x: number, y: number) => x - y)).toEqual(d.tMs)
  })

  it('returns every sample of a short window undecimated', async () => {
    const id = await importReady(makeLog(1000))
    const res = await s.agent.get(`/api/flights/${id}/samples?fromMs=1000&toMs=1900&maxPoints=100`)
    expect(res.body.decimated).toBe(false)
    expect(res.body.tMs).toEqual([1000, 1100, 1200, 1300, 1400, 1500, 1600, 1700, 1800, 1900])
    expect(res.body.rssi2Dbm.every((v: number | null) => v === null)).toBe(true)
  })
})

describe('PATCH /api/flights/:id and POST /api/flights/:id/reanalyse', () => {
  it('edits metadata without touching the analysis', async () => {
    const id = await importReady(makeLog(200))
    const res = await s.agent.patch(`/api/flights/${id}`).set('X-CSRF-Token', s.csrf).send({ name: 'Renamed', notes: 'gusty' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ name: 'Renamed', notes: 'gusty', status: 'ready' })
  })

  it('refuses unknown keys such as teamId or createdBy', async () => {
    const id = await importReady(makeLog(200))
    const res = await s.agent.patch(`/api/flights/${id}`).set('X-CSRF-Token', s.csrf).send({ teamId: 99, createdBy: 1 })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })

  it('answers 404 NOT_FOUND (not 400) when moving a flight to another team\'s course or setup, changing nothing', async () => {
    const id = await importReady(makeLog(200))
    const other = await signedIn(app, { role: 'admin' })
    const foreignCourse = await makeCourse(other.team.id, other.user.id)
    const foreignSetup = await makeSetup(other.team.id, other.user.id)
    for (const body of [{ courseId: foreignCourse.id }, { setupId: foreignSetup.id }]) {
      const res = await s.agent.patch(`/api/flights/${id}`).set('X-CSRF-Token', s.csrf).send({ ...body, name: 'Moved away' })
      expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
    }
    const f = await s.agent.get(`/api/flights/${id}`)
    expect(f.body).toMatchObject({ courseId, setupId, name: 'Flight', status: 'ready' })
  })

  it('re-analyses after a course change, with distances from the new station', async () => {
    const id = await importReady(makeLog(300))
    const moved = await makeCourse(s.team.id, s.user.id, { stationLat: 52.03, stationLon: -1.3, name: 'Moved station' })
    const res = await s.agent.patch(`/api/flights/${id}`).set('X-CSRF-Token', s.csrf).send({ courseId: moved.id })
    expect(res.status).toBe(200)
    const st = await waitForStatus(s, id)
    expect(st.status).toBe('ready')
    const { rows } = await pgPool().query('SELECT lat, lon, dist_m FROM samples WHERE flight_id = $1 AND seq IN (0, 150) ORDER BY seq', [id])
    for (const r of rows) expect(r.dist_m).toBeCloseTo(groundDistanceM(52.03, -1.3, r.lat, r.lon), 0)
    const f = await s.agent.get(`/api/flights/${id}`)
    expect(f.body.courseId).toBe(moved.id)
    expect(f.body.analysis.sampleCount).toBe(300)
  })

  it('re-analyses the flights of a course whose station moves, and leaves them alone for a rename', async () => {
    const id = await importReady(makeLog(300))
    const course = (await s.agent.get(`/api/courses/${courseId}`)).body
    const { id: _id, hasTerrain: _t, terrain: _tr, createdAt: _c, updatedAt: _u, createdBy: _b, ...input } = course
    const put = (body: object) => s.agent.put(`/api/courses/${courseId}`).set('X-CSRF-Token', s.csrf).send(body)
    expect((await put({ ...input, name: 'Renamed strip' })).status).toBe(200)
    expect((await s.agent.get(`/api/flights/${id}/status`)).body.status).toBe('ready')
    expect((await put({ ...input, stationLat: 52.03, stationLon: -1.3 })).status).toBe(200)
    expect((await s.agent.get(`/api/flights/${id}/status`)).body.status).not.toBe('ready')
    expect((await waitForStatus(s, id)).status).toBe('ready')
    const { rows } = await pgPool().query('SELECT lat, lon, dist_m FROM samples WHERE flight_id = $1 AND seq IN (0, 150) ORDER BY seq', [id])
    for (const r of rows) expect(r.dist_m).toBeCloseTo(groundDistanceM(52.03, -1.3, r.lat, r.lon), 0)
  })

  it('re-analyses on demand', async () => {
    const id = await importReady(makeLog(200))
    const res = await s.agent.post(`/api/flights/${id}/reanalyse`).set('X-CSRF-Token', s.csrf)
    expect(res.status).toBe(202)
    expect((await waitForStatus(s, id)).status).toBe('ready')
  })
})

describe('POST /api/flights/:id/reimport', () => {
  it('re-reads the kept original with a new mapping', async () => {
    const id = await importReady(path.join(LOGS, 'comma.csv'))
    const m = JSON.parse(MAPPING)
    m.columns[3].role = 'ignore' // altitude no longer read
    const res = await s.agent.post(`/api/flights/${id}/reimport`).set('X-CSRF-Token', s.csrf).send({ mapping: m })
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    expect((await waitForStatus(s, id)).status).toBe('ready')
    const { rows } = await pgPool().query('SELECT count(*)::int AS n, count(alt_m)::int AS alt FROM samples WHERE flight_id = $1', [id])
    expect(rows[0]).toEqual({ n: 120, alt: 0 })
  })
})

describe('DELETE /api/flights/:id', () => {
  it('removes the flight, its samples and its kept original', async () => {
    const id = await importReady(makeLog(500))
    const { rows } = await pgPool().query('SELECT raw_file FROM flights WHERE id = $1', [id])
    const raw = rows[0].raw_file as string
    expect(fs.existsSync(raw)).toBe(true)
    const res = await s.agent.delete(`/api/flights/${id}`).set('X-CSRF-Token', s.csrf)
    expect(res.status).toBe(204)
    expect(fs.existsSync(raw)).toBe(false)
    expect(await storedCounts()).toMatchObject({ flights: 0, samples: 0 })
    expect((await s.agent.get(`/api/flights/${id}`)).status).toBe(404)
  })
})

describe('flight permissions', () => {
  it('lets viewers read but not change, other pilots not change, admins change, and hides flights from other teams', async () => {
    const id = await importReady(makeLog(200))
    const viewer = await signedInToTeam(app, s.team.id, 'viewer')
    expect((await viewer.agent.get(`/api/flights/${id}`)).status).toBe(200)
    const vPatch = await viewer.agent.patch(`/api/flights/${id}`).set('X-CSRF-Token', viewer.csrf).send({ name: 'x' })
    expect([vPatch.status, vPatch.body.error.code]).toEqual([403, 'FORBIDDEN'])
    const pilot2 = await signedInToTeam(app, s.team.id, 'pilot')
    const pDel = await pilot2.agent.delete(`/api/flights/${id}`).set('X-CSRF-Token', pilot2.csrf)
    expect([pDel.status, pDel.body.error.code]).toEqual([403, 'FORBIDDEN'])
    const admin = await signedInToTeam(app, s.team.id, 'admin')
    expect((await admin.agent.patch(`/api/flights/${id}`).set('X-CSRF-Token', admin.csrf).send({ name: 'By admin' })).status).toBe(200)
    const other = await signedIn(app, { role: 'admin' })
    for (const p of ['', '/status', '/samples']) {
      const r = await other.agent.get(`/api/flights/${id}${p}`)
      expect([r.status, r.body.error.code], p).toEqual([404, 'NOT_FOUND'])
    }
    const oDel = await other.agent.delete(`/api/flights/${id}`).set('X-CSRF-Token', other.csrf)
    expect(oDel.status).toBe(404)
    expect((await other.agent.get('/api/flights')).body.total).toBe(0)
  })
})

describe('/api/column-mappings', () => {
  it('saves a mapping, finds it by header signature, replaces it under the same name, and proposes it for an upload without one', async () => {
    const signature = headerSignature(HEADER.split(','))
    const body = { name: 'Heron Moor receiver', headerSignature: signature, mapping: JSON.parse(MAPPING) }
    const created = await s.agent.post('/api/column-mappings').set('X-CSRF-Token', s.csrf).send(body)
    expect(created.status).toBe(201)
    const again = await s.agent.post('/api/column-mappings').set('X-CSRF-Token', s.csrf).send(body)
    expect([again.status, again.body.id]).toEqual([200, created.body.id])
    const found = await s.agent.get(`/api/column-mappings?signature=${signature}`)
    expect(found.body.total).toBe(1)
    expect(found.body.items[0].mapping).toEqual(JSON.parse(MAPPING))
    const none = await s.agent.get('/api/column-mappings?signature=h3-00000000')
    expect(none.body.total).toBe(0)
    const res = await upload(s, makeLog(100), { courseId, setupId, mapping: null })
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    expect((await waitForStatus(s, res.body.id)).status).toBe('ready')
  })

  it('refuses a viewer (403) and an invalid mapping (400)', async () => {
    const viewer = await signedInToTeam(app, s.team.id, 'viewer')
    const v = await viewer.agent.post('/api/column-mappings').set('X-CSRF-Token', viewer.csrf).send({ name: 'x', headerSignature: 'h1-0', mapping: JSON.parse(MAPPING) })
    expect([v.status, v.body.error.code]).toEqual([403, 'FORBIDDEN'])
    const bad = await s.agent.post('/api/column-mappings').set('X-CSRF-Token', s.csrf).send({ name: 'x', headerSignature: 'h1-0', mapping: { delimiter: ',' } })
    expect([bad.status, bad.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })
})
