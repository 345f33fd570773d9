// Iterates tests/api/authz-matrix.json: every route of the listed prefixes x every principal (x owner, where the
// row says whose item it acts on). Denied writes must leave the database as it was.
import './env-private-data-dir.js'
import { readFileSync, rmSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import type { Express, Router } from 'express'
import type { Role } from '../../shared/types/api.js'
import { createApp } from '../../server/app.js'
import { config } from '../../server/config.js'
import { pgPool } from '../../server/db.js'
import { startMailSink, stopMailSink } from '../../server/services/mailSink.js'
import { flightJobsService } from '../../server/services/flights/jobs.js'
import { headerSignature } from '../../shared/import/headerSignature.js'
import { newToken } from '../../server/services/tokens.js'
import { Invite } from '../../server/models/Invite.js'
import { PasswordReset } from '../../server/models/PasswordReset.js'
import { createTeam, createUser, csrfFor, resetDb, signInAs, TEST_PASSWORD, type Agent, type TestUser } from './helpers.js'
import { mappingText, waitForStatus } from './flights-helpers.js'

type Principal = 'anonymous' | Role | 'otherTeamAdmin'
type Owner = 'pilot' | 'member'
interface MatrixRow {
  method: string
  path: string
  case?: string
  body?: Record<string, unknown>
  /** A multipart request: text fields and one file (a fixture by key). */
  multipart?: { fields?: Record<string, string>; file: { field: string; fixture: keyof typeof FILES; name: string } }
  /** Whose item the path names (content routes; the member's when omitted). */
  owner?: Owner
  /** The call consumes the item: a principal expected to succeed gets a new one. */
  fresh?: boolean
  expect: Record<Principal, number>
}
interface Matrix {
  prefixes: string[]
  principals: Principal[]
  routes: MatrixRow[]
}

const matrix = JSON.parse(readFileSync(new URL('./authz-matrix.json', import.meta.url), 'utf8')) as Matrix
const app = createApp()
let unique = 0

/** A 50-row, 10 Hz log out to ~1.3 km and back (the comma.csv fixture's columns). */
const LOG_HEADER = 'time_ms,lat,lon,alt_m,rssi_dbm,lq,snr,sats'
function smallLog(rows = 50): Buffer {
  const lines = [LOG_HEADER]
  for (let i = 0; i < rows; i++) {
    const u = i < rows / 2 ? i / (rows / 2) : (rows - i) / (rows / 2)
    lines.push(`${i * 100},${(52.0412 + u * 0.012).toFixed(7)},${(-1.3127 + u * 0.02).toFixed(7)},${(40 + u * 50).toFixed(1)},${(-45 - 40 * u - (i % 7) * 0.5).toFixed(1)},95,8,9`)
  }
  return Buffer.from(lines.join('\n') + '\n')
}
const FILES = { flightLog: smallLog(), terrain: readFileSync('fixtures/terrain/small.tif') }
const MAPPING_TEXT = mappingText('comma.csv')
/** In every name and note of team A's content: team B must never see it. */
const MARKER = 'Kestrel-A'

beforeAll(async () => {
  await startMailSink()
  await resetDb()
  await flightJobsService.start()
})
afterAll(async () => {
  await flightJobsService.stop()
  await stopMailSink()
  rmSync(config().dataDir, { recursive: true, force: true })
})

interface World {
  teamAId: number
  member: TestUser
  users: Partial<Record<Principal, TestUser>>
  inviteId: number
  inviteToken: string
  resetToken: string
}

let world: { row: MatrixRow; base: Omit<World, 'inviteId' | 'inviteToken' | 'resetToken'> } | null = null

// Teams and users are built once per matrix row (each principal is used once per row); the invite and
// reset token, which a case may consume, are fresh per case. Only the shared per-address sign-in
// counter is cleared, since every case signs in from the same loopback address.
async function buildWorld(row: MatrixRow): Promise<World> {
  await pgPool().query('DELETE FROM login_throttles')
  if (world?.row !== row) {
    const teamA = await createTeam('Team A')
    const users: World['users'] = {}
    for (const role of ['admin', 'instructor', 'pilot', 'viewer'] as Role[]) users[role] = await createUser({ role, teamId: teamA.id })
    users.otherTeamAdmin = await createUser({ role: 'admin' })
    world = { row, base: { teamAId: teamA.id, member: await createUser({ role: 'pilot', teamId: teamA.id }), users } }
  }
  const { base } = world
  const pending = newToken()
  const expiresAt = new Date(Date.now() + 86_400_000)
  const invite = await Invite.create({ teamId: base.teamAId, email: `pending${++unique}@example.test`, role: 'viewer', tokenHash: pending.hash, expiresAt, acceptedAt: null, invitedBy: base.users.admin!.id })
  const reset = newToken()
  await PasswordReset.create({ userId: base.member.id, tokenHash: reset.hash, expiresAt, usedAt: null })
  return { ...base, inviteId: invite.id, inviteToken: pending.token, resetToken: reset.token }
}

// ---- content routes (courses, setups, config, flights, column mappings, comparisons) ----

const CONTENT = /^\/api\/(courses|setups|config|flights|column-mappings|comparisons)(\/|$)/
type Session = { agent: Agent; csrf: string }
interface Owned {
  courseId: number
  setupId: number
  flightIds: [number, number]
  comparisonId: number
}
interface Content {
  teamAId: number
  users: Record<Exclude<Principal, 'anonymous'>, TestUser>
  member: TestUser
  as: Record<Owner, Session>
  /** The course and setup every flight uses (a setup in use would version on edit). */
  courseId: number
  setupId: number
  own: Record<Owner, Owned>
}
let content: Promise<Content> | null = null

async function ok(res: { status: number; body: unknown }, status: number) {
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  return res.body as { id: number }
}
const postJson = async (s: Session, path: string, body: object) => ok(await s.agent.post(path).set('X-CSRF-Token', s.csrf).send(body), 201)
const newCourse = async (s: Session, label: string) =>
  (await postJson(s, '/api/courses', { name: `${MARKER} ${label} field`, notes: MARKER, stationLat: 52.0412, stationLon: -1.3127, groundElevM: 118 })).id
const newSetup = async (s: Session, label: string) =>
  (await postJson(s, '/api/setups', {
    name: `${MARKER} ${label} link`, band: '2.4 GHz', freqMHz: 2440, txPowerDbm: 20, txAntenna: { type: 'dipole', gainDbi: 2 },
    rxAntennas: [{ label: 'A', type: 'dipole', kind: 'omni', gainDbi: 2 }], sensitivityDbm: -105, notes: MARKER,
  })).id

/** Waits until the flight is ready; fails on a failed import. */
async function waitReady(s: Session, id: number): Promise<void> {
  const st = await waitForStatus(s, id)
  if (st.status !== 'ready') throw new Error(`flight ${id} failed: ${JSON.stringify(st.failure)}`)
}
async function newFlight(s: Session, c: { courseId: number; setupId: number }, label: string): Promise<number> {
  const res = await s.agent.post('/api/flights').set('X-CSRF-Token', s.csrf)
    .field('courseId', String(c.courseId)).field('setupId', String(c.setupId)).field('name', `${MARKER} ${label}`)
    .field('flownOn', '2026-05-16').field('notes', MARKER).field('mapping', MAPPING_TEXT)
    .attach('file', FILES.flightLog, 'log.csv')
  const { id } = await ok(res, 202)
  await waitReady(s, id)
  return id
}
const newComparison = async (s: Session, flightIds: number[], label: string) =>
  (await postJson(s, '/api/comparisons', { name: `${MARKER} ${label}`, conclusion: MARKER, flightIds, baselineId: flightIds[0] })).id

// Built once: the content rows only read it, or act on items made for the call (`fresh`), or are refused.
async function buildContent(): Promise<Content> {
  const team = await createTeam(`${MARKER} club`)
  const users = {} as Content['users']
  for (const role of ['admin', 'instructor', 'pilot', 'viewer'] as Role[]) users[role] = await createUser({ role, teamId: team.id })
  users.otherTeamAdmin = await createUser({ role: 'admin' })
  const member = await createUser({ role: 'pilot', teamId: team.id })
  const as = { pilot: await signInAs(app, users.pilot), member: await signInAs(app, member) }
  const courseId = await newCourse(as.member, 'flown')
  const setupId = await newSetup(as.member, 'flown')
  const own = {} as Content['own']
  for (const owner of ['pilot', 'member'] as Owner[]) {
    const s = as[owner]
    const flightIds = (await Promise.all([1, 2].map((n) => newFlight(s, { courseId, setupId }, `${owner} flight ${n}`)))) as [number, number]
    own[owner] = { courseId: await newCourse(s, owner), setupId: await newSetup(s, owner), flightIds, comparisonId: await newComparison(s, flightIds, owner) }
  }
  return { teamAId: team.id, users, member, as, courseId, setupId, own }
}

/** The ids a content row's path names: the owner's items, or new ones when the call will consume them. */
async function targetIds(row: MatrixRow, status: number, c: Content): Promise<Owned> {
  const owner = row.owner ?? 'member'
  const ids = { ...c.own[owner] }
  if (!row.fresh || status >= 300) return ids
  const s = c.as[owner]
  if (row.path.includes(':courseId')) ids.courseId = await newCourse(s, `${owner} spare`)
  if (row.path.includes(':setupId')) ids.setupId = await newSetup(s, `${owner} spare`)
  if (row.path.startsWith('/api/flights/:id')) ids.flightIds = [await newFlight(s, c, `${owner} spare`), ids.flightIds[1]]
  if (row.path.includes(':comparisonId')) ids.comparisonId = await newComparison(s, c.own.member.flightIds, `${owner} spare`)
  return ids
}

// ---- placeholders ----

interface Ctx {
  w?: World
  c?: Content
  ids?: Owned
  me?: TestUser
}

function fillValue(value: unknown, x: Ctx): unknown {
  if (Array.isArray(value)) return value.map((v) => fillValue(v, x))
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, fillValue(v, x)]))
  if (typeof value !== 'string' || !value.startsWith('$')) return value
  const { w, c, me } = x
  const map: Record<string, () => unknown> = {
    $uniqueEmail: () => `fresh${++unique}@example.test`,
    $uniqueName: () => `Mapping ${++unique}`,
    $ownTeamId: () => me?.teamId ?? w!.teamAId,
    $inviteToken: () => w!.inviteToken,
    $resetToken: () => w!.resetToken,
    $memberEmail: () => w!.member.email,
    $password: () => TEST_PASSWORD,
    $courseId: () => c!.courseId,
    $setupId: () => c!.setupId,
    $flightA: () => c!.own.member.flightIds[0],
    $flightB: () => c!.own.member.flightIds[1],
    $mapping: () => JSON.parse(MAPPING_TEXT),
    $mappingText: () => MAPPING_TEXT,
    $headerSignature: () => headerSignature(LOG_HEADER.split(',')),
  }
  return value in map ? map[value]!() : value
}

