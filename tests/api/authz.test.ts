// Iterates tests/api/authz-matrix.json: every route of the listed prefixes x every principal.
import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import type { Express, Router } from 'express'
import type { Role } from '../../shared/types/api.js'
import { createApp } from '../../server/app.js'
import { pgPool } from '../../server/db.js'
import { startMailSink, stopMailSink } from '../../server/services/mailSink.js'
import { newToken } from '../../server/services/tokens.js'
import { Invite } from '../../server/models/Invite.js'
import { PasswordReset } from '../../server/models/PasswordReset.js'
import { createTeam, createUser, csrfFor, resetDb, signInAs, TEST_PASSWORD, type Agent, type TestUser } from './helpers.js'

type Principal = 'anonymous' | Role | 'otherTeamAdmin'
interface MatrixRow {
  method: string
  path: string
  case?: string
  body?: Record<string, unknown>
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

beforeAll(async () => {
  await startMailSink()
  await resetDb()
})
afterAll(async () => {
  await stopMailSink()
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

function fill(value: string, w: World, me: TestUser | undefined): unknown {
  const map: Record<string, unknown> = {
    $uniqueEmail: `fresh${++unique}@example.test`,
    $ownTeamId: me?.teamId ?? w.teamAId,
    $inviteToken: w.inviteToken,
    $resetToken: w.resetToken,
    $memberEmail: w.member.email,
    $password: TEST_PASSWORD,
  }
  return value in map ? map[value] : value
}

function buildPath(path: string, w: World): string {
  return path
    .replace(':memberId', String(w.member.id))
    .replace(':inviteId', String(w.inviteId))
    .replace('$inviteToken', encodeURIComponent(w.inviteToken))
}

async function send(agent: Agent, csrf: string, row: MatrixRow, w: World, me: TestUser | undefined) {
  const body = Object.fromEntries(Object.entries(row.body ?? {}).map(([k, v]) => [k, typeof v === 'string' ? fill(v, w, me) : v]))
  const method = row.method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'
  const req = agent[method](buildPath(row.path, w))
  return row.method === 'GET' ? req : req.set('X-CSRF-Token', csrf).send(body)
}

const cases = matrix.routes.flatMap((row) =>
  matrix.principals.map((p) => ({ row, principal: p, status: row.expect[p], name: `${row.method} ${row.path}${row.case ? ` (${row.case})` : ''} as ${p} → ${row.expect[p]}` })),
)

describe('authorization matrix (tests/api/authz-matrix.json)', () => {
  it('has an expected status for every principal on every row', () => {
    for (const c of cases) expect(c.status, c.name).toBeTypeOf('number')
  })

  it.each(cases)('$name', async ({ row, principal, status }) => {
    const w = await buildWorld(row)
    const me = principal === 'anonymous' ? undefined : w.users[principal]
    let agent: Agent
    let csrf: string
    if (me) ({ agent, csrf } = await signInAs(app, me))
    else {
      agent = request.agent(app)
      csrf = await csrfFor(agent)
    }
    const res = await send(agent, csrf, row, w, me)
    expect(res.status, JSON.stringify(res.body)).toBe(status)
    if (status >= 400) expect(res.body.error.code).toBe({ 400: 'VALIDATION_FAILED', 401: 'UNAUTHENTICATED', 403: 'FORBIDDEN', 404: 'NOT_FOUND' }[status])
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
