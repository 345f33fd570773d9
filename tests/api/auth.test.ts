import { describe, expect, it, vi } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'
import { config } from '../../server/config.js'
import { pgPool } from '../../server/db.js'
import { hashToken } from '../../server/services/tokens.js'
import { createUser, csrfFor, linkIn, mailsTo, signedIn, TEST_PASSWORD, type Agent } from './helpers.js'
import { useMailSuite } from './mail-suite.js'

const app = createApp()

useMailSuite()

async function count(table: string): Promise<number> {
  const { rows } = await pgPool().query<{ n: number }>(`SELECT count(*)::int AS n FROM "${table}"`)
  return rows[0]!.n
}

function sidCookie(res: request.Response): string | undefined {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? [])
  return cookies.find((c) => c.startsWith('ellipsoid.sid='))
}

async function anonymous(): Promise<{ agent: Agent; csrf: string }> {
  const agent = request.agent(app)
  return { agent, csrf: await csrfFor(agent) }
}

async function signIn(agent: Agent, csrf: string, email: string, password: string) {
  return agent.post('/api/auth/sign-in').set('X-CSRF-Token', csrf).send({ email, password })
}

describe('GET /api/auth/csrf', () => {
  it('gives a token of at least 128 bits and keeps it for the session', async () => {
    const agent = request.agent(app)
    const a = await agent.get('/api/auth/csrf')
    const b = await agent.get('/api/auth/csrf')
    expect(a.status).toBe(200)
    expect(Buffer.from(a.body.token, 'base64url').length).toBeGreaterThanOrEqual(16)
    expect(b.body.token).toBe(a.body.token)
  })
})

describe('POST /api/auth/sign-up', () => {
  const body = { email: 'New.Pilot@Example.test', name: 'Nia Field', password: 'long-enough-pw', teamName: 'Fen Flyers' }

  it('creates the user, a team with them as admin, and signs them in', async () => {
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/auth/sign-up').set('X-CSRF-Token', csrf).send(body)
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ email: 'new.pilot@example.test', name: 'Nia Field', units: 'metric' })
    expect(res.body.teams).toEqual([{ id: res.body.currentTeamId, name: 'Fen Flyers', role: 'admin' }])
    expect((await agent.get('/api/auth/me')).status).toBe(200)
    const { rows } = await pgPool().query<{ password_hash: string }>('SELECT password_hash FROM users')
    expect(rows[0]!.password_hash).toMatch(/^\$2[aby]\$\d\d\$/)
  })

  it('responds 409 CONFLICT for an e-mail that already has an account', async () => {
    await createUser({ email: 'new.pilot@example.test' })
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/auth/sign-up').set('X-CSRF-Token', csrf).send(body)
    expect([res.status, res.body.error.code]).toEqual([409, 'CONFLICT'])
  })

  it('refuses a password over 72 bytes with a clear message and stores nothing', async () => {
    const { agent, csrf } = await anonymous()
    const res = await agent
      .post('/api/auth/sign-up')
      .set('X-CSRF-Token', csrf)
      .send({ ...body, password: 'é'.repeat(37) }) // 37 characters, 74 UTF-8 bytes
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect(res.body.error.details).toEqual([{ path: 'password', message: expect.stringMatching(/72 bytes.*refused/) }])
    expect(await count('users')).toBe(0)
  })

  it('accepts exactly 72 bytes, and the 71-byte prefix does not sign in', async () => {
    const password = 'x'.repeat(71) + 'y'
    const { agent, csrf } = await anonymous()
    expect((await agent.post('/api/auth/sign-up').set('X-CSRF-Token', csrf).send({ ...body, password })).status).toBe(201)
    const other = await anonymous()
    expect((await signIn(other.agent, other.csrf, body.email, 'x'.repeat(71))).status).toBe(401)
    expect((await signIn(other.agent, other.csrf, body.email, password)).status).toBe(200)
  })

  it('refuses a 7-character password', async () => {
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/auth/sign-up').set('X-CSRF-Token', csrf).send({ ...body, password: 'short77' })
    expect([res.status, res.body.error.code, res.body.error.details[0].path]).toEqual([400, 'VALIDATION_FAILED', 'password'])
  })
})

