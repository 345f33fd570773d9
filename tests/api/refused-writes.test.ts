// CSRF on one write of every content router, and refused uploads (signed out, viewer, no token, cross-site):
// 403/401 with nothing stored and no file left in the data folder's tmp/.
import './env-private-data-dir.js'
import fs from 'node:fs'
import path from 'node:path'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import request from 'supertest'
import type { Express } from 'express'
import { createApp } from '../../server/app.js'
import { config } from '../../server/config.js'
import { pgPool } from '../../server/db.js'
import { headerSignature } from '../../shared/import/headerSignature.js'
import { csrfFor, resetDb, signedIn, signedInToTeam, type Agent, type SignedIn } from './helpers.js'
import { makeCourse, makeSetup } from './fixtures-db.js'
import { mappingText } from './flights-helpers.js'

const MAPPING_TEXT = mappingText('comma.csv')
const HEADER = 'time_ms,lat,lon,alt_m,rssi_dbm,lq,snr,sats'
/** ~260 kB of plain log rows: big enough that a refusal must not wait for the whole body. */
const LOG = Buffer.from([HEADER, ...Array.from({ length: 6000 }, (_, i) => `${i * 100},52.0412,-1.3127,40.0,-60.5,95,8,9`)].join('\n') + '\n')
const TIF = fs.readFileSync('fixtures/terrain/small.tif')
const TABLES = ['courses', 'course_terrains', 'link_setups', 'flights', 'imports', 'samples', 'comparisons', 'column_mappings']

let app: Express
let admin: SignedIn
let courseId: number
let setupId: number

beforeAll(() => {
  app = createApp()
})
afterAll(() => {
  fs.rmSync(config().dataDir, { recursive: true, force: true })
})
beforeEach(async () => {
  await resetDb()
  admin = await signedIn(app, { role: 'admin' })
  courseId = (await makeCourse(admin.team.id, admin.user.id)).id
  setupId = (await makeSetup(admin.team.id, admin.user.id)).id
})

/** Rows per content table. */
async function rowCounts(): Promise<Record<string, number>> {
  const { rows } = await pgPool().query<Record<string, number>>(`SELECT ${TABLES.map((t) => `(SELECT count(*)::int FROM "${t}") AS "${t}"`).join(', ')}`)
  return rows[0]!
}

/** Every file under the data folder's tmp/ (where flight uploads land). */
function tmpFiles(): string[] {
  const dir = path.join(config().dataDir, 'tmp')
  expect(fs.existsSync(dir), `${dir} (made when the upload route is built)`).toBe(true)
  return fs.readdirSync(dir, { recursive: true, encoding: 'utf8' })
}

function flightUpload(agent: Agent, headers: Record<string, string>) {
  const req = agent.post('/api/flights')
  for (const [k, v] of Object.entries(headers)) req.set(k, v)
  return req
    .field('courseId', String(courseId))
    .field('setupId', String(setupId))
    .field('name', 'Refused')
    .field('flownOn', '2026-05-16')
    .field('mapping', MAPPING_TEXT)
    .attach('file', LOG, 'log.csv')
}

function terrainUpload(agent: Agent, headers: Record<string, string>) {
  const req = agent.post(`/api/courses/${courseId}/terrain`)
  for (const [k, v] of Object.entries(headers)) req.set(k, v)
  return req.attach('file', TIF, 'small.tif')
}

/** Sends, then checks the status and code, that no row was added or changed in count, and that tmp/ is empty. */
async function expectRefused(send: () => PromiseLike<{ status: number; body: { error?: { code: string } } }>, status: number, code: string) {
  const before = await rowCounts()
  const res = await send()
  expect([res.status, res.body.error?.code], JSON.stringify(res.body)).toEqual([status, code])
  expect(await rowCounts()).toEqual(before)
  expect(tmpFiles()).toEqual([])
}

