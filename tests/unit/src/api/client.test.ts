import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import {
  ApiError,
  apiDelete,
  apiGet,
  apiPost,
  resetCsrfToken,
  setUnauthenticatedHandler,
  toApiError,
} from '@/api/client'

type Call = { url: string; init: RequestInit }
let calls: Call[]
let replies: Array<() => Response>

function json(status: number, body: unknown): () => Response {
  return () =>
    new Response(body === undefined ? null : JSON.stringify(body), {
      status,
      headers: { 'Content-Type': 'application/json' },
    })
}
const header = (c: Call, name: string) => (c.init.headers as Record<string, string>)[name]

beforeEach(() => {
  calls = []
  replies = []
  resetCsrfToken()
  setUnauthenticatedHandler(null)
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit) => {
      calls.push({ url, init })
      const next = replies.shift()
      if (!next) throw new Error(`unexpected fetch ${init.method} ${url}`)
      return next()
    }),
  )
})
afterEach(() => vi.unstubAllGlobals())

describe('request', () => {
  it('GETs JSON under /api with same-origin credentials and no CSRF header', async () => {
    replies.push(json(200, { items: [], total: 0 }))
    await expect(apiGet('/teams/current/members')).resolves.toEqual({ items: [], total: 0 })
    expect(calls[0]?.url).toBe('/api/teams/current/members')
    expect(calls[0]?.init.credentials).toBe('same-origin')
    expect(header(calls[0]!, 'X-CSRF-Token')).toBeUndefined()
  })

  it('fetches the CSRF token once and sends it on every state-changing call', async () => {
    replies.push(json(200, { token: 'tok-1' }), json(201, { id: 1 }), json(204, undefined))
    await apiPost('/teams/current/invites', { email: 'a@example.test', role: 'viewer' })
    await expect(apiDelete('/teams/current/invites/1')).resolves.toBeNull()
    expect(calls.map((c) => `${c.init.method} ${c.url}`)).toEqual([
      'GET /api/auth/csrf',
      'POST /api/teams/current/invites',
      'DELETE /api/teams/current/invites/1',
    ])
    expect(header(calls[1]!, 'X-CSRF-Token')).toBe('tok-1')
    expect(header(calls[2]!, 'X-CSRF-Token')).toBe('tok-1')
    expect(JSON.parse(String(calls[1]?.init.body))).toEqual({ email: 'a@example.test', role: 'viewer' })
  })

  it('refetches the token and retries once after 403 CSRF_FAILED', async () => {
    replies.push(
      json(200, { token: 'stale' }),
      json(403, { error: { code: 'CSRF_FAILED', message: 'Bad token' } }),
      json(200, { token: 'fresh' }),
      json(200, { ok: true }),
    )
    await expect(apiPost('/account/team', { teamId: 2 })).resolves.toEqual({ ok: true })
    expect(header(calls[1]!, 'X-CSRF-Token')).toBe('stale')
    expect(header(calls[3]!, 'X-CSRF-Token')).toBe('fresh')
  })

  it('gives up after the one retry when CSRF fails again', async () => {
    const refusal = json(403, { error: { code: 'CSRF_FAILED', message: 'Bad token' } })
    replies.push(json(200, { token: 'a' }), refusal, json(200, { token: 'b' }), refusal)
    await expect(apiPost('/account/team', { teamId: 2 })).rejects.toMatchObject({
      status: 403,
      code: 'CSRF_FAILED',
    })
    expect(calls).toHaveLength(4)
  })

  it('does not retry a plain 403 FORBIDDEN', async () => {
    replies.push(json(200, { token: 't' }), json(403, { error: { code: 'FORBIDDEN', message: 'Admins only' } }))
    await expect(apiDelete('/teams/current/members/3')).rejects.toMatchObject({ code: 'FORBIDDEN' })
    expect(calls).toHaveLength(2)
  })

  it('turns the error body into an ApiError with status, code, message and details', async () => {
    const details = [{ path: 'email', message: 'Enter a valid e-mail address' }]
    replies.push(json(200, { token: 't' }), json(400, { error: { code: 'VALIDATION_FAILED', message: 'Invalid data', details } }))
    const err = await apiPost('/auth/sign-up', {}).catch((e: unknown) => e)
    expect(err).toBeInstanceOf(ApiError)
    expect(err).toMatchObject({ status: 400, code: 'VALIDATION_FAILED', message: 'Invalid data', details })
  })

  it('reports an unreachable server as status 0 UNAVAILABLE', async () => {
    replies.push(() => {
      throw new TypeError('Failed to fetch')
    })
    await expect(apiGet('/auth/me')).rejects.toMatchObject({ status: 0, code: 'UNAVAILABLE' })
  })

  it('calls the unauthenticated handler on a 401 outside /auth/', async () => {
    const handler = vi.fn()
    setUnauthenticatedHandler(handler)
    replies.push(json(401, { error: { code: 'UNAUTHENTICATED', message: 'Please sign in' } }))
    await expect(apiGet('/teams/current/members')).rejects.toMatchObject({ status: 401 })
    expect(handler).toHaveBeenCalledWith('/teams/current/members')
  })

  it('leaves a 401 from /auth/ (wrong password) to the caller alone', async () => {
    const handler = vi.fn()
    setUnauthenticatedHandler(handler)
    replies.push(json(200, { token: 't' }), json(401, { error: { code: 'UNAUTHENTICATED', message: 'Wrong e-mail or password' } }))
    await expect(apiPost('/auth/sign-in', {})).rejects.toMatchObject({ message: 'Wrong e-mail or password' })
    expect(handler).not.toHaveBeenCalled()
  })
})

describe('toApiError', () => {
  it('falls back to a plain message for a body that is not the API error shape', () => {
    expect(toApiError(429, '<html>')).toMatchObject({ status: 429, code: 'RATE_LIMITED' })
    expect(toApiError(502, null)).toMatchObject({ status: 502, code: 'INTERNAL' })
    expect(toApiError(502, null).message).toMatch(/HTTP 502/)
  })
})
