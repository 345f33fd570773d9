import { isUtf8 } from 'node:buffer'
import { once } from 'node:events'
import type { Writable } from 'node:stream'
import { parseDateTimeCells, parseTimeCell } from '../../../shared/import/cellValues.js'
import type { ColumnMapping } from '../../../shared/import/mapping.js'
import { RecordError, RecordSplitter, countQuotes, splitQuoted } from '../../../shared/import/recordSplitter.js'
import {
  ALT_M_RANGE,
  LQ_PCT_RANGE,
  SIGNAL_DBM_RANGE,
  SNR_DB_RANGE,
  emptySampleRow,
  type RowConverter,
  type SampleRow,
} from '../../../shared/import/rowConverter.js'
import { RowReport } from '../../../shared/import/rowReport.js'
import { copyLine } from './copyWriter.js'
import { MAX_RECORD_CHARS, openConverter, type ScanOptions, type ScanResult } from './delimitedScan.js'
import { unprocessable } from './importErrors.js'
import { decodeChunks, type ByteChunk } from './source.js'
import { distanceFromStation } from './stationDistance.js'

/** Where a byte scan puts its rows. */
export interface CopyScanSink {
  /** The COPY … FROM STDIN stream (text format, SAMPLE_COPY_COLUMNS). */
  copy: Writable
  flightId: number
  /** Receives every stored row's values with its seq and distance (the analysis arrays); the object is reused. */
  collect(seq: number, r: SampleRow, distM: number): void
  /** Called after each input chunk. */
  progress(bytesRead: number, rowsDone: number): void
}

/** COPY text gathered before it is handed to the stream. */
const OUT_BYTES = 256 * 1024
const FT_TO_M = 0.3048
const NL = 10
const CR = 13
const QUOTE = 34
const BACKSLASH = 92
const TAB = 9
const NULL_TEXT = Buffer.from('\\N')
const POW10 = new Float64Array(Array.from({ length: 23 }, (_, i) => 10 ** i))

/** Set by byteNumber: the number used a decimal comma (so its text cannot be stored as written). */
let sawComma = false

/**
 * Reads `[-+]digits[.digits]` (at most 15 digits) from bytes exactly as cellValues' fast path reads the same text;
 * NaN for anything else (blank, spaces, exponent, more digits), which sends the row to the general converter.
 */
function byteNumber(b: Uint8Array, s: number, e: number, dc: boolean): number {
  sawComma = false
  if (s >= e) return NaN
  let i = s
  let c = b[i]!
  const neg = c === 45
  if (neg || c === 43) i++
  let mant = 0
  let digits = 0
  let frac = 0
  let dot = false
  for (; i < e; i++) {
    c = b[i]!
    if (c >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48)
      digits++
      if (dot) frac++
    } else if (!dot && (c === 46 || (dc && c === 44))) {
      dot = true
      if (c === 44) sawComma = true
    } else return NaN
  }
  if (digits === 0 || digits > 15) return NaN
  const v = frac ? mant / POW10[frac]! : mant
  return neg ? -v : v
}

/** JSON text as COPY text: only backslashes need doubling (JSON already escapes tab and line breaks). */
function copyJson(json: string): string {
  return json.indexOf('\\') < 0 ? json : json.replace(/\\/g, '\\\\')
}

/**
 * Validating byte scanner for delimited logs, writing COPY text straight into large buffers. Rows it can judge from
 * plain cells (the usual case) never become strings; any other line (quotes, blanks, wrong cell count, unusual number
 * text, a value out of range, time going backwards) is decoded and goes through the same splitter rules and row
 * converter as scanDelimited, so outcomes and reports are the same.
 */