function buildPath(path: string, x: Ctx): string {
  const { w, ids } = x
  if (ids) {
    return path
      .replace(':courseId', String(ids.courseId))
      .replace(':setupId', String(ids.setupId))
      .replace(':comparisonId', String(ids.comparisonId))
      .replace(/^\/api\/flights\/:id/, `/api/flights/${ids.flightIds[0]}`)
  }
  if (!w) return path
  return path
    .replace(':memberId', String(w.member.id))
    .replace(':inviteId', String(w.inviteId))
    .replace('$inviteToken', encodeURIComponent(w.inviteToken))
}

async function send(agent: Agent, csrf: string, row: MatrixRow, x: Ctx, path = buildPath(row.path, x)) {
  const method = row.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'
  const req = agent[method](path)
  if (row.method === 'GET') return req
  req.set('X-CSRF-Token', csrf)
  if (!row.multipart) return req.send(fillValue(row.body ?? {}, x) as object)
  for (const [k, v] of Object.entries(row.multipart.fields ?? {})) req.field(k, String(fillValue(v, x)))
  const f = row.multipart.file
  return req.attach(f.field, FILES[f.fixture], f.name)
}

// Denied writes must change nothing: a digest of every row of the tables a route could touch (sessions and
// the sign-in throttle excepted: signing the principal in writes those).
const WATCHED = ['teams', 'users', 'memberships', 'invites', 'password_resets', 'courses', 'course_terrains', 'link_setups', 'flights', 'imports', 'samples', 'comparisons', 'column_mappings']
async function digest(): Promise<string> {
  const parts = WATCHED.map((t) => `(SELECT md5(coalesce(string_agg(x::text, '|' ORDER BY x::text), '')) FROM "${t}" x)`)
  const { rows } = await pgPool().query<{ d: string }>(`SELECT concat_ws(',', ${parts.join(', ')}) AS d`)
  return rows[0]!.d
}