describe('POST /api/auth/sign-in', () => {
  it('answers the MeDto with every team of the user', async () => {
    const user = await createUser({ role: 'pilot' })
    const { agent, csrf } = await anonymous()
    const res = await signIn(agent, csrf, user.email.toUpperCase(), TEST_PASSWORD)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ id: user.id, email: user.email, currentTeamId: user.teamId })
    expect(res.body.teams).toEqual([{ id: user.teamId, name: expect.any(String), role: 'pilot' }])
  })

  it('gives the same 401 for a wrong password and for an unknown account', async () => {
    const user = await createUser()
    const { agent, csrf } = await anonymous()
    const wrong = await signIn(agent, csrf, user.email, 'not-the-password')
    const unknown = await signIn(agent, csrf, 'nobody@example.test', 'not-the-password')
    expect([wrong.status, wrong.body.error.code]).toEqual([401, 'UNAUTHENTICATED'])
    expect(unknown.status).toBe(wrong.status)
    expect(unknown.body).toEqual(wrong.body)
    expect((await agent.get('/api/auth/me')).status).toBe(401)
  })

  it('issues a new session id at sign-in and ends the pre-sign-in one', async () => {
    const user = await createUser()
    const agent = request.agent(app)
    const pre = await agent.get('/api/auth/csrf')
    const before = sidCookie(pre)!.split(';')[0]!
    const res = await signIn(agent, pre.body.token, user.email, TEST_PASSWORD)
    const after = sidCookie(res)!.split(';')[0]!
    expect(after).not.toBe(before)
    const replay = await request(app).get('/api/auth/me').set('Cookie', before)
    expect([replay.status, replay.body.error.code]).toEqual([401, 'UNAUTHENTICATED'])
    expect(res.headers['x-csrf-token']).not.toBe(pre.body.token)
  })

  it('sets an HttpOnly, SameSite=Lax session cookie with the idle timeout', async () => {
    const user = await createUser()
    const { agent, csrf } = await anonymous()
    const cookie = sidCookie(await signIn(agent, csrf, user.email, TEST_PASSWORD))!
    expect(cookie).toMatch(/HttpOnly/)
    expect(cookie).toMatch(/SameSite=Lax/)
    expect(cookie).toMatch(/Path=\//)
    const expiresMs = Date.parse(/Expires=([^;]+)/.exec(cookie)![1]!)
    expect((expiresMs - Date.now()) / 3_600_000).toBeCloseTo(8, 1) // SESSION_IDLE_MINUTES default 480
  })

  it('ends a session past its absolute lifetime whatever the activity', async () => {
    const { agent } = await signedIn(app)
    await pgPool().query(`UPDATE "session" SET sess = jsonb_set(sess::jsonb, '{signedInAtMs}', '0')::json`)
    expect((await agent.get('/api/auth/me')).status).toBe(401)
  })

  it('responds 429 RATE_LIMITED after 10 attempts on one account, even with the right password', async () => {
    const user = await createUser()
    const { agent, csrf } = await anonymous()
    for (let i = 0; i < 10; i++) expect((await signIn(agent, csrf, user.email, 'wrong-password')).status).toBe(401)
    const limited = await signIn(agent, csrf, user.email, TEST_PASSWORD)
    expect([limited.status, limited.body.error.code]).toEqual([429, 'RATE_LIMITED'])
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0)
  })

  it('responds 429 RATE_LIMITED after 100 attempts from one address across many accounts', async () => {
    const { agent, csrf } = await anonymous()
    for (let i = 0; i < 100; i++) expect((await signIn(agent, csrf, `guess${i}@example.test`, 'password1')).status).toBe(401)
    const limited = await signIn(agent, csrf, 'guess-last@example.test', 'password1')
    expect([limited.status, limited.body.error.code]).toEqual([429, 'RATE_LIMITED'])
  })

  it('counts only failures toward the address limit, so colleagues on one address can still sign in', async () => {
    const user = await createUser()
    const { agent, csrf } = await anonymous()
    for (let i = 0; i < 99; i++) expect((await signIn(agent, csrf, `guess${i}@example.test`, 'password1')).status).toBe(401)
    for (let i = 0; i < 5; i++) {
      const colleague = await anonymous()
      expect((await signIn(colleague.agent, colleague.csrf, user.email, TEST_PASSWORD)).status).toBe(200)
    }
    expect((await signIn(agent, csrf, 'guess-100@example.test', 'password1')).status).toBe(401)
    expect((await signIn(agent, csrf, 'guess-101@example.test', 'password1')).status).toBe(429)
  })

  it('counts parallel attempts exactly, so no more than 10 are checked', async () => {
    const user = await createUser()
    const { agent, csrf } = await anonymous()
    const all = await Promise.all(Array.from({ length: 15 }, () => signIn(agent, csrf, user.email, 'wrong-password')))
    const statuses = all.map((r) => r.status).sort()
    expect(statuses.filter((s) => s === 401)).toHaveLength(10)
    expect(statuses.filter((s) => s === 429)).toHaveLength(5)
  })
})