class CopyScanner {
  readonly report = new RowReport()
  header: string[] | null = null
  private conv: RowConverter | null = null
  private readonly row = emptySampleRow()
  private readonly distM: (lat: number, lon: number) => number
  private readonly delim: number
  private readonly dc: boolean
  private readonly mapping: ColumnMapping
  private readonly prefix: Buffer
  private readonly prefixText: string
  private out = Buffer.allocUnsafeSlow(OUT_BYTES)
  private pos = 0
  private full = false
  seq = 0
  private line = 0
  private pending: string | null = null
  private pendingRow = 0
  // Cell bounds of the current line, filled by the byte loop.
  private cs = new Int32Array(1)
  private ce = new Int32Array(1)
  private cap = 0
  // Column positions (-1: not mapped) and what the mapping does to values.
  private iTime = -1
  private iDate = -1
  private iLat = -1
  private iLon = -1
  private iAlt = -1
  private iR1 = -1
  private iR2 = -1
  private iLq = -1
  private iSnr = -1
  private extras: number[] = []
  private extraKeys: Buffer[] = []
  private extraBytes = 0
  private headerCount = 0
  private timeNumeric = true
  private timeTimes1000 = false
  private altAsIs = true
  private signalAsIs = true

  constructor(
    private readonly opts: ScanOptions,
    private readonly sink: CopyScanSink,
  ) {
    this.mapping = opts.mapping
    this.delim = opts.mapping.delimiter.charCodeAt(0)
    this.dc = opts.mapping.decimalComma
    this.prefixText = `${sink.flightId}\t`
    this.prefix = Buffer.from(this.prefixText)
    this.distM = distanceFromStation(opts.station.latDeg, opts.station.lonDeg)
  }

  /** Scans lines in b[from, to); b[to - 1] is a line feed. */
  scan(b: Buffer, from: number, to: number): void {
    const delim = this.delim
    let cs = this.cs
    let ce = this.ce
    let cap = this.cap
    let lineStart = from
    let cellStart = from
    let n = 0
    let quote = false
    for (let i = from; i < to; i++) {
      const c = b[i]!
      if (c === delim) {
        if (n < cap) {
          cs[n] = cellStart
          ce[n] = i
        }
        n++
        cellStart = i + 1
      } else if (c === NL) {
        const end = i > lineStart && b[i - 1] === CR ? i - 1 : i
        if (n < cap) {
          cs[n] = cellStart
          ce[n] = end
        }
        this.line++
        this.onLine(b, lineStart, end, n + 1, quote)
        // The header sets the cell arrays.
        cs = this.cs
        ce = this.ce
        cap = this.cap
        lineStart = cellStart = i + 1
        n = 0
        quote = false
      } else if (c === QUOTE) quote = true
    }
  }

  private onLine(b: Buffer, s: number, e: number, cells: number, quote: boolean): void {
    if (e - s > MAX_RECORD_CHARS && b.toString('utf8', s, e).length > MAX_RECORD_CHARS) {
      throw new RecordError(this.line, `Row ${this.line} is longer than ${MAX_RECORD_CHARS} characters`)
    }
    if (this.pending !== null || quote || cells !== this.headerCount || e - s < 8 || !this.fastRow(b, s, e)) {
      this.slowLine(b.toString('utf8', s, e))
    }
  }

  /** RecordSplitter's rules for one line (line ends already removed). */
  slowLine(line: string): void {
    const delimiter = this.mapping.delimiter
    if (this.pending !== null) {
      this.pending += '\n' + line
      if (this.pending.length > MAX_RECORD_CHARS) {
        throw new RecordError(this.pendingRow, `Row ${this.pendingRow} is longer than ${MAX_RECORD_CHARS} characters`)
      }
      if (countQuotes(this.pending) % 2 === 0) {
        const rec = this.pending
        this.pending = null
        this.record(splitQuoted(rec, delimiter), this.pendingRow)
      }
      return
    }
    if (line.length === 0 || (line.length < 8 && line.trim() === '')) return
    if (line.indexOf('"') < 0) this.record(line.split(delimiter), this.line)
    else if (countQuotes(line) % 2 === 1) {
      this.pending = line
      this.pendingRow = this.line
    } else this.record(splitQuoted(line, delimiter), this.line)
  }