const cases = matrix.routes.flatMap((row) =>
  matrix.principals.map((p) => ({ row, principal: p, status: row.expect[p], name: `${row.method} ${row.path}${row.case ? ` (${row.case})` : ''} as ${p} → ${row.expect[p]}` })),
)

describe('authorization matrix (tests/api/authz-matrix.json)', () => {
  it('has an expected status for every principal on every row', () => {
    for (const c of cases) expect(c.status, c.name).toBeTypeOf('number')
  })

  // A loop, not it.each: it.each would cut the long names short.
  for (const { row, principal, status, name } of cases) it(name, async () => {
    const x: Ctx = {}
    if (CONTENT.test(row.path)) {
      await pgPool().query('DELETE FROM login_throttles')
      x.c = await (content ??= buildContent())
      x.ids = await targetIds(row, status, x.c)
      x.me = principal === 'anonymous' ? undefined : x.c.users[principal]
    } else {
      x.w = await buildWorld(row)
      x.me = principal === 'anonymous' ? undefined : x.w.users[principal]
    }
    let agent: Agent
    let csrf: string
    if (x.me) ({ agent, csrf } = await signInAs(app, x.me))
    else {
      agent = request.agent(app)
      csrf = await csrfFor(agent)
    }
    const denied = row.method !== 'GET' && status >= 400
    const before = denied ? await digest() : ''
    const res = await send(agent, csrf, row, x)
    expect(res.status, JSON.stringify(res.body)).toBe(status)
    if (status >= 400) expect(res.body.error.code).toBe({ 400: 'VALIDATION_FAILED', 401: 'UNAUTHENTICATED', 403: 'FORBIDDEN', 404: 'NOT_FOUND' }[status])
    if (denied) expect(await digest(), 'a refused write changed the database').toBe(before)
    if (!x.c) return
    // An accepted upload, re-import or re-analysis runs in the background: let it finish before the next case.
    if (status === 202) await waitReady({ agent, csrf }, row.path === '/api/flights' ? res.body.id : x.ids!.flightIds[0])
    if (principal === 'otherTeamAdmin') {
      const text = JSON.stringify(res.body ?? '')
      expect(text).not.toContain(MARKER)
      for (const u of [...Object.values(x.c.users).filter((u) => u.teamId === x.c!.teamAId), x.c.member]) expect(text).not.toContain(`"${u.email}"`)
      // another team's item and an id that exists nowhere get the same answer
      if (status === 404 && /:(courseId|setupId|comparisonId|id)\b/.test(row.path)) {
        const none = { courseId: 2_000_000_000, setupId: 2_000_000_000, comparisonId: 2_000_000_000, flightIds: [2_000_000_000, 0] as [number, number] }
        const missing = await send(agent, csrf, row, { ...x, ids: none })
        const shape = (b: { error: { code: string; message: string } }) => ({ code: b.error.code, message: b.error.message.replace(/\d+/g, 'N') })
        expect([missing.status, shape(missing.body)]).toEqual([404, shape(res.body)])
      }
    }
  })
})

