import { config } from '../../config.js'
import type { ColumnMapping } from '../../../shared/import/mapping.js'
import { scanDelimited, type RowSink } from './delimitedScan.js'
import { scanGpx } from './gpxScan.js'
import { rowIssues, unprocessable } from './importErrors.js'
import type { SniffResult } from './sniff.js'
import { readTextChunks } from './source.js'
import { loadSignalLog } from './signalSeries.js'
import type { SignalLogMapping } from '../../../shared/import/signalLog.js'

/** A separate signal log sent with a GPX track. */
export interface SignalUpload {
  file: string
  compressed: boolean
  mapping: SignalLogMapping
}

/** Files up to this size are checked in full before the upload is answered; larger ones by their head only. */
export const PRECHECK_BYTES = 1024 * 1024

/** Why a track without any signal value is refused. */
export function noSignalMessage(hadLog: boolean): string {
  return hadLog
    ? 'The signal log does not overlap the track in time (no signal value within 1 s of any track point)'
    : 'The track has no signal values in its extensions; attach the signal log as a separate file'
}

const NULL_SINK: RowSink = { row: () => undefined, afterChunk: async () => undefined }

/**
 * Checks an upload before it is queued, with the same scanner the import uses: a small file is judged in full
 * (so a bad file is refused at once with its rows and columns), a large one by its first megabyte (header, mapping,
 * encoding, runaway lines); the import judges the rest.
 * @throws 422 with row/column details, 415 for non-text content
 */
export async function precheckUpload(
  file: string,
  sniff: SniffResult,
  mapping: ColumnMapping | null,
  course: { stationLat: number; stationLon: number; groundElevM: number },
  signalLog: SignalUpload | null = null,
): Promise<void> {
  const complete = sniff.sizeBytes <= PRECHECK_BYTES
  const chunks = readTextChunks(file, { compressed: sniff.compressed, ...(complete ? {} : { limitBytes: PRECHECK_BYTES }) })
  const station = { latDeg: course.stationLat, lonDeg: course.stationLon }
  const maxBad = config().badRowShare
  if (sniff.format === 'gpx') {
    const signal = signalLog ? await loadSignalLog(signalLog.file, signalLog.compressed, signalLog.mapping) : undefined
    const r = await scanGpx(chunks, { groundElevM: course.groundElevM, station, ...(signal ? { signal } : {}) }, NULL_SINK)
    if (!complete) return
    if (r.report.refused(maxBad)) throw unprocessable(r.report.refusalMessage(maxBad), rowIssues(r.report.first))
    if (!r.hasSignal) throw unprocessable(noSignalMessage(Boolean(signal)))
    return
  }
  const { report } = await scanDelimited(chunks, { mapping: mapping!, groundElevM: course.groundElevM, station, partial: !complete }, NULL_SINK)
  if (complete && report.refused(maxBad)) throw unprocessable(report.refusalMessage(maxBad), rowIssues(report.first))
}