  /** A whole record through the row converter (the header first). */
  record(fields: string[], row: number): void {
    if (!this.conv) {
      this.openHeader(fields)
      return
    }
    const out = this.row
    const outcome = this.conv.convert(fields, out)
    if (outcome === 'ok') {
      const seq = this.seq++
      const distM = this.distM(out.lat, out.lon)
      const text = copyLine(this.prefixText, seq, out, distM)
      this.ensure(text.length * 3)
      this.pos += this.out.write(text, this.pos, 'utf8')
      this.sink.collect(seq, out, distM)
      this.report.goodRows++
    } else if (outcome === 'no-fix') this.report.noFixRows++
    else this.report.bad(row, outcome.column, outcome.reason)
  }

  /** The row an over-long unfinished record starts on. */
  pendingRowOr(): number {
    return this.pending !== null ? this.pendingRow : this.line + 1
  }

  /** End of input: an open quote is fatal. */
  end(): void {
    if (this.pending !== null) throw new RecordError(this.pendingRow, `Row ${this.pendingRow} has a quote that never closes`)
  }

  private openHeader(fields: string[]): void {
    const { header, conv } = openConverter(fields, this.opts)
    this.header = header
    this.conv = conv
    const l = conv.layout()
    const at = (r: keyof typeof l.slots) => l.slots[r] ?? -1
    this.iTime = at('time')
    this.iDate = at('date')
    this.iLat = at('lat')
    this.iLon = at('lon')
    this.iAlt = at('alt')
    this.iR1 = at('rssi1')
    this.iR2 = at('rssi2')
    this.iLq = at('lq')
    this.iSnr = at('snr')
    this.extras = l.extras
    this.extraKeys = l.extraKeys.map((k) => Buffer.from(copyJson(k)))
    this.extraBytes = this.extraKeys.reduce((a, k) => a + k.length + 3, 0)
    this.headerCount = l.headerCount
    const m = this.mapping
    this.timeNumeric = m.timeFormat !== 'iso' && m.timeFormat !== 'date+time'
    this.timeTimes1000 = m.timeFormat === 's-from-start' || m.timeFormat === 'unix-s'
    this.altAsIs = m.altUnit === 'm' && m.altReference === 'agl'
    this.signalAsIs = m.signalUnit === 'dbm'
    this.cap = l.headerCount
    this.cs = new Int32Array(this.cap)
    this.ce = new Int32Array(this.cap)
  }

  private signal(v: number): number {
    if (this.signalAsIs) return v >= SIGNAL_DBM_RANGE[0] && v <= SIGNAL_DBM_RANGE[1] ? v : NaN
    if (!(v >= 0 && v <= 100)) return NaN
    const pm = this.mapping.percentMap!
    return pm.pct0Dbm + (v / 100) * (pm.pct100Dbm - pm.pct0Dbm)
  }

  private time(b: Buffer): number {
    const cs = this.cs
    const ce = this.ce
    const i = this.iTime
    if (this.timeNumeric) {
      const v = byteNumber(b, cs[i]!, ce[i]!, this.dc)
      return this.timeTimes1000 ? v * 1000 : v
    }
    const cell = b.toString('utf8', cs[i]!, ce[i]!)
    if (this.mapping.timeFormat === 'date+time') return parseDateTimeCells(b.toString('utf8', cs[this.iDate]!, ce[this.iDate]!), cell)
    return parseTimeCell(cell, 'iso', this.dc)
  }

