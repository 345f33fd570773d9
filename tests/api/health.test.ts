import { describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../server/app.js'

describe('GET /api/health', () => {
  it('reports the database up', async () => {
    const res = await request(createApp()).get('/api/health')
    expect(res.status).toBe(200)
    expect(res.body.database).toBe('up')
  })
})

describe('unknown /api path', () => {
  it('responds 404 NOT_FOUND in the one error shape', async () => {
    const res = await request(createApp()).get('/api/no-such-thing')
    expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
  })
})
