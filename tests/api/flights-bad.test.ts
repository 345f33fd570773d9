import './env-small-upload.js'
import fs from 'node:fs'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import type { Express } from 'express'
import { signedIn, type SignedIn } from './helpers.js'
import { pgPool } from '../../server/db.js'
import { makeCourse, makeSetup } from './fixtures-db.js'
import { LOGS, storedCounts, upload, waitForStatus } from './flights-helpers.js'
import { useFlightSuite } from './flights-suite.js'

const BAD = path.join(LOGS, 'bad')
const MAPPING = fs.readFileSync(path.join(BAD, 'mapping.json'), 'utf8')
const HEADER = 'time_ms,lat,lon,alt_m,rssi_dbm,lq,snr,sats'
const goodRow = (i: number) => `${i * 100},52.05,-1.3,50,-70,90,5,9`

let app: Express
let s: SignedIn
let courseId: number
let setupId: number
let before: Awaited<ReturnType<typeof storedCounts>>

useFlightSuite(async (x) => {
  ;({ app, s, courseId, setupId } = x)
  before = await storedCounts()
})

/** Nothing of the refused file is left: no flight, no samples, no temp or raw file. */
async function expectNoTrace(): Promise<void> {
  const after = await storedCounts()
  expect(after).toEqual({ ...before, flights: 0, samples: 0 })
}

