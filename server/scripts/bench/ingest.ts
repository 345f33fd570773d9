// Ingest benchmark: (a) bare COPY of a generated log into a scratch table indexed like samples, against (b) the whole
// import through the real HTTP API (upload → parse/validate → COPY → analysis → ready) with the server in a child
// process whose resident memory is sampled from /proc. Needs its own database (DATABASE_URL).
// Run: npx tsx server/scripts/bench/ingest.ts [rows=1000000] [bigRows=3000000]
import { execFileSync, spawn, type ChildProcess } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { once } from 'node:events'
import { pipeline } from 'node:stream/promises'
import copyStreams from 'pg-copy-streams'
import { closeDb, migrator, pgPool, sequelize } from '../../db.js'
import { Course } from '../../models/Course.js'
import { LinkSetup } from '../../models/LinkSetup.js'
import { Membership } from '../../models/Membership.js'
import { Team } from '../../models/Team.js'
import { User } from '../../models/User.js'
import { hashPassword } from '../../services/passwords.js'
import type { ColumnMapping } from '../../../shared/import/mapping.js'
import { waitForHealth } from '../../../tests/e2e/support/health.js'

const ROWS = Number(process.argv[2] ?? 1_000_000)
const BIG_ROWS = Number(process.argv[3] ?? 3_000_000)
const PORT = Number(process.env.BENCH_INGEST_PORT ?? 3391)
const HEADER = ['time_ms', 'lat', 'lon', 'alt_m', 'rssi_dbm', 'lq', 'snr', 'sats']
const MAPPING: ColumnMapping = {
  delimiter: ',',
  decimalComma: false,
  columns: HEADER.map((name, index) => ({ index, name, role: (['time', 'lat', 'lon', 'alt', 'rssi1', 'lq', 'snr', 'extra'] as const)[index]! })),
  altUnit: 'm',
  altReference: 'agl',
  signalUnit: 'dbm',
  percentMap: null,
  timeFormat: 'ms-from-start',
}
const STATION = { lat: 52.0412, lon: -1.3127 }

