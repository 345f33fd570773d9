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

/** A distance to 0.1 m as text through integers (formatting integers is much cheaper than doubles). */
function decimetres(distM: number): string {
  if (!(distM >= 0) || distM > 2e8) return num(distM)
  const dm = Math.round(distM * 10)
  return `${(dm - (dm % 10)) / 10}.${dm % 10}`
}

/**
 * COPY text-format escaping for JSON text: JSON.stringify already writes tab, newline and carriage return as escapes,
 * so only its backslashes need doubling.
 */
function copyJson(json: string): string {
  return json.indexOf('\\') < 0 ? json : json.replace(/\\/g, '\\\\')
}

/**
 * One samples row as a COPY text line.
 * @param prefix the flight id and a tab
 * @param seq row number within the flight
 * @param r converted values (cell text used where it can be stored as written)
 * @param distM ground distance from the station
 */
export function copyLine(prefix: string, seq: number, r: SampleRow, distM: number): string {
  const x = r.text
  return (
    prefix +
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
    decimetres(distM) +
    '\t' +
    (r.extrasJson === null ? '\\N' : copyJson(r.extrasJson)) +
    '\n'
  )
}

/** Writes sample rows as COPY text in batches, honouring the stream's backpressure. */
export class CopyRowWriter {
  // One growing string: V8 keeps it as a rope and flattens it once, when it is written.
  private buf = ''
  private readonly prefix: string

  constructor(
    private readonly stream: Writable,
    flightId: number,
  ) {
    this.prefix = `${flightId}\t`
  }

  /** Queues one row; call flush() once per input chunk. */
  add(seq: number, r: SampleRow, distM: number): void {
    this.buf += copyLine(this.prefix, seq, r, distM)
  }

  /** Writes the queued rows when enough have gathered (or always, when forced), waiting if the stream is full. */
  async flush(force = false): Promise<void> {
    if (!this.buf.length || (!force && this.buf.length < FLUSH_CHARS)) return
    const ok = this.stream.write(this.buf)
    this.buf = ''
    if (!ok) await once(this.stream, 'drain')
  }

  /** Writes the rest and ends the COPY. */
  async end(): Promise<void> {
    await this.flush(true)
    this.stream.end()
    await finished(this.stream)
  }
}