  /**
   * Judges and stores a row from its cells when every value is plain and valid; false leaves the row (untouched
   * state) to the general converter, which then reports or accepts it.
   */
  private fastRow(b: Buffer, s: number, e: number): boolean {
    const cs = this.cs
    const ce = this.ce
    const dc = this.dc
    const lat = byteNumber(b, cs[this.iLat]!, ce[this.iLat]!, dc)
    const latPlain = !sawComma
    if (!(lat >= -90 && lat <= 90)) return false
    const lon = byteNumber(b, cs[this.iLon]!, ce[this.iLon]!, dc)
    const lonPlain = !sawComma
    if (!(lon >= -180 && lon <= 180) || (lat === 0 && lon === 0)) return false
    const abs = this.time(b)
    if (!Number.isFinite(abs)) return false
    const conv = this.conv!
    const t = conv.relativeTime(abs)
    if (t !== t) return false
    const r1 = this.signal(byteNumber(b, cs[this.iR1]!, ce[this.iR1]!, dc))
    const r1Plain = !sawComma && this.signalAsIs
    if (r1 !== r1) return false
    let r2 = NaN
    let r2Plain = false
    if (this.iR2 >= 0) {
      r2 = this.signal(byteNumber(b, cs[this.iR2]!, ce[this.iR2]!, dc))
      r2Plain = !sawComma && this.signalAsIs
      if (r2 !== r2) return false
    }
    let alt = NaN
    let altPlain = false
    if (this.iAlt >= 0) {
      alt = byteNumber(b, cs[this.iAlt]!, ce[this.iAlt]!, dc)
      altPlain = !sawComma && this.altAsIs
      if (this.mapping.altUnit === 'ft') alt *= FT_TO_M
      if (this.mapping.altReference === 'amsl') alt -= this.opts.groundElevM
      if (!(alt >= ALT_M_RANGE[0] && alt <= ALT_M_RANGE[1])) return false
    }
    let lq = NaN
    let lqPlain = false
    if (this.iLq >= 0) {
      lq = byteNumber(b, cs[this.iLq]!, ce[this.iLq]!, dc)
      lqPlain = !sawComma
      if (!(lq >= LQ_PCT_RANGE[0] && lq <= LQ_PCT_RANGE[1])) return false
    }
    let snr = NaN
    let snrPlain = false
    if (this.iSnr >= 0) {
      snr = byteNumber(b, cs[this.iSnr]!, ce[this.iSnr]!, dc)
      snrPlain = !sawComma
      if (!(snr >= SNR_DB_RANGE[0] && snr <= SNR_DB_RANGE[1])) return false
    }
    conv.accept(abs, t)
    const distM = this.distM(lat, lon)
    // Worst case: every extra byte escaped as \\u00XX, plus the numbers formatted in full.
    this.ensure((e - s) * 7 + this.extraBytes + 256)
    const o = this.out
    let p = this.pos
    p += this.prefix.copy(o, p)
    const seq = this.seq++
    p = putInt(o, p, seq)
    o[p++] = TAB
    const tr = Math.round(t)
    p = Number.isSafeInteger(tr) && tr >= 0 ? putInt(o, p, tr) : p + o.write(String(tr), p, 'latin1')
    o[p++] = TAB
    p = latPlain ? copyCell(b, cs[this.iLat]!, ce[this.iLat]!, o, p) : p + o.write(String(lat), p, 'latin1')
    o[p++] = TAB
    p = lonPlain ? copyCell(b, cs[this.iLon]!, ce[this.iLon]!, o, p) : p + o.write(String(lon), p, 'latin1')
    o[p++] = TAB
    p = this.value(b, this.iAlt, alt, altPlain, o, p)
    o[p++] = TAB
    p = r1Plain ? copyCell(b, cs[this.iR1]!, ce[this.iR1]!, o, p) : p + o.write(String(r1), p, 'latin1')
    o[p++] = TAB
    p = this.value(b, this.iR2, r2, r2Plain, o, p)
    o[p++] = TAB
    p = this.value(b, this.iLq, lq, lqPlain, o, p)
    o[p++] = TAB
    p = this.value(b, this.iSnr, snr, snrPlain, o, p)
    o[p++] = TAB
    p = putDecimetres(o, p, distM)
    o[p++] = TAB
    p = this.extras.length ? this.putExtras(b, o, p) : p + NULL_TEXT.copy(o, p)
    o[p++] = NL
    this.pos = p
    const r = this.row
    r.tMs = t
    r.lat = lat
    r.lon = lon
    r.altM = alt
    r.rssi1Dbm = r1
    r.rssi2Dbm = r2
    r.lq = lq
    r.snr = snr
    this.sink.collect(seq, r, distM)
    this.report.goodRows++
    return true
  }