/** Writes an n-row, 8-column log (50 Hz, out to ~3 km and back, a weak stretch at the far end). */
async function writeLog(file: string, n: number): Promise<number> {
  const out = fs.createWriteStream(file)
  out.write(HEADER.join(',') + '\n')
  let seed = 12345
  const rnd = () => ((seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32)
  const batch: string[] = []
  for (let i = 0; i < n; i++) {
    const u = ((i % 60_000) / 30_000) // out and back every 20 minutes of log
    const d = u <= 1 ? u : 2 - u
    const rssi = -40 - 35 * d - rnd() * 6
    batch.push(
      `${i * 20},${(STATION.lat + d * 0.02).toFixed(7)},${(STATION.lon + d * 0.03).toFixed(7)},${(30 + d * 80).toFixed(1)},${rssi.toFixed(1)},${Math.round(100 - d * 30)},${(10 - d * 8).toFixed(1)},${9 + (i % 4)}`,
    )
    if (batch.length === 10_000) {
      if (!out.write(batch.join('\n') + '\n')) await once(out, 'drain')
      batch.length = 0
    }
  }
  if (batch.length) out.write(batch.join('\n') + '\n')
  out.end()
  await once(out, 'finish')
  return fs.statSync(file).size
}

/** (a): COPY the CSV straight into a scratch table with the same keys and index as samples. */
async function bareCopy(file: string): Promise<number> {
  const pool = pgPool()
  await pool.query('DROP TABLE IF EXISTS bench_copy')
  await pool.query(`CREATE TABLE bench_copy (
      flight_id integer NOT NULL DEFAULT 1, seq integer GENERATED ALWAYS AS IDENTITY,
      t_ms bigint, lat double precision, lon double precision, alt_m real, rssi1_dbm real, lq real, snr real, sats integer,
      PRIMARY KEY (flight_id, seq))`)
  await pool.query('CREATE INDEX bench_copy_time ON bench_copy (flight_id, t_ms)')
  const client = await pool.connect()
  try {
    const t0 = performance.now()
    const copy = client.query(copyStreams.from('COPY bench_copy (t_ms, lat, lon, alt_m, rssi1_dbm, lq, snr, sats) FROM STDIN WITH (FORMAT csv, HEADER true)'))
    await pipeline(fs.createReadStream(file, { highWaterMark: 256 * 1024 }), copy)
    return (performance.now() - t0) / 1000
  } finally {
    client.release()
    await pool.query('DROP TABLE IF EXISTS bench_copy')
  }
}

async function seedUser(): Promise<{ email: string; password: string; courseId: number; setupId: number }> {
  sequelize()
  const password = 'bench-password-0123'
  const team = await Team.create({ name: `Bench ${Date.now()}` })
  const email = `bench-${Date.now()}@bench.example.test`
  const user = await User.create({ email, name: 'Bench pilot', passwordHash: await hashPassword(password), currentTeamId: team.id })
  await Membership.create({ userId: user.id, teamId: team.id, role: 'pilot' })
  const course = await Course.create({
    teamId: team.id, createdBy: user.id, name: 'Bench field', stationLat: STATION.lat, stationLon: STATION.lon,
    antennaHeightM: 2, groundElevM: 100, route: null, obstacles: [],
  })
  const setup = await LinkSetup.create({
    teamId: team.id, createdBy: user.id, lineageId: 0, version: 1, isCurrent: true, name: 'Bench 2.4 GHz', band: '2.4 GHz',
    freqMhz: 2440, channel: null, txPowerDbm: 20, txAntenna: { type: 'dipole', gainDbi: 2 },
    rxAntennas: [{ label: 'A', type: 'dipole', kind: 'omni', gainDbi: 2, beamwidthDeg: null, beamwidthEstimated: false, azimuthDeg: null, elevationDeg: null, polarisation: 'vertical' }],
    cableLossDb: 1, sensitivityDbm: -105, floorDbm: null, notes: '',
  })
  await setup.update({ lineageId: setup.id })
  return { email, password, courseId: course.id, setupId: setup.id }
}

/** Starts the real server as `npm start` runs it: built ahead of time, plain node (so the pid is the server's own). */
async function startServer(dataDir: string): Promise<ChildProcess> {
  execFileSync(process.execPath, ['server/scripts/build-server.mjs'], { stdio: 'ignore' })
  const child = spawn(process.execPath, ['dist-server/index.js'], {
    env: { ...process.env, PORT: String(PORT), HOST: '127.0.0.1', DATA_DIR: dataDir, LOG_LEVEL: process.env.BENCH_SERVER_LOG_LEVEL ?? 'warn', NODE_ENV: process.env.NODE_ENV ?? 'production', JOB_POLL_SECONDS: '0.5' },
    stdio: ['ignore', 'inherit', 'inherit'],
  })
  try {
    await waitForHealth(`http://127.0.0.1:${PORT}/api/health`, 30_000)
    return child
  } catch (err) {
    child.kill('SIGTERM')
    throw err
  }
}

function rssKb(pid: number, field: 'VmRSS' | 'VmHWM'): number {
  const m = new RegExp(`${field}:\\s+(\\d+) kB`).exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'))
  return m ? Number(m[1]) : 0
}

/** A tiny cookie-keeping client for one session. */
function session() {
  let cookie = ''
  let csrf = ''
  const call = async (method: string, url: string, body?: FormData, json?: unknown): Promise<Response> => {
    const headers: Record<string, string> = { cookie }
    if (csrf) headers['x-csrf-token'] = csrf
    if (json !== undefined) headers['content-type'] = 'application/json'
    const res = await fetch(`http://127.0.0.1:${PORT}${url}`, { method, headers, body: json !== undefined ? JSON.stringify(json) : body })
    const set = res.headers.getSetCookie()
    if (set.length) cookie = set.map((c) => c.split(';')[0]).join('; ')
    return res
  }
  return {
    call,
    async signIn(email: string, password: string) {
      csrf = ((await (await call('GET', '/api/auth/csrf')).json()) as { token: string }).token
      const res = await call('POST', '/api/auth/sign-in', undefined, { email, password })
      if (!res.ok) throw new Error(`sign-in: ${res.status} ${await res.text()}`)
      csrf = ((await (await call('GET', '/api/auth/csrf')).json()) as { token: string }).token
    },
  }
}

/** (b): the whole import through HTTP; returns seconds and the server's peak RSS in MB. */
async function apiIngest(file: string, rows: number): Promise<{ seconds: number; peakMb: number; baseMb: number }> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'ellipsoid-bench-data-'))
  const user = await seedUser()
  const child = await startServer(dataDir)
  const pid = child.pid!
  let peak = 0
  const timer = setInterval(() => {
    try {
      peak = Math.max(peak, rssKb(pid, 'VmRSS'))
    } catch {
      /* exited */
    }
  }, 25)
  try {
    const s = session()
    await s.signIn(user.email, user.password)
    const baseMb = rssKb(pid, 'VmRSS') / 1024
    const form = new FormData()
    form.set('courseId', String(user.courseId))
    form.set('setupId', String(user.setupId))
    form.set('name', `Bench ${rows} rows`)
    form.set('flownOn', '2026-05-16')
    form.set('mapping', JSON.stringify(MAPPING))
    form.set('file', await fs.openAsBlob(file), 'bench.csv')
    const t0 = performance.now()
    const up = await s.call('POST', '/api/flights', form)
    if (up.status !== 202) throw new Error(`upload: ${up.status} ${await up.text()}`)
    const { id } = (await up.json()) as { id: number }
    let status = ''
    for (let i = 0; i < 5 * 60 * 20 && status !== 'ready' && status !== 'failed'; i++) {
      // A client polls a few times a second; polling harder would load the server being measured.
      await new Promise((r) => setTimeout(r, 200))
      status = ((await (await s.call('GET', `/api/flights/${id}/status`)).json()) as { status: string }).status
    }
    const seconds = (performance.now() - t0) / 1000
    if (status !== 'ready') throw new Error(`import ended ${status}`)
    const f = (await (await s.call('GET', `/api/flights/${id}`)).json()) as { rowCount: number }
    if (f.rowCount !== rows) throw new Error(`stored ${f.rowCount} rows, expected ${rows}`)
    peak = Math.max(peak, rssKb(pid, 'VmHWM'))
    return { seconds, peakMb: peak / 1024, baseMb }
  } finally {
    clearInterval(timer)
    child.kill('SIGTERM')
    await once(child, 'exit')
    fs.rmSync(dataDir, { recursive: true, force: true })
    await pgPool().query('TRUNCATE samples')
  }
}

