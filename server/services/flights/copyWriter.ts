import { once } from 'node:events'
import { finished } from 'node:stream/promises'
import type { Writable } from 'node:stream'
import type { SampleRow } from '../../../shared/import/rowConverter.js'

/** Column order of every COPY into samples. */
export const SAMPLE_COPY_COLUMNS =
  'flight_id, seq, t_ms, lat, lon, alt_m, rssi1_dbm, rssi2_dbm, lq, snr, dist_m, extras'

const FLUSH_CHARS = 64 * 1024

function num(v: number): string {
  return v === v ? String(v) : '\\N'
}

/** COPY text-format escaping: backslash first, then the three characters COPY treats as separators. */
function copyText(s: string): string {
  return /[\\\t\n\r]/.test(s) ? s.replace(/\\/g, '\\\\').replace(/\t/g, '\\t').replace(/\n/g, '\\n').replace(/\r/g, '\\r') : s
}

/** Writes sample rows as COPY text in batches, honouring the stream's backpressure. */
export class CopyRowWriter {
  private parts: string[] = []
  private chars = 0
  private readonly prefix: string

  constructor(
    private readonly stream: Writable,
    flightId: number,
  ) {
    this.prefix = `${flightId}\t`
  }

  /** Queues one row; call flush() once per input chunk. */
  add(seq: number, r: SampleRow, distM: number): void {
    const x = r.text
    const line =
      this.prefix +
      seq +
      '\t' +
      Math.round(r.tMs) +
      '\t' +
      (x.lat ?? r.lat) +
      '\t' +
      (x.lon ?? r.lon) +
      '\t' +
      (x.altM ?? num(r.altM)) +
      '\t' +
      (x.rssi1Dbm ?? num(r.rssi1Dbm)) +
      '\t' +
      (x.rssi2Dbm ?? num(r.rssi2Dbm)) +
      '\t' +
      (x.lq ?? num(r.lq)) +
      '\t' +
      (x.snr ?? num(r.snr)) +
      '\t' +
      num(Math.round(distM * 100) / 100) +
      '\t' +
      (r.extrasJson === null ? '\\N' : copyText(r.extrasJson)) +
      '\n'
    this.parts.push(line)
    this.chars += line.length
  }

  /** Writes the queued rows when enough have gathered (or always, when forced), waiting if the stream is full. */
  async flush(force = false): Promise<void> {
    if (!this.parts.length || (!force && this.chars < FLUSH_CHARS)) return
    const ok = this.stream.write(this.parts.join(''))
    this.parts = []
    this.chars = 0
    if (!ok) await once(this.stream, 'drain')
  }

  /** Writes the rest and ends the COPY. */
  async end(): Promise<void> {
    await this.flush(true)
    this.stream.end()
    await finished(this.stream)
  }
}
