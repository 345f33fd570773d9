import { describe, expect, it } from 'vitest'
import type { Request, Response } from 'express'
import { ConnectionRefusedError, DatabaseError } from 'sequelize'
import { errorHandler } from '../../server/middleware/errorHandler.js'
import { tooMany } from '../../server/errors.js'

function run(err: unknown): { status: number; body: unknown; headers: Record<string, string> } {
  const out = { status: 0, body: undefined as unknown, headers: {} as Record<string, string> }
  const res = {
    headersSent: false,
    setHeader: (k: string, v: string) => (out.headers[k] = v),
    status(code: number) {
      out.status = code
      return this
    },
    json(b: unknown) {
      out.body = b
      return this
    },
  } as unknown as Response
  errorHandler(err, { id: 'test' } as unknown as Request, res, () => undefined)
  return out
}

describe('errorHandler', () => {
  it('maps an unreachable database to a generic 503 UNAVAILABLE', () => {
    const refused = run(new ConnectionRefusedError(new Error('connect ECONNREFUSED 127.0.0.1:5432')))
    const pgShutdown = run(Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' }))
    for (const r of [refused, pgShutdown]) {
      expect(r.status).toBe(503)
      expect(r.body).toEqual({ error: { code: 'UNAVAILABLE', message: expect.not.stringMatching(/ECONNREFUSED|5432|administrator/) } })
    }
  })

  it('adds Retry-After to a 429', () => {
    const e = tooMany()
    e.retryAfterS = 42
    const r = run(e)
    expect([r.status, r.headers['Retry-After']]).toEqual([429, '42'])
  })
})

describe('errorHandler on an unexpected error', () => {
  it('answers a generic 500 INTERNAL: no stack frame, file path, SQL or library name', () => {
    const plain = new Error('boom at /work/main/server/services/x.ts:12')
    const sql = new DatabaseError(Object.assign(new Error('invalid input syntax for type integer: "x"'), { sql: 'SELECT * FROM flights WHERE id = $1' }))
    for (const err of [plain, sql, { weird: true }, 'a thrown string']) {
      const r = run(err)
      expect(r.status).toBe(500)
      expect(r.body).toEqual({ error: { code: 'INTERNAL', message: 'Internal error' } })
      expect(JSON.stringify(r.body)).not.toMatch(/\bat |\/work|\.ts|SELECT|Sequelize|flights/)
    }
  })
})