describe('POST /api/auth/sign-out', () => {
  it('destroys the session on the server', async () => {
    const { agent, csrf } = await signedIn(app)
    expect(await count('session')).toBe(1)
    expect((await agent.post('/api/auth/sign-out').set('X-CSRF-Token', csrf)).status).toBe(204)
    expect(await count('session')).toBe(0)
    expect((await agent.get('/api/auth/me')).status).toBe(401)
  })
})

describe('CSRF protection', () => {
  const body = { email: 'a@example.test', name: 'A', password: 'long-enough-pw', teamName: 'T' }

  it('responds 403 CSRF_FAILED without a token and stores nothing', async () => {
    await csrfFor(request.agent(app))
    const agent = request.agent(app)
    await csrfFor(agent)
    const res = await agent.post('/api/auth/sign-up').send(body)
    expect([res.status, res.body.error.code]).toEqual([403, 'CSRF_FAILED'])
    expect(await count('users')).toBe(0)
  })

  it('responds 403 CSRF_FAILED for a wrong token or another session\'s token', async () => {
    const { agent } = await anonymous()
    const other = await anonymous()
    for (const token of ['x'.repeat(43), other.csrf]) {
      const res = await agent.post('/api/auth/sign-up').set('X-CSRF-Token', token).send(body)
      expect([res.status, res.body.error.code]).toEqual([403, 'CSRF_FAILED'])
    }
    expect(await count('users')).toBe(0)
  })

  it('refuses a cross-site request and a foreign Origin even with the right token', async () => {
    const { agent, csrf, user } = await signedIn(app)
    const crossSite = await agent.patch('/api/account').set('X-CSRF-Token', csrf).set('Sec-Fetch-Site', 'cross-site').send({ name: 'Evil' })
    const foreign = await agent.patch('/api/account').set('X-CSRF-Token', csrf).set('Origin', 'https://evil.example').send({ name: 'Evil' })
    expect([crossSite.status, crossSite.body.error.code]).toEqual([403, 'CSRF_FAILED'])
    expect([foreign.status, foreign.body.error.code]).toEqual([403, 'CSRF_FAILED'])
    expect((await agent.get('/api/auth/me')).body.name).toBe(user.name)
  })

  it('refuses a signed-in write without the token and leaves the data unchanged', async () => {
    const { agent, user } = await signedIn(app)
    const res = await agent.patch('/api/account').send({ name: 'Changed' })
    expect([res.status, res.body.error.code]).toEqual([403, 'CSRF_FAILED'])
    expect((await agent.get('/api/auth/me')).body.name).toBe(user.name)
  })

  it('lets a same-origin request with the token through', async () => {
    const { agent, csrf } = await signedIn(app)
    const res = await agent.patch('/api/account').set('X-CSRF-Token', csrf).set('Sec-Fetch-Site', 'same-origin').send({ name: 'Changed' })
    expect([res.status, res.body.name]).toEqual([200, 'Changed'])
  })
})

