import { Writable } from 'node:stream'
import { describe, expect, it } from 'vitest'
import { columnMappingSchema, type ColumnMapping } from '../../../../../shared/import/mapping.js'
import type { SampleRow } from '../../../../../shared/import/rowConverter.js'
import { scanDelimitedToCopy } from '../../../../../server/services/flights/copyScan.js'
import { copyLine } from '../../../../../server/services/flights/copyWriter.js'
import { scanDelimited, type ScanOptions } from '../../../../../server/services/flights/delimitedScan.js'
import type { ByteChunk, TextChunk } from '../../../../../server/services/flights/source.js'

const FLIGHT = 7

const NAMES = ['time', 'lat', 'lon', 'alt', 'rssi', 'lq', 'snr', 'note', 'sats', 'rssi2']
const ROLES = ['time', 'lat', 'lon', 'alt', 'rssi1', 'lq', 'snr', 'extra', 'extra']

function mapping(over: Partial<ColumnMapping> = {}, roles = ROLES, names = NAMES): ColumnMapping {
  return columnMappingSchema.parse({
    delimiter: ',',
    decimalComma: false,
    columns: roles.map((role, index) => ({ index, name: names[index], role })),
    altUnit: 'm',
    altReference: 'agl',
    signalUnit: 'dbm',
    percentMap: null,
    timeFormat: 'ms-from-start',
    ...over,
  })
}

function opts(m: ColumnMapping): ScanOptions {
  return { mapping: m, groundElevM: 120, station: { latDeg: 52.0412, lonDeg: -1.3127 } }
}

async function* byteChunks(buf: Buffer, size: number): AsyncGenerator<ByteChunk> {
  for (let i = 0; i < buf.length; i += size) yield { bytes: buf.subarray(i, i + size), bytesRead: Math.min(buf.length, i + size) }
}

async function* textChunks(buf: Buffer): AsyncGenerator<TextChunk> {
  yield { text: new TextDecoder('utf-8', { fatal: true }).decode(buf), bytesRead: buf.length }
}

interface Run {
  header: string[]
  report: unknown
  copy: string
  rows: string[]
}

/** The general path: record splitter and row converter, rows written with copyLine. */
async function general(buf: Buffer, m: ColumnMapping): Promise<Run> {
  let copy = ''
  const rows: string[] = []
  const r = await scanDelimited(textChunks(buf), opts(m), {
    row(seq, row, distM) {
      copy += copyLine(`${FLIGHT}\t`, seq, row, distM)
      rows.push(collected(seq, row, distM))
    },
    afterChunk: async () => undefined,
  })
  return { header: r.header, report: r.report.toDto(), copy, rows }
}

function collected(seq: number, r: SampleRow, distM: number): string {
  return JSON.stringify([seq, r.tMs, r.lat, r.lon, r.altM, r.rssi1Dbm, r.rssi2Dbm, r.lq, r.snr, distM].map(String))
}

/** The byte scanner, fed in chunks of `size` bytes. */
async function fast(buf: Buffer, m: ColumnMapping, size: number): Promise<Run> {
  const parts: Buffer[] = []
  const copy = new Writable({
    highWaterMark: 64,
    write(chunk: Buffer, _enc, cb) {
      parts.push(Buffer.from(chunk))
      setImmediate(cb)
    },
  })
  const rows: string[] = []
  const r = await scanDelimitedToCopy(byteChunks(buf, size), opts(m), {
    copy,
    flightId: FLIGHT,
    collect: (seq, row, distM) => rows.push(collected(seq, row, distM)),
    progress: () => undefined,
  })
  return { header: r.header, report: r.report.toDto(), copy: Buffer.concat(parts).toString('utf8'), rows }
}

async function expectSame(text: string | Buffer, m: ColumnMapping): Promise<Run> {
  const buf = typeof text === 'string' ? Buffer.from(text) : text
  const want = await general(buf, m)
  for (const size of [1, 7, 64, 1 << 20]) expect(await fast(buf, m, size)).toEqual(want)
  return want
}

const HEADER = 'time,lat,lon,alt,rssi,lq,snr,note,sats'

