import { describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.js'
import { pgPool } from '../../server/db.js'
import { changeMemberRole } from '../../server/services/members.js'
import { createTeam, createUser, linkIn, mailsTo, signedIn, signedInElsewhere, signedInToTeam } from './helpers.js'
import { useMailSuite } from './mail-suite.js'

const app = createApp()

useMailSuite()

describe('GET /api/teams/current/members', () => {
  it('lists the members of the current team only', async () => {
    const admin = await signedIn(app)
    const pilot = await createUser({ role: 'pilot', teamId: admin.team.id })
    await signedInElsewhere(app)
    const res = await admin.agent.get('/api/teams/current/members')
    expect(res.status).toBe(200)
    expect(res.body.total).toBe(2)
    expect(res.body.items.map((m: { userId: number }) => m.userId).sort()).toEqual([admin.user.id, pilot.id].sort())
    expect(JSON.stringify(res.body)).not.toMatch(/\$2[aby]\$|password/i)
  })
})

describe('PATCH /api/teams/current/members/:userId', () => {
  it('changes a role, effective on the member\'s next request', async () => {
    const admin = await signedIn(app)
    const pilot = await signedInToTeam(app, admin.team.id, 'pilot')
    expect((await pilot.agent.get('/api/teams/current/invites')).status).toBe(403)
    const res = await admin.agent
      .patch(`/api/teams/current/members/${pilot.user.id}`)
      .set('X-CSRF-Token', admin.csrf)
      .send({ role: 'admin' })
    expect(res.body).toEqual({ userId: pilot.user.id, email: pilot.user.email, name: pilot.user.name, role: 'admin' })
    expect((await pilot.agent.get('/api/teams/current/invites')).status).toBe(200)
  })

  it('responds 409 CONFLICT when the last admin would be demoted', async () => {
    const admin = await signedIn(app)
    const res = await admin.agent
      .patch(`/api/teams/current/members/${admin.user.id}`)
      .set('X-CSRF-Token', admin.csrf)
      .send({ role: 'viewer' })
    expect([res.status, res.body.error.code]).toEqual([409, 'CONFLICT'])
  })

  it('lets only one of two admins demoting each other at once succeed', async () => {
    const a = await signedIn(app)
    const b = await signedInToTeam(app, a.team.id, 'admin')
    const [ra, rb] = await Promise.all([
      a.agent.patch(`/api/teams/current/members/${b.user.id}`).set('X-CSRF-Token', a.csrf).send({ role: 'pilot' }),
      b.agent.patch(`/api/teams/current/members/${a.user.id}`).set('X-CSRF-Token', b.csrf).send({ role: 'pilot' }),
    ])
    // The loser sees either the lock (409) or, if it started after the winner, its own lost role (403).
    expect([ra.status, rb.status].filter((s) => s === 200)).toHaveLength(1)
    expect([403, 409]).toContain([ra, rb].find((r) => r.status !== 200)!.status)
    const { rows } = await pgPool().query(`SELECT count(*)::int AS n FROM memberships WHERE team_id = $1 AND role = 'admin'`, [a.team.id])
    expect(rows[0].n).toBe(1)
  })

  it('serialises simultaneous demotions in the service with a row lock (changeMemberRole)', async () => {
    const team = await createTeam()
    const a = await createUser({ role: 'admin', teamId: team.id })
    const b = await createUser({ role: 'admin', teamId: team.id })
    const results = await Promise.allSettled([changeMemberRole(team.id, a.id, 'pilot'), changeMemberRole(team.id, b.id, 'pilot')])
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1)
    const rejected = results.find((r) => r.status === 'rejected') as PromiseRejectedResult
    expect(rejected.reason).toMatchObject({ status: 409, code: 'CONFLICT' })
  })

  it('responds 404 NOT_FOUND for a member of another team', async () => {
    const admin = await signedIn(app)
    const other = await signedInElsewhere(app, 'pilot')
    const res = await admin.agent
      .patch(`/api/teams/current/members/${other.user.id}`)
      .set('X-CSRF-Token', admin.csrf)
      .send({ role: 'viewer' })
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
    const { rows } = await pgPool().query('SELECT role FROM memberships WHERE user_id = $1', [other.user.id])
    expect(rows).toEqual([{ role: 'pilot' }])
  })

  it('responds 400 VALIDATION_FAILED for an unknown role', async () => {
    const admin = await signedIn(app)
    const res = await admin.agent
      .patch(`/api/teams/current/members/${admin.user.id}`)
      .set('X-CSRF-Token', admin.csrf)
      .send({ role: 'owner' })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
  })
})