  /** An optional value: \N when the column is not mapped, the cell as written when plain, else the number. */
  private value(b: Buffer, i: number, v: number, plain: boolean, o: Buffer, p: number): number {
    if (i < 0) return p + NULL_TEXT.copy(o, p)
    return plain ? copyCell(b, this.cs[i]!, this.ce[i]!, o, p) : p + o.write(String(v), p, 'latin1')
  }

  /** The extras as a JSON object of the cells as written (COPY-escaped). */
  private putExtras(b: Buffer, o: Buffer, p: number): number {
    for (let k = 0; k < this.extras.length; k++) {
      p += this.extraKeys[k]!.copy(o, p)
      const i = this.extras[k]!
      const s = this.cs[i]!
      const e = this.ce[i]!
      let plain = true
      for (let j = s; j < e; j++) {
        const c = b[j]!
        if (c < 32 || c > 126 || c === QUOTE || c === BACKSLASH) {
          plain = false
          break
        }
      }
      if (plain) {
        o[p++] = QUOTE
        p = copyCell(b, s, e, o, p)
        o[p++] = QUOTE
      } else p += o.write(copyJson(JSON.stringify(b.toString('utf8', s, e))), p, 'utf8')
    }
    o[p++] = 125 // }
    return p
  }

  /** Makes room for n more bytes, handing the gathered text to the stream first. */
  private ensure(n: number): void {
    if (this.pos + n > this.out.length) this.push(Math.max(n, OUT_BYTES))
  }

  /** Hands the gathered text to the COPY stream (no copy: a fresh buffer takes its place). */
  push(nextBytes = OUT_BYTES): void {
    if (this.pos) {
      if (!this.sink.copy.write(this.out.subarray(0, this.pos))) this.full = true
      this.out = Buffer.allocUnsafeSlow(nextBytes)
      this.pos = 0
    } else if (this.out.length < nextBytes) this.out = Buffer.allocUnsafeSlow(nextBytes)
  }

  /** After each input chunk: sends what has gathered and waits while the stream is full. */
  async afterChunk(bytesRead: number): Promise<void> {
    if (this.pos >= OUT_BYTES / 2) this.push()
    if (this.full) {
      this.full = false
      if (this.sink.copy.writableNeedDrain) await once(this.sink.copy, 'drain')
    }
    this.sink.progress(bytesRead, this.seq)
  }

  /** The general path for a file whose first chunk has no line feed (lone-CR line ends, or one huge first line). */
  async general(first: ByteChunk, rest: AsyncIterator<ByteChunk>): Promise<void> {
    async function* all(): AsyncGenerator<ByteChunk> {
      yield first
      for (let r = await rest.next(); !r.done; r = await rest.next()) yield r.value
    }
    const splitter = new RecordSplitter({ delimiter: this.mapping.delimiter, maxRecordChars: MAX_RECORD_CHARS }, (f, row) => this.record(f, row))
    for await (const chunk of decodeChunks(all(), false)) {
      splitter.push(chunk.text)
      await this.afterChunk(chunk.bytesRead)
    }
    splitter.end()
  }
}

function copyCell(b: Uint8Array, s: number, e: number, o: Uint8Array, p: number): number {
  for (let j = s; j < e; j++) o[p++] = b[j]!
  return p
}