async function main(): Promise<void> {
  await migrator().up()
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'ellipsoid-bench-'))
  try {
    const file = path.join(dir, 'log-1m.csv')
    const bytes = await writeLog(file, ROWS)
    console.log(`generated ${ROWS.toLocaleString('en')} rows, ${(bytes / 1e6).toFixed(1)} MB`)
    const copyS = await bareCopy(file)
    console.log(`(a) bare COPY into an indexed scratch table: ${copyS.toFixed(2)} s`)
    const ing = await apiIngest(file, ROWS)
    console.log(`(b) upload → ready through the API: ${ing.seconds.toFixed(2)} s, server RSS ${ing.baseMb.toFixed(0)} MB idle, ${ing.peakMb.toFixed(0)} MB peak`)
    fs.rmSync(file)
    if (!BIG_ROWS) {
      console.log(`ingest_rows_per_s: ${Math.round(ROWS / ing.seconds)}\ncopy_rows_per_s: ${Math.round(ROWS / copyS)}\ningest_ratio: ${(ing.seconds / copyS).toFixed(2)}`)
      return
    }
    const big = path.join(dir, 'log-3m.csv')
    const bigBytes = await writeLog(big, BIG_ROWS)
    const ing3 = await apiIngest(big, BIG_ROWS)
    console.log(`(b) ${BIG_ROWS.toLocaleString('en')} rows (${(bigBytes / 1e6).toFixed(0)} MB): ${ing3.seconds.toFixed(2)} s, ${ing3.peakMb.toFixed(0)} MB peak`)
    console.log(`ingest_rows_per_s: ${Math.round(ROWS / ing.seconds)}`)
    console.log(`copy_rows_per_s: ${Math.round(ROWS / copyS)}`)
    console.log(`ingest_ratio: ${(ing.seconds / copyS).toFixed(2)}`)
    console.log(`ingest_peak_rss_mb: ${ing.peakMb.toFixed(0)}`)
    console.log(`ingest_peak_rss_3m_mb: ${ing3.peakMb.toFixed(0)}`)
    console.log(`ingest_3m_rows_per_s: ${Math.round(BIG_ROWS / ing3.seconds)}`)
  } finally {
    fs.rmSync(dir, { recursive: true, force: true })
    await closeDb()
  }
}

main().catch((e: Error) => {
  console.error(`bench ingest failed: ${e.message}`)
  process.exit(1)
})
