import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { startMailSink, stopMailSink } from '../../server/services/mailSink.js'
import { createUser, csrfFor, resetDb, signedIn, TEST_PASSWORD } from './helpers.js'

const app = createApp()

beforeAll(async () => {
  await startMailSink()
})
afterAll(async () => {
  await stopMailSink()
})
beforeEach(resetDb)

describe('POST /api/auth/sign-in', () => {
  it('signs a user in and answers their MeDto', async () => {
    const user = await createUser({ role: 'pilot' })
    const agent = request.agent(app)
    const csrf = await csrfFor(agent)
    const res = await agent.post('/api/auth/sign-in').set('X-CSRF-Token', csrf).send({ email: user.email, password: TEST_PASSWORD })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ id: user.id, email: user.email, currentTeamId: user.teamId })
    expect(res.body.teams).toEqual([{ id: user.teamId, name: expect.any(String), role: 'pilot' }])
    const me = await agent.get('/api/auth/me')
    expect(me.status).toBe(200)
  })
})

describe('signedIn helper', () => {
  it('gives an agent that can change state with its token', async () => {
    const { agent, csrf } = await signedIn(app, { role: 'viewer' })
    const res = await agent.patch('/api/account').set('X-CSRF-Token', csrf).send({ units: 'imperial' })
    expect(res.status).toBe(200)
    expect(res.body.units).toBe('imperial')
  })
})