describe('password reset through the local SMTP sink', () => {
  async function requestReset(email: string) {
    const { agent, csrf } = await anonymous()
    // A forged Host must not leak into the mailed link, which comes from PUBLIC_URL only.
    return agent
      .post('/api/auth/forgot-password')
      .set('X-CSRF-Token', csrf)
      .set('X-Forwarded-Host', 'evil.example')
      .send({ email })
  }

  async function resetLink(email: string): Promise<URL> {
    const mail = await vi.waitFor(async () => {
      const [m] = await mailsTo(email)
      if (!m) throw new Error('no mail yet')
      return m
    })
    expect(mail.subject).toMatch(/reset/i)
    return linkIn(mail.text, '/reset-password')
  }

  it('answers the same 202 for a known and an unknown e-mail', async () => {
    const user = await createUser()
    const known = await requestReset(user.email)
    const unknown = await requestReset('nobody@example.test')
    expect(known.status).toBe(202)
    expect(unknown.status).toBe(202)
    expect(unknown.body).toEqual(known.body)
    await resetLink(user.email)
    expect(await mailsTo('nobody@example.test')).toEqual([])
  })

  it('mails a single-use link that sets the password, ends sessions, notifies, and does not sign in', async () => {
    const user = await createUser()
    const existing = request.agent(app)
    const c = await csrfFor(existing)
    expect((await signIn(existing, c, user.email, TEST_PASSWORD)).status).toBe(200)
    await requestReset(user.email)
    const link = await resetLink(user.email)
    expect(link.origin).toBe(new URL(config().publicUrl).origin)
    const token = link.searchParams.get('token')!
    const { rows } = await pgPool().query<{ token_hash: string }>('SELECT token_hash FROM password_resets')
    expect(rows.map((r) => r.token_hash)).toEqual([hashToken(token)])

    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/auth/reset-password').set('X-CSRF-Token', csrf).send({ token, password: 'brand-new-pass' })
    expect(res.status).toBe(204)
    expect((await agent.get('/api/auth/me')).status).toBe(401)
    expect((await existing.get('/api/auth/me')).status).toBe(401)
    const again = await agent.post('/api/auth/reset-password').set('X-CSRF-Token', csrf).send({ token, password: 'another-pass1' })
    expect([again.status, again.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect((await signIn(agent, csrf, user.email, 'brand-new-pass')).status).toBe(200)
    const notices = (await mailsTo(user.email)).map((m) => m.subject)
    expect(notices).toContain('Your Ellipsoid password was changed')
  })

  it('lets exactly one of 10 parallel redemptions of one token succeed', async () => {
    const user = await createUser()
    await requestReset(user.email)
    const token = (await resetLink(user.email)).searchParams.get('token')!
    const { agent, csrf } = await anonymous()
    const all = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        agent.post('/api/auth/reset-password').set('X-CSRF-Token', csrf).send({ token, password: `parallel-pass-${i}` }),
      ),
    )
    expect(all.filter((r) => r.status === 204)).toHaveLength(1)
    expect(all.filter((r) => r.status === 400)).toHaveLength(9)
  })

  it('refuses an expired token', async () => {
    const user = await createUser()
    await requestReset(user.email)
    const token = (await resetLink(user.email)).searchParams.get('token')!
    await pgPool().query(`UPDATE password_resets SET expires_at = now() - interval '1 minute'`)
    const { agent, csrf } = await anonymous()
    const res = await agent.post('/api/auth/reset-password').set('X-CSRF-Token', csrf).send({ token, password: 'brand-new-pass' })
    expect([res.status, res.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    expect((await signIn(agent, csrf, user.email, TEST_PASSWORD)).status).toBe(200)
  })
})
