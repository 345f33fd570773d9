import { RecordError, RecordSplitter } from '../../../shared/import/recordSplitter.js'
import { RowReport } from '../../../shared/import/rowReport.js'
import { SignalRowConverter, isAbsoluteTime, type SignalLogMapping, type SignalRow } from '../../../shared/import/signalLog.js'
import { config } from '../../config.js'
import { rowIssues, unprocessable } from './importErrors.js'
import { MAX_RECORD_CHARS } from './delimitedScan.js'
import { readTextChunks } from './source.js'

/** Signal rows kept at most (a 50 Hz log of about 28 hours). */
const MAX_SIGNAL_ROWS = 5_000_000
/** A track point takes the nearest signal row within this time, ms. */
export const SIGNAL_MATCH_MS = 1000

/** A signal log held as arrays, matched to track points by time. */
export class SignalSeries {
  private cursor = 0

  constructor(
    readonly absolute: boolean,
    private readonly t: Float64Array,
    private readonly r1: Float64Array,
    private readonly r2: Float64Array,
    private readonly lq: Float64Array,
    private readonly snr: Float64Array,
    readonly length: number,
  ) {}

  /**
   * The signal row nearest in time to a track point (queries must come in time order).
   * @param absMs the point's epoch ms
   * @param relMs the point's ms from the track's start (used when the log's times are relative)
   * @param out filled when found
   * @returns whether a row lies within SIGNAL_MATCH_MS
   */
  at(absMs: number, relMs: number, out: SignalRow): boolean {
    const q = this.absolute ? absMs : relMs + this.t[0]!
    while (this.cursor + 1 < this.length && this.t[this.cursor + 1]! <= q) this.cursor++
    let k = this.cursor
    if (k + 1 < this.length && Math.abs(this.t[k + 1]! - q) < Math.abs(this.t[k]! - q)) k++
    if (!(Math.abs(this.t[k]! - q) <= SIGNAL_MATCH_MS)) return false
    out.timeMs = this.t[k]!
    out.rssi1Dbm = this.r1[k]!
    out.rssi2Dbm = this.r2[k]!
    out.lq = this.lq[k]!
    out.snr = this.snr[k]!
    return true
  }
}

/**
 * Reads a separate signal log (beside a GPX track) into arrays, refusing it like any log when too many rows are bad.
 * @param file the uploaded signal log
 * @param compressed whether it is gzip
 * @param mapping its mapping (time plus signal columns)
 * @throws 422 with rows and columns
 */
export async function loadSignalLog(file: string, compressed: boolean, mapping: SignalLogMapping): Promise<SignalSeries> {
  let cap = 4096
  let a = { t: new Float64Array(cap), r1: new Float64Array(cap), r2: new Float64Array(cap), lq: new Float64Array(cap), snr: new Float64Array(cap) }
  let n = 0
  let conv: SignalRowConverter | null = null
  const report = new RowReport()
  const row: SignalRow = { timeMs: 0, rssi1Dbm: NaN, rssi2Dbm: NaN, lq: NaN, snr: NaN }
  const splitter = new RecordSplitter({ delimiter: mapping.delimiter, maxRecordChars: MAX_RECORD_CHARS }, (fields, line) => {
    if (!conv) {
      try {
        conv = new SignalRowConverter(mapping, fields)
      } catch (e) {
        throw unprocessable((e as Error).message, [{ path: 'signalMapping', message: (e as Error).message, row: 1 }])
      }
      return
    }
    const o = conv.convert(fields, row)
    if (o !== 'ok') return report.bad(line, o.column, o.reason)
    if (n === MAX_SIGNAL_ROWS) throw unprocessable(`The signal log has more than ${MAX_SIGNAL_ROWS} rows`)
    if (n === cap) {
      cap *= 2
      const grow = (x: Float64Array) => {
        const y = new Float64Array(cap)
        y.set(x)
        return y
      }
      a = { t: grow(a.t), r1: grow(a.r1), r2: grow(a.r2), lq: grow(a.lq), snr: grow(a.snr) }
    }
    a.t[n] = row.timeMs
    a.r1[n] = row.rssi1Dbm
    a.r2[n] = row.rssi2Dbm
    a.lq[n] = row.lq
    a.snr[n] = row.snr
    n++
    report.goodRows++
  })
  try {
    for await (const chunk of readTextChunks(file, { compressed })) splitter.push(chunk.text)
    splitter.end()
  } catch (e) {
    if (e instanceof RecordError) throw unprocessable(`Signal log: ${e.message}`, [{ path: `signalRows.${e.row}`, message: e.message, row: e.row }])
    throw e
  }
  const maxBad = config().badRowShare
  if (report.refused(maxBad)) throw unprocessable(`Signal log: ${report.refusalMessage(maxBad)}`, rowIssues(report.first))
  return new SignalSeries(isAbsoluteTime(mapping.timeFormat), a.t, a.r1, a.r2, a.lq, a.snr, n)
}
