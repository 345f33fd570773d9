import { config } from '../../config.js'
import type { ColumnMapping } from '../../../shared/import/mapping.js'
import { scanDelimited, type RowSink } from './delimitedScan.js'
import { scanGpx } from './gpxScan.js'
import { rowIssues, unprocessable } from './importErrors.js'
import type { SniffResult } from './sniff.js'
import { readTextChunks } from './source.js'

/** Files up to this size are checked in full before the upload is answered; larger ones by their head only. */
export const PRECHECK_BYTES = 1024 * 1024

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
): Promise<void> {
  const complete = sniff.sizeBytes <= PRECHECK_BYTES
  const chunks = readTextChunks(file, { compressed: sniff.compressed, ...(complete ? {} : { limitBytes: PRECHECK_BYTES }) })
  const station = { latDeg: course.stationLat, lonDeg: course.stationLon }
  const maxBad = config().badRowShare
  if (sniff.format === 'gpx') {
    const r = await scanGpx(chunks, { groundElevM: course.groundElevM, station }, NULL_SINK)
    if (!complete) return
    if (r.report.refused(maxBad)) throw unprocessable(r.report.refusalMessage(maxBad), rowIssues(r.report.first))
    if (!r.hasSignal) throw unprocessable('The track has no signal values in its extensions; attach the signal log as a separate file')
    return
  }
  const { report } = await scanDelimited(chunks, { mapping: mapping!, groundElevM: course.groundElevM, station, partial: !complete }, NULL_SINK)
  if (complete && report.refused(maxBad)) throw unprocessable(report.refusalMessage(maxBad), rowIssues(report.first))
}
