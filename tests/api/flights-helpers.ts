// Helpers for the flight suites: upload a fixture, wait for its status by polling (bounded), count what is stored.
import fs from 'node:fs'
import path from 'node:path'
import { expect } from 'vitest'
import { pgPool } from '../../server/db.js'
import { config } from '../../server/config.js'
import type { FlightStatusDto } from '../../shared/types/flight.js'
import type { SignedIn } from './helpers.js'

export const LOGS = path.resolve('fixtures', 'logs')

/** Reads a fixture's mapping JSON text. */
export function mappingText(name: string): string {
  return fs.readFileSync(path.join(LOGS, `${name.replace(/\.gz$/, '')}.mapping.json`), 'utf8')
}

export interface UploadOptions {
  courseId: number
  setupId: number
  name?: string
  mapping?: string | null
  filename?: string
}

/** POSTs a file (path or buffer) as multipart with the metadata fields. */
export function upload(s: SignedIn, file: string | Buffer, o: UploadOptions) {
  let req = s.agent
    .post('/api/flights')
    .set('X-CSRF-Token', s.csrf)
    .field('courseId', String(o.courseId))
    .field('setupId', String(o.setupId))
    .field('name', o.name ?? 'Fixture flight')
    .field('flownOn', '2026-05-16')
    .field('notes', 'uploaded by a test')
  if (o.mapping) req = req.field('mapping', o.mapping)
  return typeof file === 'string'
    ? req.attach('file', file, o.filename ?? path.basename(file))
    : req.attach('file', file, o.filename ?? 'log.csv')
}

/** Polls the status endpoint until the flight is ready or failed (at most ~60 s of 100 ms polls). */
export async function waitForStatus(s: Pick<SignedIn, 'agent'>, id: number): Promise<FlightStatusDto> {
  for (let i = 0; i < 600; i++) {
    const res = await s.agent.get(`/api/flights/${id}/status`)
    expect(res.status).toBe(200)
    const st = res.body as FlightStatusDto
    if (st.status === 'ready' || st.status === 'failed') return st
    await new Promise((r) => setTimeout(r, 100))
  }
  throw new Error(`flight ${id} did not finish`)
}

/** Rows in flights and samples, and files left in tmp/ and raw/. */
export async function storedCounts(): Promise<{ flights: number; samples: number; tmpFiles: number; rawFiles: number }> {
  const { rows } = await pgPool().query<{ f: string; s: string }>('SELECT (SELECT count(*) FROM flights) AS f, (SELECT count(*) FROM samples) AS s')
  const count = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d).length : 0)
  return {
    flights: Number(rows[0]!.f),
    samples: Number(rows[0]!.s),
    tmpFiles: count(path.join(config().dataDir, 'tmp')),
    rawFiles: count(path.join(config().dataDir, 'raw')),
  }
}