/** Writes a non-negative safe integer as decimal digits. */
function putInt(o: Uint8Array, p: number, v: number): number {
  let len = 1
  for (let x = v; x >= 10; x = Math.floor(x / 10)) len++
  let q = p + len
  const end = q
  do {
    const d = v % 10
    o[--q] = 48 + d
    v = (v - d) / 10
  } while (v > 0)
  return end
}

/** A distance to 0.1 m, as copyWriter writes it. */
function putDecimetres(o: Buffer, p: number, distM: number): number {
  if (!(distM >= 0) || distM > 2e8) return p + o.write(distM === distM ? String(distM) : '\\N', p, 'latin1')
  const dm = Math.round(distM * 10)
  const tenths = dm % 10
  p = putInt(o, p, (dm - tenths) / 10)
  o[p++] = 46
  o[p++] = 48 + tenths
  return p
}

/**
 * Streams a delimited log's bytes into a COPY stream: header, validation and the bad-row report as scanDelimited
 * gives them, with plain rows going from bytes to COPY text without strings or per-row objects. Waits for the stream
 * only when it is full, so parsing overlaps PostgreSQL's work.
 * @param chunks the file's bytes (readByteChunks)
 * @param opts mapping, station and ground elevation (not partial)
 * @param sink the COPY stream, the analysis collector and progress
 * @returns the header and the row report; the caller ends the stream
 * @throws 422 for a header that does not fit the mapping, invalid UTF-8, or an unreadable record
 */
export async function scanDelimitedToCopy(chunks: AsyncIterable<ByteChunk>, opts: ScanOptions, sink: CopyScanSink): Promise<ScanResult> {
  const sc = new CopyScanner(opts, sink)
  const it = chunks[Symbol.asyncIterator]()
  try {
    let carry: Buffer | null = null
    let first = true
    for (let r = await it.next(); !r.done; r = await it.next()) {
      const { bytes, bytesRead } = r.value
      if (first && bytes.indexOf(NL) < 0) {
        await sc.general(r.value, it)
        carry = null
        break
      }
      const b: Buffer = carry ? Buffer.concat([carry, bytes]) : bytes
      carry = null
      const last = b.lastIndexOf(NL)
      if (last < 0) {
        carry = b
        if (b.length > MAX_RECORD_CHARS * 4 || (b.length > MAX_RECORD_CHARS && b.toString('utf8').length > MAX_RECORD_CHARS)) {
          const row = sc.pendingRowOr()
          throw new RecordError(row, `Row ${row} is longer than ${MAX_RECORD_CHARS} characters`)
        }
        continue
      }
      if (!isUtf8(b.subarray(0, last + 1))) throw unprocessable(`The file is not valid UTF-8 text (near byte ${bytesRead})`)
      const start = first && b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf ? 3 : 0
      first = false
      sc.scan(b, start, last + 1)
      // Copy the short tail so the chunk itself can go.
      if (last + 1 < b.length) carry = Buffer.from(b.subarray(last + 1))
      await sc.afterChunk(bytesRead)
    }
    if (carry) {
      const d = new TextDecoder('utf-8', { fatal: true })
      try {
        d.decode(carry, { stream: true })
      } catch {
        throw unprocessable('The file is not valid UTF-8 text (near its end)')
      }
      try {
        d.decode()
      } catch {
        throw unprocessable('The file ends inside a UTF-8 character')
      }
      const b = Buffer.concat([carry, Buffer.from([NL])])
      sc.scan(b, first && b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf ? 3 : 0, b.length)
    }
    sc.end()
    sc.push()
  } catch (e) {
    if (e instanceof RecordError) throw unprocessable(e.message, [{ path: `rows.${e.row}`, message: e.message, row: e.row }])
    throw e
  } finally {
    await it.return?.()
  }
  if (!sc.header) throw unprocessable('The file is empty')
  return { header: sc.header, report: sc.report }
}
