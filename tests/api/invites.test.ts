import { describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { pgPool } from '../../server/db.js'
import { createUser, csrfFor, linkIn, mailsTo, signedIn, signInAs, TEST_PASSWORD, type SignedIn } from './helpers.js'
import { useMailSuite } from './mail-suite.js'

const app = createApp()

useMailSuite()

/** Invites `email` as the admin and returns the token read from the delivered message. */
async function invite(admin: SignedIn, email: string, role = 'pilot'): Promise<string> {
  const res = await admin.agent.post('/api/teams/current/invites').set('X-CSRF-Token', admin.csrf).send({ email, role })
  expect(res.status).toBe(201)
  const [mail] = await mailsTo(email)
  return linkIn(mail!.text, '/accept-invite').searchParams.get('token')!
}

async function anonymous() {
  const agent = request.agent(app)
  return { agent, csrf: await csrfFor(agent) }
}

describe('GET /api/invites/preview', () => {
  it('shows e-mail, team, role and whether the account exists', async () => {
    const admin = await signedIn(app)
    const token = await invite(admin, 'fresh@example.test', 'viewer')
    const res = await request(app).get('/api/invites/preview').query({ token })
    expect(res.body).toEqual({ email: 'fresh@example.test', teamName: admin.team.name, role: 'viewer', existingUser: false })
  })

  it('responds 404 NOT_FOUND for an unknown token', async () => {
    const res = await request(app).get('/api/invites/preview').query({ token: 'a'.repeat(43) })
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
  })
})

describe('POST /api/invites/accept', () => {
  it('creates a new account in the team with the invited role and signs it in, once only', async () => {
    const admin = await signedIn(app)
    const token = await invite(admin, 'fresh@example.test', 'viewer')
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token, name: 'Fresh Face', password: 'fresh-password' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ email: 'fresh@example.test', name: 'Fresh Face', currentTeamId: admin.team.id })
    expect(res.body.teams).toEqual([{ id: admin.team.id, name: admin.team.name, role: 'viewer' }])
    expect((await agent.get('/api/auth/me')).status).toBe(200)
    const again = await anonymous()
    const reuse = await again.agent.post('/api/invites/accept').set('X-CSRF-Token', again.csrf).send({ token, name: 'X', password: 'fresh-password' })
    expect([reuse.status, reuse.body.error.code]).toEqual([404, 'NOT_FOUND'])
  })

  it('lets exactly one of 5 parallel acceptances of one link succeed', async () => {
    const admin = await signedIn(app)
    const token = await invite(admin, 'racer@example.test', 'viewer')
    const agents = await Promise.all(Array.from({ length: 5 }, () => anonymous()))
    const all = await Promise.all(
      agents.map(({ agent, csrf }) => agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token, name: 'Racer', password: 'racer-password' })),
    )
    expect(all.filter((r) => r.status === 200)).toHaveLength(1)
    expect(all.filter((r) => r.status !== 200).map((r) => r.body.error.code)).toEqual(expect.arrayContaining(['NOT_FOUND']))
    const { rows } = await pgPool().query(`SELECT count(*)::int AS n FROM users WHERE email = 'racer@example.test'`)
    expect(rows[0].n).toBe(1)
  })

  it('asks a new account for name and password', async () => {
    const admin = await signedIn(app)
    const token = await invite(admin, 'fresh@example.test')
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(['name', 'password'])
  })

  it('adds an existing user who gives their password, keeping their other team', async () => {
    const admin = await signedIn(app)
    const existing = await createUser({ role: 'pilot' })
    const token = await invite(admin, existing.email, 'instructor')
    const preview = await request(app).get('/api/invites/preview').query({ token })
    expect(preview.body.existingUser).toBe(true)
    const { agent, csrf } = await anonymous()
    const wrong = await agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token, password: 'wrong-password' })
    expect([wrong.status, wrong.body.error.code]).toEqual([401, 'UNAUTHENTICATED'])
    const res = await agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token, password: TEST_PASSWORD })
    expect(res.status).toBe(200)
    expect(res.body.currentTeamId).toBe(admin.team.id)
    expect(res.body.teams).toHaveLength(2)
  })

  it('adds an existing user who is signed in as the invited address', async () => {
    const admin = await signedIn(app)
    const existing = await createUser({ role: 'viewer' })
    const token = await invite(admin, existing.email, 'pilot')
    const { agent } = await signInAs(app, existing)
    const csrf = await csrfFor(agent)
    const res = await agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token })
    expect(res.status).toBe(200)
    expect(res.body.teams.map((t: { role: string }) => t.role).sort()).toEqual(['pilot', 'viewer'])
  })

  it('refuses another signed-in user without the invited account\'s password', async () => {
    const admin = await signedIn(app)
    const existing = await createUser({ role: 'viewer' })
    const token = await invite(admin, existing.email, 'admin')
    const res = await admin.agent.post('/api/invites/accept').set('X-CSRF-Token', admin.csrf).send({ token })
    expect([res.status, res.body.error.code]).toEqual([401, 'UNAUTHENTICATED'])
    const { rows } = await pgPool().query('SELECT count(*)::int AS n FROM memberships WHERE user_id = $1', [existing.id])
    expect(rows[0].n).toBe(1)
  })

  it('refuses an expired invite', async () => {
    const admin = await signedIn(app)
    const token = await invite(admin, 'late@example.test')
    await pgPool().query(`UPDATE invites SET expires_at = now() - interval '1 second'`)
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/invites/accept').set('X-CSRF-Token', csrf).send({ token, name: 'Late', password: 'late-password' })
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
    const { rows } = await pgPool().query(`SELECT count(*)::int AS n FROM users WHERE email = 'late@example.test'`)
    expect(rows[0].n).toBe(0)
  })

  it('replaces a pending invite to the same address, so only the newest link works', async () => {
    const admin = await signedIn(app)
    const first = await invite(admin, 'twice@example.test')
    const second = await invite(admin, 'twice@example.test', 'viewer')
    expect((await request(app).get('/api/invites/preview').query({ token: first })).status).toBe(404)
    expect((await request(app).get('/api/invites/preview').query({ token: second })).body.role).toBe('viewer')
  })
})
