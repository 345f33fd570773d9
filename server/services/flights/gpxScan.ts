import { distanceFromStation } from './stationDistance.js'
import { parseIsoCell, parseNumberCell } from '../../../shared/import/cellValues.js'
import { ALT_M_RANGE, LQ_PCT_RANGE, SIGNAL_DBM_RANGE, SNR_DB_RANGE, emptySampleRow } from '../../../shared/import/rowConverter.js'
import { RowReport } from '../../../shared/import/rowReport.js'
import { unprocessable } from './importErrors.js'
import type { RowSink } from './delimitedScan.js'
import type { TextChunk } from './source.js'
import type { SignalSeries } from './signalSeries.js'
import type { SignalRow } from '../../../shared/import/signalLog.js'

/** Longest single track point accepted, characters. */
const MAX_POINT_CHARS = 64 * 1024

export interface GpxScanOptions {
  groundElevM: number
  station: { latDeg: number; lonDeg: number }
  /** A separate signal log, used for points without signal values in their extensions. */
  signal?: SignalSeries
}

export interface GpxScanResult {
  report: RowReport
  /** Whether any track point carried a signal value in its extensions. */
  hasSignal: boolean
}

const ATTR = (name: string) => new RegExp(`\\b${name}\\s*=\\s*["']([^"']*)["']`)
const LAT = ATTR('lat')
const LON = ATTR('lon')
const CHILD = /<(?:[\w.-]+:)?([\w.-]+)[^>]*>([^<]*)<\//g

/** Extension element names (without namespace prefix) mapped to a sample field. */
function extensionRole(name: string): 'rssi1' | 'rssi2' | 'lq' | 'snr' | null {
  const n = name.toLowerCase()
  if (/snr/.test(n)) return 'snr'
  if (/(^|_)lq$|link_?quality|quality/.test(n)) return 'lq'
  if (/(rssi|signal)/.test(n)) return /(2|_b)$/.test(n) ? 'rssi2' : 'rssi1'
  return null
}

/**
 * Streams GPX 1.1 track points (lat/lon attributes, ele, time, and signal values from extensions) without building a
 * document: each <trkpt> … </trkpt> is cut out on its own and read with small patterns.
 * @throws 422 when a track point is runaway-long or the file holds no track points
 */
export async function scanGpx(chunks: AsyncIterable<TextChunk>, opts: GpxScanOptions, sink: RowSink): Promise<GpxScanResult> {
  const report = new RowReport()
  const out = emptySampleRow()
  const distM = distanceFromStation(opts.station.latDeg, opts.station.lonDeg)
  let rest = ''
  let point = 0
  let seq = 0
  let t0 = NaN
  let lastT = -Infinity
  let hasSignal = false
  const fromLog: SignalRow = { timeMs: 0, rssi1Dbm: NaN, rssi2Dbm: NaN, lq: NaN, snr: NaN }
  const onPoint = (xml: string) => {
    point++
    const lat = parseNumberCell(LAT.exec(xml)?.[1] ?? '', false)
    const lon = parseNumberCell(LON.exec(xml)?.[1] ?? '', false)
    if (!(lat >= -90 && lat <= 90)) return report.bad(point, 'lat', 'latitude must be a number in [-90, 90]')
    if (!(lon >= -180 && lon <= 180)) return report.bad(point, 'lon', 'longitude must be a number in [-180, 180]')
    const v: Record<string, string> = {}
    const sig: Record<string, number> = {}
    CHILD.lastIndex = 0
    for (let m = CHILD.exec(xml); m; m = CHILD.exec(xml)) {
      const name = m[1]!
      const role = name === 'ele' || name === 'time' ? null : extensionRole(name)
      if (name === 'ele' || name === 'time') v[name] = m[2]!.trim()
      else if (role && !(role in sig)) sig[role] = parseNumberCell(m[2]!, false)
    }
    const abs = parseIsoCell(v.time ?? '')
    if (!Number.isFinite(abs)) return report.bad(point, 'time', 'time is missing or unreadable')
    const t = seq === 0 ? 0 : abs - t0
    if (t < lastT) return report.bad(point, 'time', 'time goes backwards')
    const ele = v.ele === undefined ? NaN : parseNumberCell(v.ele, false)
    if (v.ele !== undefined && !(ele >= ALT_M_RANGE[0] && ele <= ALT_M_RANGE[1] + opts.groundElevM)) {
      return report.bad(point, 'ele', 'elevation must be a number in metres')
    }
    if (!('rssi1' in sig) && opts.signal?.at(abs, t, fromLog)) {
      sig.rssi1 = fromLog.rssi1Dbm
      if (fromLog.rssi2Dbm === fromLog.rssi2Dbm) sig.rssi2 = fromLog.rssi2Dbm
      if (fromLog.lq === fromLog.lq && !('lq' in sig)) sig.lq = fromLog.lq
      if (fromLog.snr === fromLog.snr && !('snr' in sig)) sig.snr = fromLog.snr
    }
    const r1 = sig.rssi1 ?? NaN
    if ('rssi1' in sig && !(r1 >= SIGNAL_DBM_RANGE[0] && r1 <= SIGNAL_DBM_RANGE[1])) {
      return report.bad(point, 'rssi', `signal must be a number in [${SIGNAL_DBM_RANGE.join(', ')}] dBm`)
    }
    const lq = sig.lq ?? NaN
    if ('lq' in sig && !(lq >= LQ_PCT_RANGE[0] && lq <= LQ_PCT_RANGE[1])) return report.bad(point, 'lq', 'link quality must be in [0, 100]')
    const snr = sig.snr ?? NaN
    if ('snr' in sig && !(snr >= SNR_DB_RANGE[0] && snr <= SNR_DB_RANGE[1])) return report.bad(point, 'snr', 'SNR out of range')
    if ('rssi1' in sig) hasSignal = true
    if (seq === 0) t0 = abs
    lastT = t
    out.tMs = t
    out.lat = lat
    out.lon = lon
    out.altM = ele - opts.groundElevM
    out.rssi1Dbm = r1
    out.rssi2Dbm = sig.rssi2 ?? NaN
    out.lq = lq
    out.snr = snr
    out.extrasJson = null
    out.text.lat = out.text.lon = out.text.altM = out.text.rssi1Dbm = out.text.rssi2Dbm = out.text.lq = out.text.snr = null
    sink.row(seq++, out, distM(lat, lon))
    report.goodRows++
  }
  let sawGpx = false
  for await (const chunk of chunks) {
    let buf = rest + chunk.text
    if (!sawGpx && /<gpx[\s>]/.test(buf)) sawGpx = true
    let start = 0
    for (;;) {
      const open = buf.indexOf('<trkpt', start)
      if (open < 0) {
        start = Math.max(start, buf.length - 8)
        break
      }
      const close = buf.indexOf('</trkpt>', open)
      if (close < 0) {
        start = open
        break
      }
      onPoint(buf.slice(open, close))
      start = close + 8
    }
    rest = buf.slice(start)
    buf = ''
    if (rest.length > MAX_POINT_CHARS) throw unprocessable(`Track point ${point + 1} is longer than ${MAX_POINT_CHARS} characters`)
    await sink.afterChunk(chunk.bytesRead, seq)
  }
  if (!sawGpx) throw unprocessable('The file is not a GPX document')
  return { report, hasSignal }
}
