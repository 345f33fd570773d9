import fs from 'node:fs'
import path from 'node:path'
import zlib from 'node:zlib'
import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import { pgPool } from '../../server/db.js'
import { config } from '../../server/config.js'
import { flightJobsService } from '../../server/services/flights/jobs.js'
import { serverFileName } from '../../server/services/flights/storage.js'
import type { ColumnMapping } from '../../shared/import/mapping.js'
import type { SignedIn } from './helpers.js'
import { FIXTURE_STATION } from './fixtures-db.js'
import { LOGS, mappingText, storedCounts, upload, waitForStatus } from './flights-helpers.js'
import { useFlightSuite } from './flights-suite.js'

interface Expected {
  tMs: number
  lat: number
  lon: number
  altM: number | null
  rssi1: number
  rssi2: number | null
  lq: number | null
}

// Independent reading of a fixture with papaparse: the expected values straight from the source text.
function expectedFromDelimited(file: string, m: ColumnMapping): Expected[] {
  let buf = fs.readFileSync(path.join(LOGS, file))
  if (file.endsWith('.gz')) buf = zlib.gunzipSync(buf)
  const parsed = Papa.parse<string[]>(buf.toString('utf8').replace(/^\uFEFF/, ''), { delimiter: m.delimiter, skipEmptyLines: true })
  const rows = parsed.data.slice(1)
  const at = (role: string) => m.columns.find((c) => c.role === role)?.index
  const num = (s: string | undefined) => Number((m.decimalComma ? s?.replace(',', '.') : s) ?? NaN)
  const abs = (r: string[]): number => {
    const t = r[at('time')!]!
    switch (m.timeFormat) {
      case 'ms-from-start':
      case 'unix-ms':
        return num(t)
      case 's-from-start':
      case 'unix-s':
        return num(t) * 1000
      case 'iso':
        return Date.parse(t)
      case 'date+time':
        return Date.parse(`${r[at('date')!]}T${t}Z`)
    }
  }
  const good = rows.filter((r) => !(num(r[at('lat')!]) === 0 && num(r[at('lon')!]) === 0))
  const t0 = abs(good[0]!)
  return good.map((r) => {
    let alt = at('alt') === undefined ? null : num(r[at('alt')!])
    if (alt !== null && m.altUnit === 'ft') alt *= 0.3048
    if (alt !== null && m.altReference === 'amsl') alt -= FIXTURE_STATION.groundElevM
    let rssi = num(r[at('rssi1')!])
    if (m.signalUnit === 'percent') rssi = m.percentMap!.pct0Dbm + (rssi / 100) * (m.percentMap!.pct100Dbm - m.percentMap!.pct0Dbm)
    return {
      tMs: Math.round(abs(r) - t0),
      lat: num(r[at('lat')!]),
      lon: num(r[at('lon')!]),
      altM: alt,
      rssi1: rssi,
      rssi2: at('rssi2') === undefined ? null : num(r[at('rssi2')!]),
      lq: at('lq') === undefined ? null : num(r[at('lq')!]),
    }
  })
}

function expectedFromGpx(file: string): Expected[] {
  const xml = fs.readFileSync(path.join(LOGS, file), 'utf8')
  const pts = [...xml.matchAll(/<trkpt lat="([^"]+)" lon="([^"]+)">[\s\S]*?<ele>([^<]+)<\/ele>[\s\S]*?<time>([^<]+)<\/time>[\s\S]*?<hm:rssi>([^<]+)<\/hm:rssi><hm:lq>([^<]+)</g)]
  const t0 = Date.parse(pts[0]![4]!)
  return pts.map((p) => ({
    tMs: Date.parse(p[4]!) - t0,
    lat: Number(p[1]),
    lon: Number(p[2]),
    altM: Number(p[3]) - FIXTURE_STATION.groundElevM,
    rssi1: Number(p[5]),
    rssi2: null,
    lq: Number(p[6]),
  }))
}