describe('POST /api/flights (bad files refused at once)', () => {
  const cases: Array<[string, number, string, RegExp, { row?: number; column?: string }?]> = [
    ['empty.csv', 422, 'UNPROCESSABLE', /empty/],
    ['header-only.csv', 422, 'UNPROCESSABLE', /no data rows/],
    ['binary.csv', 415, 'UNSUPPORTED_MEDIA_TYPE', /binary/],
    ['truncated.csv.gz', 422, 'UNPROCESSABLE', /truncated or damaged/],
    ['out-of-range.csv', 422, 'UNPROCESSABLE', /1 of 20 rows are bad/, { row: 9, column: 'lat' }],
    ['non-numeric-signal.csv', 422, 'UNPROCESSABLE', /rows are bad/, { row: 6, column: 'rssi_dbm' }],
    ['time-backwards.csv', 422, 'UNPROCESSABLE', /rows are bad/, { row: 12, column: 'time_ms' }],
  ]
  for (const [file, status, code, message, where] of cases) {
    it(`answers ${status} ${code} for ${file}${where ? ` naming row ${where.row}, column ${where.column}` : ''}`, async () => {
      const res = await upload(s, path.join(BAD, file), { courseId, setupId, mapping: MAPPING })
      expect([res.status, res.body.error?.code]).toEqual([status, code])
      expect(res.body.error.message).toMatch(message)
      if (where) expect(res.body.error.details[0]).toMatchObject(where)
      await expectNoTrace()
    })
  }

  it('answers 422 naming the row for a row with hundreds of columns', async () => {
    const rows = Array.from({ length: 20 }, (_, i) => goodRow(i))
    rows[3] = goodRow(3) + ',1'.repeat(400)
    const res = await upload(s, Buffer.from([HEADER, ...rows].join('\n')), { courseId, setupId, mapping: MAPPING })
    expect([res.status, res.body.error.code]).toEqual([422, 'UNPROCESSABLE'])
    expect(res.body.error.details[0]).toMatchObject({ row: 5, column: '#9' })
    await expectNoTrace()
  })

  it('answers 422 naming the row for a huge single line', async () => {
    const text = [HEADER, goodRow(0), goodRow(1), '9'.repeat(2 * 1024 * 1024)].join('\n')
    const res = await upload(s, Buffer.from(text), { courseId, setupId, mapping: MAPPING })
    expect([res.status, res.body.error.code]).toEqual([422, 'UNPROCESSABLE'])
    expect(res.body.error.details[0]).toMatchObject({ row: 4 })
    expect(res.body.error.message).toMatch(/Row 4 is longer than/)
    await expectNoTrace()
  })

  it('answers 413 PAYLOAD_TOO_LARGE over the size limit and keeps no temp file', async () => {
    const res = await upload(s, Buffer.alloc(4 * 1024 * 1024, 'a'), { courseId, setupId, mapping: MAPPING })
    expect([res.status, res.body.error.code]).toEqual([413, 'PAYLOAD_TOO_LARGE'])
    await expectNoTrace()
  })

  it('answers 415 for a name outside the allowlist and for UTF-16 text', async () => {
    const png = await upload(s, Buffer.from('x'), { courseId, setupId, mapping: MAPPING, filename: 'photo.png' })
    expect([png.status, png.body.error.code]).toEqual([415, 'UNSUPPORTED_MEDIA_TYPE'])
    const utf16 = Buffer.from('\uFEFF' + [HEADER, goodRow(0)].join('\n'), 'utf16le')
    const res = await upload(s, utf16, { courseId, setupId, mapping: MAPPING })
    expect([res.status, res.body.error.code]).toEqual([415, 'UNSUPPORTED_MEDIA_TYPE'])
    await expectNoTrace()
  })

  it('answers 422 naming the column when the mapping uses a column the file lacks', async () => {
    const res = await upload(s, Buffer.from(['t,lat,lon', '0,52,-1'].join('\n')), { courseId, setupId, mapping: MAPPING })
    expect([res.status, res.body.error.code]).toEqual([422, 'UNPROCESSABLE'])
    expect(res.body.error.details[0]).toMatchObject({ row: 1, column: 'time_ms' })
    await expectNoTrace()
  })

  it('answers 400 VALIDATION_FAILED for a missing mapping or bad fields', async () => {
    const noMap = await upload(s, path.join(LOGS, 'comma.csv'), { courseId, setupId, mapping: null })
    expect([noMap.status, noMap.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    const badJson = await upload(s, path.join(LOGS, 'comma.csv'), { courseId, setupId, mapping: '{not json' })
    expect([badJson.status, badJson.body.error.code]).toEqual([400, 'VALIDATION_FAILED'])
    await expectNoTrace()
  })

  it('answers 404 NOT_FOUND (not 400) for another team\'s course or setup, the same as for a missing id, keeping nothing', async () => {
    const other = await signedIn(app, { role: 'admin' })
    const foreignCourse = await makeCourse(other.team.id, other.user.id)
    const foreignSetup = await makeSetup(other.team.id, other.user.id)
    const missing = 2_000_000_000
    const answers = []
    for (const ids of [
      { courseId: foreignCourse.id, setupId },
      { courseId: missing, setupId },
      { courseId, setupId: foreignSetup.id },
      { courseId, setupId: missing },
    ]) {
      const res = await upload(s, path.join(LOGS, 'comma.csv'), { ...ids, mapping: MAPPING })
      expect([res.status, res.body.error.code]).toEqual([404, 'NOT_FOUND'])
      answers.push(res.body)
    }
    expect(answers[0]).toEqual(answers[1])
    expect(answers[2]).toEqual(answers[3])
    expect(answers[0].error.details).toEqual([{ path: 'courseId', message: 'not found' }])
    expect(answers[2].error.details).toEqual([{ path: 'setupId', message: 'not found' }])
    const { rows } = await pgPool().query<{ n: string }>('SELECT count(*) AS n FROM imports')
    expect(Number(rows[0]!.n)).toBe(0)
    await expectNoTrace()
  })
})

describe('POST /api/flights (bad rows found by the background import)', () => {
  it('fails a large file whose bad rows come after the first megabyte, storing nothing', async () => {
    const lines = [HEADER]
    for (let i = 0; i < 40_000; i++) lines.push(i > 30_000 && i % 10 === 0 ? `${i * 100},52.05,-1.3,50,loud,90,5,9` : goodRow(i))
    const res = await upload(s, Buffer.from(lines.join('\n')), { courseId, setupId, mapping: MAPPING })
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    const st = await waitForStatus(s, res.body.id)
    expect(st.status).toBe('failed')
    expect(st.stored).toBe(false)
    expect(st.failure).toMatchObject({ status: 422, code: 'UNPROCESSABLE' })
    expect(st.failure!.details![0]).toMatchObject({ row: 30_012, column: 'rssi_dbm' })
    expect(st.failure!.details!.length).toBe(50)
    await expectNoTrace()
    const list = await s.agent.get('/api/flights')
    expect(list.body).toEqual({ items: [], total: 0 })
  })
})

describe('POST /api/flights (who may upload)', () => {
  it('refuses a viewer with 403 and a caller without a session before reading the body, keeping nothing', async () => {
    const viewer = await signedIn(app, { role: 'viewer' })
    const res = await upload(viewer, path.join(LOGS, 'comma.csv'), { courseId, setupId, mapping: MAPPING })
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
    const { default: request } = await import('supertest')
    const anon = await request(app).post('/api/flights').attach('file', path.join(LOGS, 'comma.csv'))
    expect(anon.status).toBe(403) // no session, so no CSRF token: refused before anything is read
    await expectNoTrace()
  })

  it('refuses an upload without the CSRF token', async () => {
    const res = await s.agent.post('/api/flights').field('courseId', String(courseId)).attach('file', path.join(LOGS, 'comma.csv'))
    expect([res.status, res.body.error.code]).toEqual([403, 'CSRF_FAILED'])
    await expectNoTrace()
  })
})