describe('CSRF: one write per content router', () => {
  const writes: Array<[string, (s: SignedIn) => object]> = [
    ['/api/courses', () => ({ name: 'Refused field', stationLat: 52.04, stationLon: -1.31 })],
    ['/api/setups', () => ({
      name: 'Refused link', band: '2.4 GHz', freqMHz: 2440, txPowerDbm: 20, txAntenna: { type: 'dipole', gainDbi: 2 },
      rxAntennas: [{ type: 'dipole', kind: 'omni', gainDbi: 2 }], sensitivityDbm: -105,
    })],
    ['/api/column-mappings', () => ({ name: 'Refused mapping', headerSignature: headerSignature(HEADER.split(',')), mapping: JSON.parse(MAPPING_TEXT) })],
  ]

  it.each(writes)('POST %s: 403 CSRF_FAILED without the token or with a wrong one, 201 with it', async (url, body) => {
    await expectRefused(() => admin.agent.post(url).send(body(admin)), 403, 'CSRF_FAILED')
    await expectRefused(() => admin.agent.post(url).set('X-CSRF-Token', 'x'.repeat(admin.csrf.length)).send(body(admin)), 403, 'CSRF_FAILED')
    const ok = await admin.agent.post(url).set('X-CSRF-Token', admin.csrf).send(body(admin))
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
  })

  it('POST /api/comparisons and PUT/DELETE on a course and a setup: 403 CSRF_FAILED without the token', async () => {
    await expectRefused(() => admin.agent.post('/api/comparisons').send({ name: 'x', flightIds: [1, 2], baselineId: 1 }), 403, 'CSRF_FAILED')
    await expectRefused(() => admin.agent.put(`/api/courses/${courseId}`).send({ name: 'Renamed', stationLat: 52, stationLon: -1 }), 403, 'CSRF_FAILED')
    await expectRefused(() => admin.agent.delete(`/api/courses/${courseId}`), 403, 'CSRF_FAILED')
    await expectRefused(() => admin.agent.delete(`/api/setups/${setupId}`), 403, 'CSRF_FAILED')
    expect((await admin.agent.get(`/api/courses/${courseId}`)).body.name).toBe('Heron Moor east field')
  })

  it('POST /api/flights (multipart, a CORS-simple type): refused without the token, with a wrong one, cross-site or from another origin', async () => {
    const good = { 'X-CSRF-Token': admin.csrf }
    await expectRefused(() => flightUpload(admin.agent, {}), 403, 'CSRF_FAILED')
    await expectRefused(() => flightUpload(admin.agent, { 'X-CSRF-Token': 'wrong' }), 403, 'CSRF_FAILED')
    await expectRefused(() => flightUpload(admin.agent, { ...good, 'Sec-Fetch-Site': 'cross-site' }), 403, 'CSRF_FAILED')
    await expectRefused(() => flightUpload(admin.agent, { ...good, Origin: 'https://evil.example' }), 403, 'CSRF_FAILED')
  })

  it('POST /api/courses/:courseId/terrain: refused without the token and cross-site; the course keeps no terrain', async () => {
    await expectRefused(() => terrainUpload(admin.agent, {}), 403, 'CSRF_FAILED')
    await expectRefused(() => terrainUpload(admin.agent, { 'X-CSRF-Token': admin.csrf, 'Sec-Fetch-Site': 'cross-site' }), 403, 'CSRF_FAILED')
    await expectRefused(() => admin.agent.delete(`/api/courses/${courseId}/terrain`), 403, 'CSRF_FAILED')
    expect((await admin.agent.get(`/api/courses/${courseId}`)).body.hasTerrain).toBe(false)
  })
})

describe('uploads refused before the body is stored', () => {
  it('signed out: 401 with a token, 403 CSRF_FAILED without; nothing stored, tmp/ empty', async () => {
    const anon = request.agent(app)
    const token = await csrfFor(anon)
    await expectRefused(() => flightUpload(anon, { 'X-CSRF-Token': token }), 401, 'UNAUTHENTICATED')
    await expectRefused(() => flightUpload(anon, {}), 403, 'CSRF_FAILED')
    await expectRefused(() => terrainUpload(anon, { 'X-CSRF-Token': token }), 401, 'UNAUTHENTICATED')
    await expectRefused(() => terrainUpload(anon, {}), 403, 'CSRF_FAILED')
  })

  it('a viewer: 403 FORBIDDEN on both uploads; another team: 404 on the terrain of this team’s course', async () => {
    const viewer = await signedInToTeam(app, admin.team.id, 'viewer')
    await expectRefused(() => flightUpload(viewer.agent, { 'X-CSRF-Token': viewer.csrf }), 403, 'FORBIDDEN')
    await expectRefused(() => terrainUpload(viewer.agent, { 'X-CSRF-Token': viewer.csrf }), 403, 'FORBIDDEN')
    const other = await signedIn(app, { role: 'admin' })
    await expectRefused(() => terrainUpload(other.agent, { 'X-CSRF-Token': other.csrf }), 404, 'NOT_FOUND')
  })

  it('a writer naming another team’s course and setup: 404 NOT_FOUND (as for a missing id) naming both fields, the upload removed from tmp/', async () => {
    const other = await signedIn(app, { role: 'pilot' })
    let details: unknown
    await expectRefused(async () => {
      const res = await flightUpload(other.agent, { 'X-CSRF-Token': other.csrf })
      details = res.body.error?.details
      return res
    }, 404, 'NOT_FOUND')
    expect(details).toEqual([{ path: 'courseId', message: 'not found' }, { path: 'setupId', message: 'not found' }])
  })
})