async function storedSamples(flightId: number) {
  const { rows } = await pgPool().query(
    'SELECT seq, t_ms, lat, lon, alt_m, rssi1_dbm, rssi2_dbm, lq, dist_m, extras FROM samples WHERE flight_id = $1 ORDER BY seq',
    [flightId],
  )
  return rows
}

let s: SignedIn
let courseId: number
let setupId: number

useFlightSuite((x) => {
  ;({ s, courseId, setupId } = x)
})

const DELIMITED = [
  'comma.csv',
  'semicolon-decimal-comma.csv',
  'bom-crlf.csv',
  'feet-amsl.csv',
  'iso-time.tsv',
  'date-time.csv',
  'percent-signal.csv',
  'two-antennas.csv',
  'gzip.csv.gz',
]

describe('POST /api/flights (good fixtures)', () => {
  for (const file of DELIMITED) {
    it(`stores ${file} value by value as the source file says`, async () => {
      const mapping = mappingText(file)
      const res = await upload(s, path.join(LOGS, file), { courseId, setupId, mapping })
      expect(res.status, JSON.stringify(res.body)).toBe(202)
      expect(res.body.status).toBe('queued')
      const st = await waitForStatus(s, res.body.id)
      expect(st.failure).toBeNull()
      expect(st.status).toBe('ready')
      const expected = expectedFromDelimited(file, JSON.parse(mapping) as ColumnMapping)
      const rows = await storedSamples(res.body.id)
      expect(rows.length).toBe(expected.length)
      rows.forEach((r, i) => {
        const e = expected[i]!
        expect(r.seq).toBe(i)
        expect(Number(r.t_ms)).toBe(e.tMs)
        expect(r.lat).toBeCloseTo(e.lat, 9)
        expect(r.lon).toBeCloseTo(e.lon, 9)
        if (e.altM === null) expect(r.alt_m).toBeNull()
        else expect(r.alt_m).toBeCloseTo(e.altM, 2) // real column: float32
        expect(r.rssi1_dbm).toBeCloseTo(e.rssi1, 3)
        if (e.rssi2 === null) expect(r.rssi2_dbm).toBeNull()
        else expect(r.rssi2_dbm).toBeCloseTo(e.rssi2, 3)
        if (e.lq === null) expect(r.lq).toBeNull()
        else expect(r.lq).toBeCloseTo(e.lq, 3)
        expect(r.dist_m).toBeGreaterThan(0)
      })
      const flight = await s.agent.get(`/api/flights/${res.body.id}`)
      expect(flight.status).toBe(200)
      expect(flight.body.rowCount).toBe(expected.length)
      expect(flight.body.analysisVersion).toMatch(/^ellipsoid-link\//)
      expect(flight.body.analysis.sampleCount).toBe(expected.length)
    })
  }

  it('keeps the leading no-fix row out and counts it', async () => {
    const res = await upload(s, path.join(LOGS, 'comma.csv'), { courseId, setupId, mapping: mappingText('comma.csv') })
    await waitForStatus(s, res.body.id)
    const f = await s.agent.get(`/api/flights/${res.body.id}`)
    expect(f.body.rowErrors.noFixRows).toBe(1)
    expect(f.body.badRowCount).toBe(0)
  })

  it('stores a quoted extra column with its comma intact', async () => {
    const res = await upload(s, path.join(LOGS, 'date-time.csv'), { courseId, setupId, mapping: mappingText('date-time.csv') })
    await waitForStatus(s, res.body.id)
    const rows = await storedSamples(res.body.id)
    expect(rows[5]!.extras).toEqual({ note: 'turn, north' })
  })

  it('stores extra text with backslashes, tabs and quotes unchanged', async () => {
    const m = JSON.parse(mappingText('comma.csv')) as ColumnMapping
    const rows = Array.from({ length: 30 }, (_, i) => `${i * 100},52.05,-1.3,50,-70,90,5,"C:\\log\t""${i}"""`)
    const text = ['time_ms,lat,lon,alt_m,rssi_dbm,lq,snr,sats', ...rows].join('\n')
    const res = await upload(s, Buffer.from(text), { courseId, setupId, mapping: JSON.stringify(m) })
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    expect((await waitForStatus(s, res.body.id)).status).toBe('ready')
    const stored = await storedSamples(res.body.id)
    expect(stored[7]!.extras).toEqual({ sats: 'C:\\log\t"7"' })
  })

  it('keeps the original compressed and the temp folder empty', async () => {
    const before = await storedCounts()
    const res = await upload(s, path.join(LOGS, 'comma.csv'), { courseId, setupId, mapping: mappingText('comma.csv') })
    await waitForStatus(s, res.body.id)
    const after = await storedCounts()
    expect(after.tmpFiles).toBe(before.tmpFiles)
    expect(after.rawFiles).toBe(before.rawFiles + 1)
    const { rows } = await pgPool().query('SELECT raw_file FROM flights WHERE id = $1', [res.body.id])
    const kept = zlib.gunzipSync(fs.readFileSync(rows[0]!.raw_file as string))
    expect(kept.equals(fs.readFileSync(path.join(LOGS, 'comma.csv')))).toBe(true)
  })
})

describe('POST /api/flights (GPX)', () => {
  it('stores track points with signal values from extensions, elevation turned into height above ground', async () => {
    const res = await upload(s, path.join(LOGS, 'track.gpx'), { courseId, setupId })
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    const st = await waitForStatus(s, res.body.id)
    expect(st.status).toBe('ready')
    const expected = expectedFromGpx('track.gpx')
    const rows = await storedSamples(res.body.id)
    expect(rows.length).toBe(expected.length)
    rows.forEach((r, i) => {
      const e = expected[i]!
      expect(Number(r.t_ms)).toBe(e.tMs)
      expect(r.lat).toBeCloseTo(e.lat, 9)
      expect(r.lon).toBeCloseTo(e.lon, 9)
      expect(r.alt_m).toBeCloseTo(e.altM!, 2)
      expect(r.rssi1_dbm).toBeCloseTo(e.rssi1, 3)
      expect(r.lq).toBeCloseTo(e.lq!, 3)
    })
  })

  it('takes signal values from a separate signal log matched by time when the track has none', async () => {
    const res = await s.agent
      .post('/api/flights')
      .set('X-CSRF-Token', s.csrf)
      .field('courseId', String(courseId))
      .field('setupId', String(setupId))
      .field('name', 'Track with signal log')
      .field('flownOn', '2026-05-16')
      .field('signalMapping', fs.readFileSync(path.join(LOGS, 'signal-log.csv.mapping.json'), 'utf8'))
      .attach('file', path.join(LOGS, 'track-no-signal.gpx'))
      .attach('signalFile', path.join(LOGS, 'signal-log.csv'))
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    expect((await waitForStatus(s, res.body.id)).status).toBe('ready')
    // the log has a row every 200 ms, the track a point every 100 ms: odd points take the row just before them
    const log = Papa.parse<string[]>(fs.readFileSync(path.join(LOGS, 'signal-log.csv'), 'utf8'), { skipEmptyLines: true }).data.slice(1)
    const track = expectedFromGpx('track.gpx')
    const rows = await storedSamples(res.body.id)
    expect(rows.length).toBe(track.length)
    rows.forEach((r, i) => {
      const sig = log[Math.floor(i / 2)]!
      expect(Number(r.t_ms)).toBe(track[i]!.tMs)
      expect(r.rssi1_dbm).toBeCloseTo(Number(sig[1]), 3)
      expect(r.lq).toBeCloseTo(Number(sig[2]), 3)
    })
    expect((await storedCounts()).tmpFiles).toBe(0)
  })

  it('refuses a track whose signal log does not overlap it in time', async () => {
    const shifted = fs.readFileSync(path.join(LOGS, 'signal-log.csv'), 'utf8').replace(/2026-05-16/g, '2026-05-17')
    const res = await s.agent
      .post('/api/flights')
      .set('X-CSRF-Token', s.csrf)
      .field('courseId', String(courseId))
      .field('setupId', String(setupId))
      .field('name', 'Track with a day-late log')
      .field('flownOn', '2026-05-16')
      .field('signalMapping', fs.readFileSync(path.join(LOGS, 'signal-log.csv.mapping.json'), 'utf8'))
      .attach('file', path.join(LOGS, 'track-no-signal.gpx'))
      .attach('signalFile', Buffer.from(shifted), 'late.csv')
    expect([res.status, res.body.error.code]).toEqual([422, 'UNPROCESSABLE'])
    expect(res.body.error.message).toMatch(/does not overlap/)
    expect(await storedCounts()).toMatchObject({ flights: 0, samples: 0, tmpFiles: 0 })
  })

  it('refuses a track without signal values and without a signal log with 422', async () => {
    const xml = fs.readFileSync(path.join(LOGS, 'track.gpx'), 'utf8').replace(/<extensions>.*?<\/extensions>/g, '')
    const res = await upload(s, Buffer.from(xml), { courseId, setupId, filename: 'plain.gpx' })
    expect([res.status, res.body.error.code]).toEqual([422, 'UNPROCESSABLE'])
    expect((await storedCounts()).flights).toBe(0)
  })
})

describe('flight jobs start (interrupted imports)', () => {
  /** An import record as a killed process leaves it: unfinished, last touched ten minutes ago, no pg-boss job. */
  async function orphanImport(status: 'importing' | 'analysing', flightId: number | null, tempFile: string | null): Promise<number> {
    const { rows } = await pgPool().query<{ id: string }>(
      `INSERT INTO imports (flight_id, team_id, created_by, kind, status, progress, params, temp_file, source_format, created_at, updated_at)
       VALUES (COALESCE($1, nextval(pg_get_serial_sequence('flights', 'id'))), $2, $3, 'create', $4, $5, $6, $7, 'delimited',
               now() - interval '10 minutes', now() - interval '10 minutes')
       RETURNING flight_id AS id`,
      [flightId, s.team.id, s.user.id, status, { bytesDone: 0, bytesTotal: 100, rowsDone: 0 },
        { courseId, setupId, name: 'Killed', flownOn: '2026-05-16', notes: '', mapping: JSON.parse(mappingText('comma.csv')), compressed: false }, tempFile],
    )
    return Number(rows[0]!.id)
  }

  /** Restarts this process's workers, as a fresh process would start them. */
  async function restartWorkers(): Promise<void> {
    await flightJobsService.stop()
    await flightJobsService.start()
  }

  it('fails an import left importing by a killed process, removes its temp file and stores nothing', async () => {
    const tempFile = path.join(config().dataDir, 'tmp', serverFileName())
    fs.mkdirSync(path.dirname(tempFile), { recursive: true })
    fs.copyFileSync(path.join(LOGS, 'comma.csv'), tempFile)
    const id = await orphanImport('importing', null, tempFile)
    await restartWorkers()
    const st = await waitForStatus(s, id)
    expect(st).toMatchObject({ status: 'failed', stored: false, failure: { status: 503, code: 'UNAVAILABLE' } })
    expect(st.failure!.message).toMatch(/interrupted; upload the file again/)
    expect(fs.existsSync(tempFile)).toBe(false)
    expect((await storedCounts()).flights).toBe(0)
  })

  it('queues the analysis again for an import killed after its samples committed', async () => {
    const res = await upload(s, path.join(LOGS, 'comma.csv'), { courseId, setupId, mapping: mappingText('comma.csv') })
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    const id = res.body.id as number
    expect((await waitForStatus(s, id)).status).toBe('ready')
    await pgPool().query(`UPDATE flights SET status = 'analysing', analysis = NULL WHERE id = $1`, [id])
    await orphanImport('analysing', id, null)
    await restartWorkers()
    const st = await waitForStatus(s, id)
    expect(st).toMatchObject({ status: 'ready', stored: true, failure: null })
    const f = await s.agent.get(`/api/flights/${id}`)
    expect(f.body.analysis).not.toBeNull()
  })
})