describe('ids that exist nowhere', () => {
  it('a flight id past the integer range in a comparison answers 404 like any unknown flight (was a 500 from an int[] cast)', async () => {
    const c = await (content ??= buildContent())
    await pgPool().query('DELETE FROM login_throttles')
    const s = await signInAs(app, c.users.pilot)
    const [a] = c.own.member.flightIds
    for (const url of ['/api/comparisons/preview', '/api/comparisons']) {
      const res = await s.agent.post(url).set('X-CSRF-Token', s.csrf).send({ name: 'Out of range', flightIds: [a, 999_999_999_999_999], baselineId: a })
      expect([res.status, res.body.error?.code], url).toEqual([404, 'NOT_FOUND'])
    }
  })
})

/** Every METHOD /path the app registers, read from the Express router stack. */
function routeInventory(a: Express): string[] {
  const out: string[] = []
  type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle: Router & { stack?: Layer[] }; rawPath?: string }
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods)) out.push(`${m.toUpperCase()} ${prefix}${layer.route.path === '/' ? '' : layer.route.path}`)
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : ''))
      }
    }
  }
  walk((a as unknown as { router: { stack: Layer[] } }).router.stack, '')
  return out
}

describe('route inventory', () => {
  it('lists every route under the matrix prefixes in the matrix', () => {
    const inMatrix = new Set(matrix.routes.map((r) => `${r.method} ${r.path.split('?')[0]!.replace(/:memberId/, ':userId')}`))
    const registered = routeInventory(app).filter((r) => matrix.prefixes.some((p) => r.split(' ')[1]!.startsWith(p)))
    expect(registered.length).toBeGreaterThan(15)
    expect(registered.filter((r) => !inMatrix.has(r))).toEqual([])
  })
})
