import { beforeEach, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { pgPool } from '../../server/db.js'
import { DEMO_TEAM_NAME, DEMO_USERS, seedDemoIfEmpty } from '../../server/scripts/seed/demo.js'
import { createUser, csrfFor, resetDb } from './helpers.js'

const app = createApp()
beforeEach(resetDb)

describe('seedDemoIfEmpty', () => {
  it('creates the demo club with one user per role who can sign in', async () => {
    expect(await seedDemoIfEmpty()).toBe(true)
    const { rows } = await pgPool().query<{ email: string; role: string; team: string }>(
      `SELECT u.email, m.role, t.name AS team FROM users u JOIN memberships m ON m.user_id = u.id JOIN teams t ON t.id = m.team_id ORDER BY u.id`,
    )
    expect(rows).toEqual(DEMO_USERS.map((u) => ({ email: u.email, role: u.role, team: DEMO_TEAM_NAME })))
    const viewer = DEMO_USERS.find((u) => u.role === 'viewer')!
    const agent = request.agent(app)
    const csrf = await csrfFor(agent)
    const res = await agent.post('/api/auth/sign-in').set('X-CSRF-Token', csrf).send({ email: viewer.email, password: viewer.password })
    expect(res.status).toBe(200)
    expect(res.body.teams).toEqual([{ id: expect.any(Number), name: DEMO_TEAM_NAME, role: 'viewer' }])
  })

  it('does nothing when any user exists', async () => {
    await createUser()
    expect(await seedDemoIfEmpty()).toBe(false)
    const { rows } = await pgPool().query('SELECT count(*)::int AS n FROM users')
    expect(rows[0].n).toBe(1)
  })
})
