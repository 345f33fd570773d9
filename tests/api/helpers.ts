// Shared fixtures for API suites: a clean database, users in teams, and signed-in supertest agents.
import type { Express } from 'express'
import request from 'supertest'
import type { Role } from '../../shared/types/api.js'
import { pgPool, sequelize } from '../../server/db.js'
import { hashPassword } from '../../server/services/passwords.js'
import { Membership } from '../../server/models/Membership.js'
import { Team } from '../../server/models/Team.js'
import { User } from '../../server/models/User.js'

export const TEST_PASSWORD = 'correct-horse-battery'

export type Agent = ReturnType<typeof request.agent>

export interface TestUser {
  id: number
  email: string
  name: string
  password: string
  role: Role
  teamId: number
}

export interface SignedIn {
  agent: Agent
  /** The session's CSRF token: send it as `.set('X-CSRF-Token', csrf)` on POST/PUT/PATCH/DELETE. */
  csrf: string
  user: TestUser
  team: { id: number; name: string }
}

let seq = 0
let cachedHash: string | null = null

/** Empties every table (except the migration log) and restarts ids. */
export async function resetDb(): Promise<void> {
  sequelize()
  const { rows } = await pgPool().query<{ tablename: string }>(
    `SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'SequelizeMeta'`,
  )
  if (!rows.length) return
  const list = rows.map((r) => `"${r.tablename}"`).join(', ')
  await pgPool().query(`TRUNCATE ${list} RESTART IDENTITY CASCADE`)
}

/** Creates a team directly in the database. */
export async function createTeam(name = `Team ${++seq}`): Promise<{ id: number; name: string }> {
  const t = await Team.create({ name })
  return { id: t.id, name: t.name }
}

/**
 * Creates a user who is a member of `teamId` (a new team when omitted) with `role` (admin by default).
 * The password defaults to TEST_PASSWORD; its hash is computed once and reused for speed.
 */
export async function createUser(
  opts: { email?: string; name?: string; password?: string; role?: Role; teamId?: number } = {},
): Promise<TestUser> {
  sequelize()
  const n = ++seq
  const password = opts.password ?? TEST_PASSWORD
  const role = opts.role ?? 'admin'
  const teamId = opts.teamId ?? (await createTeam()).id
  const passwordHash =
    password === TEST_PASSWORD ? (cachedHash ??= await hashPassword(TEST_PASSWORD)) : await hashPassword(password)
  const email = (opts.email ?? `user${n}-${role}@test.example.test`).toLowerCase()
  const name = opts.name ?? `User ${n} (${role})`
  const u = await User.create({ email, name, passwordHash, currentTeamId: teamId })
  await Membership.create({ userId: u.id, teamId, role })
  return { id: u.id, email, name, password, role, teamId }
}

/** Fetches a CSRF token for the agent's session (creating the session). */
export async function csrfFor(agent: Agent): Promise<string> {
  const res = await agent.get('/api/auth/csrf')
  if (res.status !== 200) throw new Error(`GET /api/auth/csrf answered ${res.status}`)
  return res.body.token as string
}

/** Signs an existing user in on a fresh agent; returns the agent and its post-sign-in CSRF token. */
export async function signInAs(app: Express, user: TestUser): Promise<{ agent: Agent; csrf: string }> {
  const agent = request.agent(app)
  const pre = await csrfFor(agent)
  const res = await agent.post('/api/auth/sign-in').set('X-CSRF-Token', pre).send({ email: user.email, password: user.password })
  if (res.status !== 200) throw new Error(`sign-in answered ${res.status}: ${JSON.stringify(res.body)}`)
  return { agent, csrf: await csrfFor(agent) }
}

/** A signed-in user with `role` in a new team of their own. */
export async function signedIn(app: Express, opts: { role?: Role; email?: string } = {}): Promise<SignedIn> {
  const team = await createTeam()
  return signedInToTeam(app, team.id, opts.role ?? 'admin', opts.email)
}

/** A signed-in user with `role` in an existing team (a second member; use a new team for cross-team cases). */
export async function signedInToTeam(app: Express, teamId: number, role: Role, email?: string): Promise<SignedIn> {
  const user = await createUser({ role, teamId, email })
  const team = await Team.findByPk(teamId)
  const { agent, csrf } = await signInAs(app, user)
  return { agent, csrf, user, team: { id: teamId, name: team?.name ?? '' } }
}

/** A signed-in user of another, unrelated team (for "another team's resource answers 404" cases). */
export async function signedInElsewhere(app: Express, role: Role = 'admin'): Promise<SignedIn> {
  return signedIn(app, { role })
}

export interface DeliveredMail {
  id: number
  to: string
  subject: string
  text: string
}

/** Messages the local SMTP sink really received for `to`, newest first. */
export async function mailsTo(to: string): Promise<DeliveredMail[]> {
  const { rows } = await pgPool().query<DeliveredMail>(
    `SELECT id, "to", subject, text FROM outgoing_mail WHERE "to" = $1 ORDER BY id DESC`,
    [to.toLowerCase()],
  )
  return rows
}

/** The first link in a message to `${publicUrl}${path}?token=…`, as a URL (throws when absent). */
export function linkIn(text: string, path: string): URL {
  const m = text.match(new RegExp(`https?://\\S+${path.replace(/[/-]/g, '\\$&')}\\?token=[A-Za-z0-9_%-]+`))
  if (!m) throw new Error(`no ${path} link in: ${text}`)
  return new URL(m[0])
}