describe('DELETE /api/teams/current/members/:userId', () => {
  it('removes a member, who then loses access to the team', async () => {
    const admin = await signedIn(app)
    const viewer = await signedInToTeam(app, admin.team.id, 'viewer')
    const res = await admin.agent.delete(`/api/teams/current/members/${viewer.user.id}`).set('X-CSRF-Token', admin.csrf)
    expect(res.status).toBe(204)
    expect((await viewer.agent.get('/api/teams/current/members')).status).toBe(401)
  })

  it('responds 409 CONFLICT for the last admin and 404 for another team\'s member', async () => {
    const admin = await signedIn(app)
    const other = await signedInElsewhere(app, 'viewer')
    const self = await admin.agent.delete(`/api/teams/current/members/${admin.user.id}`).set('X-CSRF-Token', admin.csrf)
    const foreign = await admin.agent.delete(`/api/teams/current/members/${other.user.id}`).set('X-CSRF-Token', admin.csrf)
    expect([self.status, self.body.error.code]).toEqual([409, 'CONFLICT'])
    expect([foreign.status, foreign.body.error.code]).toEqual([404, 'NOT_FOUND'])
  })
})

describe('POST /api/teams/current/invites', () => {
  it('stores a 7-day invite and mails its link through the SMTP sink', async () => {
    const admin = await signedIn(app)
    const res = await admin.agent
      .post('/api/teams/current/invites')
      .set('X-CSRF-Token', admin.csrf)
      .send({ email: 'Newcomer@Example.test', role: 'pilot' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ email: 'newcomer@example.test', role: 'pilot', acceptedAt: null })
    const days = (Date.parse(res.body.expiresAt) - Date.now()) / 86_400_000
    expect(days).toBeCloseTo(7, 1)
    const [mail] = await mailsTo('newcomer@example.test')
    expect(mail!.subject).toContain(admin.team.name)
    expect(linkIn(mail!.text, '/accept-invite').searchParams.get('token')).toMatch(/^[A-Za-z0-9_-]{43}$/)
  })

  it('lets an instructor invite viewers only', async () => {
    const admin = await signedIn(app)
    const instructor = await signedInToTeam(app, admin.team.id, 'instructor')
    const send = (role: string) =>
      instructor.agent.post('/api/teams/current/invites').set('X-CSRF-Token', instructor.csrf).send({ email: `x-${role}@example.test`, role })
    expect((await send('viewer')).status).toBe(201)
    const pilot = await send('pilot')
    expect([pilot.status, pilot.body.error.code]).toEqual([403, 'FORBIDDEN'])
    expect(await mailsTo('x-pilot@example.test')).toEqual([])
  })

  it('responds 409 CONFLICT for someone already in the team', async () => {
    const admin = await signedIn(app)
    const pilot = await createUser({ role: 'pilot', teamId: admin.team.id })
    const res = await admin.agent.post('/api/teams/current/invites').set('X-CSRF-Token', admin.csrf).send({ email: pilot.email, role: 'viewer' })
    expect([res.status, res.body.error.code]).toEqual([409, 'CONFLICT'])
  })
})

describe('GET and DELETE /api/teams/current/invites', () => {
  it('lists and withdraws the team\'s invites; another team\'s invite answers 404', async () => {
    const admin = await signedIn(app)
    const other = await signedInElsewhere(app)
    const created = await admin.agent.post('/api/teams/current/invites').set('X-CSRF-Token', admin.csrf).send({ email: 'v@example.test', role: 'viewer' })
    const list = await admin.agent.get('/api/teams/current/invites')
    expect(list.body).toEqual({ items: [created.body], total: 1 })
    expect((await other.agent.get('/api/teams/current/invites')).body.total).toBe(0)
    const foreign = await other.agent.delete(`/api/teams/current/invites/${created.body.id}`).set('X-CSRF-Token', other.csrf)
    expect([foreign.status, foreign.body.error.code]).toEqual([404, 'NOT_FOUND'])
    expect((await admin.agent.delete(`/api/teams/current/invites/${created.body.id}`).set('X-CSRF-Token', admin.csrf)).status).toBe(204)
    expect((await admin.agent.get('/api/teams/current/invites')).body.total).toBe(0)
  })
})
