import { describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { createTeam, createUser, csrfFor, mailsTo, signedIn, signInAs, TEST_PASSWORD } from './helpers.js'
import { Membership } from '../../server/models/Membership.js'
import { useMailSuite } from './mail-suite.js'

const app = createApp()

useMailSuite()

describe('PATCH /api/account', () => {
  it('changes name and unit preference', async () => {
    const { agent, csrf } = await signedIn(app, { role: 'viewer' })
    const res = await agent.patch('/api/account').set('X-CSRF-Token', csrf).send({ name: 'Renamed', units: 'imperial' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ name: 'Renamed', units: 'imperial' })
  })

  it('responds 400 VALIDATION_FAILED for fields it does not own (no mass assignment)', async () => {
    const { agent, csrf, user } = await signedIn(app, { role: 'viewer' })
    const res = await agent.patch('/api/account').set('X-CSRF-Token', csrf).send({ email: 'x@example.test', role: 'admin' })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect((await agent.get('/api/auth/me')).body.email).toBe(user.email)
  })

  it('responds 401 UNAUTHENTICATED when signed out', async () => {
    const agent = request.agent(app)
    const csrf = await csrfFor(agent)
    const res = await agent.patch('/api/account').set('X-CSRF-Token', csrf).send({ name: 'X' })
    expect([res.status, res.body.error.code]).toEqual([401, 'UNAUTHENTICATED'])
  })
})

describe('POST /api/account/password', () => {
  it('changes the password, renews the session id, ends other sessions on request, and notifies', async () => {
    const user = await createUser({ role: 'pilot' })
    const a = await signInAs(app, user)
    const b = await signInAs(app, user)
    const res = await a.agent
      .post('/api/account/password')
      .set('X-CSRF-Token', a.csrf)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a-new-password', endOtherSessions: true })
    expect(res.status).toBe(204)
    expect(res.headers['set-cookie']?.[0]).toMatch(/^ellipsoid\.sid=/)
    expect((await a.agent.get('/api/auth/me')).status).toBe(200)
    expect((await b.agent.get('/api/auth/me')).status).toBe(401)
    expect((await mailsTo(user.email)).map((m) => m.subject)).toContain('Your Ellipsoid password was changed')
    await expect(signInAs(app, { ...user, password: 'a-new-password' })).resolves.toBeDefined()
  })

  it('responds 400 VALIDATION_FAILED naming currentPassword when it is wrong', async () => {
    const { agent, csrf } = await signedIn(app)
    const res = await agent.post('/api/account/password').set('X-CSRF-Token', csrf).send({ currentPassword: 'not-it', newPassword: 'a-new-password' })
    expect([res.status, res.body.error.code, res.body.error.details[0].path]).toEqual([400, 'VALIDATION_FAILED', 'currentPassword'])
  })

  it('refuses a new password over 72 bytes', async () => {
    const { agent, csrf } = await signedIn(app)
    const res = await agent.post('/api/account/password').set('X-CSRF-Token', csrf).send({ currentPassword: TEST_PASSWORD, newPassword: '🛩'.repeat(19) })
    expect([res.status, res.body.error.code, res.body.error.details[0].path]).toEqual([400, 'VALIDATION_FAILED', 'newPassword'])
  })
})

describe('POST /api/account/team', () => {
  it('switches to another team of the user, and the role follows', async () => {
    const { agent, csrf, user } = await signedIn(app, { role: 'viewer' })
    const second = await createTeam('Second Field')
    await Membership.create({ userId: user.id, teamId: second.id, role: 'admin' })
    const res = await agent.post('/api/account/team').set('X-CSRF-Token', csrf).send({ teamId: second.id })
    expect(res.status).toBe(200)
    expect(res.body.currentTeamId).toBe(second.id)
    expect(res.body.teams).toHaveLength(2)
    expect((await agent.get('/api/teams/current/invites')).status).toBe(200)
  })

  it('responds 404 NOT_FOUND for a team the user is not in', async () => {
    const { agent, csrf } = await signedIn(app)
    const foreign = await createTeam('Not Mine')
    const res = await agent.post('/api/account/team').set('X-CSRF-Token', csrf).send({ teamId: foreign.id })
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
  })
})