describe('scanDelimitedToCopy', () => {
  it('writes the same COPY text, values and report as the general path for plain rows', async () => {
    const lines = [HEADER]
    for (let i = 0; i < 300; i++) {
      lines.push(`${1000 + i * 20},${(52.0412 + i * 1e-5).toFixed(7)},${(-1.3127 + i * 2e-5).toFixed(7)},${(30 + i / 10).toFixed(1)},-${(40 + (i % 50) / 3).toFixed(1)},${100 - (i % 40)},${(9 - i / 100).toFixed(2)},ok,${9 + (i % 4)}`)
    }
    const run = await expectSame(lines.join('\n') + '\n', mapping())
    expect((run.report as { goodRows: number }).goodRows).toBe(300)
    expect(run.copy.split('\n')[1]).toBe('7\t1\t20\t52.0412100\t-1.3126800\t30.1\t-40.3\t\\N\t99\t8.99\t1.8\t{"note":"ok","sats":"10"}')
  })

  it('agrees on quotes, line ends, blanks, bad rows, unusual numbers and odd extras', async () => {
    const text = [
      '\uFEFF"time","lat",lon,alt,rssi,lq,snr,note,sats\r',
      '0,0,0,10,-50,100,5,no fix yet,1\r',
      '\r',
      '100,52.05,-1.31,10,-50,100,5,"a, quoted note",7\r',
      '200,52.05,-1.31,10,-50,100,5,"two\r',
      'lines ""here""",8\r',
      '300,91,-1.31,10,-50,100,5,x,8\r',
      '400,52.05,-1.31,10,,100,5,x,8\r',
      '500,52.05,-1.31, 10 ,-50,100,5,x,8\r',
      '600,52.05,-1.31,1e1,-50,100,,x,8\r',
      '550,52.05,-1.31,10,-50,100,5,x,8\r',
      '700,52.05,-1.31,10,-50,100,5,café ✓ tab\there \\ back,8\r',
      '800,52.05,-1.31,10,-50,101,5,x,8\r',
      '900,52.05,-1.31,10,-50,100,5,x,8,,\r',
      '1000,52.05,-1.31,10,-50,100,5,x,8,extra\r',
      '1100,52.05,-1.31,10\r',
      '   \r',
      '1200,0,0,10,-50,100,5,x,8\r',
      '1300,+52.0500000000000001,-1.31,10.,-50,.5,-0,x,8\r',
      '1400,52.05,-1.31,10,-50,100,5,x,8',
    ].join('\n')
    const run = await expectSame(text, mapping())
    expect(run.report).toMatchObject({ goodRows: 8, noFixRows: 1 })
    expect((run.report as { badRows: number }).badRows).toBeGreaterThanOrEqual(6)
  })

  it('agrees on decimal commas, percent signal, feet above sea level, seconds and a second signal', async () => {
    const m = mapping(
      { delimiter: ';', decimalComma: true, signalUnit: 'percent', percentMap: { pct0Dbm: -110, pct100Dbm: -50 }, altUnit: 'ft', altReference: 'amsl', timeFormat: 's-from-start' },
      ['time', 'lat', 'lon', 'alt', 'rssi1', 'lq', 'snr', 'extra', 'ignore', 'rssi2'],
    )
    const rows = ['time;lat;lon;alt;rssi;lq;snr;note;sats;rssi2']
    for (let i = 0; i < 50; i++) rows.push(`${(i / 2 + 0.5).toFixed(1).replace('.', ',')};52,${4120 + i};-1,31;${500 + i};${50 + (i % 30)};${i % 2 ? '99' : '98,5'};3,5;n${i};1;${i % 7 === 0 ? '' : 40 + (i % 9)}`)
    rows.push('9;52,5;-1,3;500;150;99;3;bad;1;40')
    await expectSame(rows.join('\n') + '\n', m)
  })

  it('agrees on ISO and date-plus-time clocks', async () => {
    const iso = ['time,lat,lon,rssi', '2026-05-01T10:00:00Z,52.05,-1.31,-50', '2026-05-01T10:00:01.5Z,52.05,-1.31,-51', 'later,52.05,-1.31,-51', '2026-05-01 10:00:02,52.05,-1.31,-52']
    await expectSame(iso.join('\n') + '\n', mapping({ timeFormat: 'iso' }, ['time', 'lat', 'lon', 'rssi1'], ['time', 'lat', 'lon', 'rssi']))
    const dt = ['date,time,lat,lon,rssi', '2026-05-01,10:00:00,52.05,-1.31,-50', '01.05.2026,10:00:01.25,52.05,-1.31,-51', '2026-05-01,25:99:00,52.05,-1.31,-51']
    const m = mapping({ timeFormat: 'date+time' }, ['date', 'time', 'lat', 'lon', 'rssi1'], ['date', 'time', 'lat', 'lon', 'rssi'])
    await expectSame(dt.join('\n') + '\n', m)
  })

  it('takes the general path for lone-CR line ends', async () => {
    const run = await expectSame([HEADER, '0,52.05,-1.31,10,-50,100,5,x,8', '20,52.05,-1.31,10,-50,100,5,x,8'].join('\r') + '\r', mapping())
    expect(run.report).toMatchObject({ goodRows: 2 })
  })

  it('refuses invalid UTF-8, a quote that never closes, a missing column and an empty file like the general path', async () => {
    const bad = Buffer.concat([Buffer.from(`${HEADER}\n0,52.05,-1.31,10,-50,100,5,`), Buffer.from([0xc3, 0x28]), Buffer.from(',8\n')])
    await expect(fast(bad, mapping(), 16)).rejects.toMatchObject({ status: 422, message: expect.stringMatching(/not valid UTF-8/) })
    const open = `${HEADER}\n0,52.05,-1.31,10,-50,100,5,"never closed,8\n20,52.05,-1.31,10,-50,100,5,x,8\n`
    await expect(general(Buffer.from(open), mapping())).rejects.toMatchObject({ status: 422, details: [{ row: 2 }] })
    await expect(fast(Buffer.from(open), mapping(), 16)).rejects.toMatchObject({ status: 422, details: [{ row: 2 }] })
    await expect(fast(Buffer.from('time,lat\n0,1\n'), mapping(), 16)).rejects.toMatchObject({ status: 422, details: [{ column: 'lon' }] })
    await expect(fast(Buffer.from('\n\n'), mapping(), 16)).rejects.toMatchObject({ status: 422, message: 'The file is empty' })
  })
})
