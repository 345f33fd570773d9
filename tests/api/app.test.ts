import { describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'

describe('createApp headers', () => {
  it('sends a request id, no-store on /api, a strict CSP, and no HSTS over plain http', async () => {
    const res = await request(createApp()).get('/api/health')
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/)
    expect(res.headers['cache-control']).toBe('no-store')
    const csp = res.headers['content-security-policy'] as string
    expect(csp).toContain("base-uri 'none'")
    expect(csp).toContain("frame-ancestors 'none'")
    expect(csp).toContain("object-src 'none'")
    expect(csp).not.toContain('upgrade-insecure-requests')
    expect(res.headers['strict-transport-security']).toBeUndefined()
    expect(res.headers['x-powered-by']).toBeUndefined()
    expect(res.headers['x-content-type-options']).toBe('nosniff')
  })

  it('checks CSRF before routing, so an unknown path gets 403 CSRF_FAILED as JSON for a tokenless POST', async () => {
    const res = await request(createApp()).post('/api/nope').send({})
    expect(res.headers['content-type']).toMatch(/^application\/json; charset=utf-8/)
    expect([res.status, res.body.error.code]).toEqual([403, 'CSRF_FAILED'])
  })
})

describe('security headers beyond the API', () => {
  function expectStrictHeaders(res: request.Response) {
    const csp = res.headers['content-security-policy'] as string
    for (const d of ["base-uri 'none'", "frame-ancestors 'none'", "object-src 'none'"]) expect(csp).toContain(d)
    const scriptSrc = csp.split(';').find((d) => d.trim().startsWith('script-src')) ?? ''
    expect(scriptSrc).not.toMatch(/unsafe-inline|unsafe-eval/)
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['referrer-policy']).toBe('no-referrer')
    expect(res.headers['x-powered-by']).toBeUndefined()
  }

  it('GET / (the client page, or the plain 404 when no build exists) carries the same strict headers', async () => {
    const res = await request(createApp()).get('/')
    expectStrictHeaders(res)
    if (res.status === 200) expect(res.headers['content-type']).toMatch(/^text\/html; charset=utf-8/i)
  })

  it('an API response, an API 404 and a refused write carry them too, with no-store and a JSON charset', async () => {
    const app = createApp()
    for (const res of [await request(app).get('/api/health'), await request(app).get('/api/nope'), await request(app).post('/api/courses').send({})]) {
      expectStrictHeaders(res)
      expect(res.headers['cache-control']).toBe('no-store')
      expect(res.headers['content-type']).toMatch(/^application\/json; charset=utf-8/)
    }
  })
})
