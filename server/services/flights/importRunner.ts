import copyStreams from 'pg-copy-streams'
import type pg from 'pg'
import { config } from '../../config.js'
import { pgPool } from '../../db.js'
import { HttpError } from '../../errors.js'
import { logger } from '../../logger.js'
import { Course } from '../../models/Course.js'
import { Flight } from '../../models/Flight.js'
import { FlightImport } from '../../models/FlightImport.js'
import type { ImportFailure, ImportProgress } from '../../../shared/types/flight.js'
import type { RowReport } from '../../../shared/import/rowReport.js'
import type { SampleRow } from '../../../shared/import/rowConverter.js'
import { analyseAndStore } from './analyse.js'
import { CopyRowWriter, SAMPLE_COPY_COLUMNS } from './copyWriter.js'
import { scanDelimitedToCopy } from './copyScan.js'
import type { RowSink } from './delimitedScan.js'
import { scanGpx } from './gpxScan.js'
import { rowIssues, unprocessable } from './importErrors.js'
import { SeriesCollector } from './seriesCollector.js'
import { OverviewBuilder, saveOverview } from './overview.js'
import { LinkSetup } from '../../models/LinkSetup.js'
import { loadSignalLog } from './signalSeries.js'
import { noSignalMessage } from './precheck.js'
import { readByteChunks, readTextChunks } from './source.js'
import { archiveOriginal, removeFiles } from './storage.js'

const PROGRESS_EVERY_MS = 500
/** File read size for delimited logs. */
const READ_BYTES = 256 * 1024
/** COPY text queued for PostgreSQL before the parser waits. */
const COPY_BUFFER_BYTES = 2 * 1024 * 1024

/** Writes progress at most every half second, never two writes at once, off the hot path. */
function progressReporter(importId: number, bytesTotal: number) {
  let last = 0
  let busy: Promise<unknown> | null = null
  return (bytesDone: number, rowsDone: number, force = false) => {
    const now = Date.now()
    if (!force && (busy || now - last < PROGRESS_EVERY_MS)) return
    last = now
    const progress: ImportProgress = { bytesDone, bytesTotal, rowsDone }
    busy = FlightImport.update({ progress }, { where: { id: importId } })
      .catch(() => undefined)
      .finally(() => (busy = null))
  }
}

interface ScanOutcome {
  report: RowReport
  collector: SeriesCollector
  overview: OverviewBuilder
}

/** Parses the file and COPYs its rows on `client` (inside the caller's transaction). */
async function copyRows(client: pg.PoolClient, imp: FlightImport, course: Course, compressed: boolean, bytesTotal: number): Promise<ScanOutcome> {
  // A deep write buffer lets parsing run ahead while PostgreSQL works through the previous chunks.
  const copy = client.query(copyStreams.from(`COPY samples (${SAMPLE_COPY_COLUMNS}) FROM STDIN`, { highWaterMark: COPY_BUFFER_BYTES }))
  // Errors reach the writer through drain/finish waits; this listener only keeps a late one (after the connection
  // is dropped on failure) from becoming an unhandled 'error' event.
  copy.on('error', () => undefined)
  const writer = new CopyRowWriter(copy, imp.flightId)
  const collector = new SeriesCollector()
  const setup = await LinkSetup.findByPk(imp.params.setupId, { attributes: ['sensitivityDbm'] })
  const overview = new OverviewBuilder(setup?.sensitivityDbm ?? -1e9)
  const report = progressReporter(imp.id, bytesTotal)
  const sink: RowSink = {
    row(seq, r, distM) {
      writer.add(seq, r, distM)
      collector.add(r)
      overview.addRow(seq, r, distM)
    },
    async afterChunk(bytes, rows) {
      await writer.flush()
      report(bytes, rows)
    },
  }
  const collect = (seq: number, r: SampleRow, distM: number) => {
    collector.add(r)
    overview.addRow(seq, r, distM)
  }
  const station = { latDeg: course.stationLat, lonDeg: course.stationLon }
  let rowReport: RowReport
  if (imp.sourceFormat === 'gpx') {
    const chunks = readTextChunks(imp.tempFile!, { compressed })
    const p = imp.params
    const signal = p.signalFile && p.signalMapping ? await loadSignalLog(p.signalFile, p.signalCompressed === true, p.signalMapping) : undefined
    const r = await scanGpx(chunks, { groundElevM: course.groundElevM, station, ...(signal ? { signal } : {}) }, sink)
    if (r.report.goodRows > 0 && !r.hasSignal) throw unprocessable(noSignalMessage(Boolean(signal)))
    rowReport = r.report
  } else {
    const bytes = readByteChunks(imp.tempFile!, { compressed, chunkBytes: READ_BYTES })
    const opts = { mapping: imp.params.mapping!, groundElevM: course.groundElevM, station }
    rowReport = (await scanDelimitedToCopy(bytes, opts, { copy, flightId: imp.flightId, collect, progress: report })).report
  }
  const maxBad = config().badRowShare
  if (rowReport.refused(maxBad)) throw unprocessable(rowReport.refusalMessage(maxBad), rowIssues(rowReport.first))
  await writer.end()
  report(bytesTotal, rowReport.goodRows, true)
  return { report: rowReport, collector, overview }
}

/** Turns any error into the failure record kept on the import. */
function toFailure(e: unknown): ImportFailure {
  if (e instanceof HttpError) return { status: e.status, code: e.code, message: e.message, details: e.details }
  logger.error({ err: e }, 'flight import failed')
  return { status: 500, code: 'INTERNAL', message: 'The import failed unexpectedly' }
}

/**
 * The import job: one transaction creates (or, on re-import, refills) the flight and COPYs its samples; a refused
 * file rolls everything back and leaves only the failure on the import record. Then the analysis runs on the arrays
 * collected while parsing, and the original is kept compressed.
 * @param importId the import record
 */
export async function runImport(importId: number): Promise<void> {
  const imp = await FlightImport.findByPk(importId)
  if (!imp || imp.status !== 'queued' || !imp.tempFile) return
  await imp.update({ status: 'importing' })
  const p = imp.params
  let client: pg.PoolClient | null = null
  let outcome: ScanOutcome
  const compressed = imp.params.compressed === true
  const t0 = performance.now()
  try {
    const course = await Course.findByPk(p.courseId)
    if (!course) throw unprocessable('The course no longer exists')
    const { size } = await import('node:fs/promises').then((f) => f.stat(imp.tempFile!))
    client = await pgPool().connect()
    await client.query('BEGIN')
    if (imp.kind === 'create') {
      await client.query(
        `INSERT INTO flights (id, team_id, course_id, setup_id, created_by, name, flown_on, notes, status, mapping, source_format)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, 'importing', $9, $10)`,
        [imp.flightId, imp.teamId, p.courseId, p.setupId, imp.createdBy, p.name, p.flownOn, p.notes, JSON.stringify(p.mapping), imp.sourceFormat],
      )
    } else {
      await client.query('DELETE FROM samples WHERE flight_id = $1', [imp.flightId])
    }
    outcome = await copyRows(client, imp, course, compressed, size)
    await client.query(
      `UPDATE flights SET row_count = $2, bad_row_count = $3, row_errors = $4, mapping = $5, status = 'analysing',
         analysis = NULL, analysis_version = NULL, failure_reason = NULL, updated_at = now() WHERE id = $1`,
      [imp.flightId, outcome.report.goodRows, outcome.report.badRows, JSON.stringify(outcome.report.toDto()), JSON.stringify(p.mapping)],
    )
    // the overview commits with the samples it was built from (a re-import replaces it)
    await saveOverview(imp.flightId, outcome.overview.result(), client)
    await client.query('COMMIT')
    client.release()
    client = null
  } catch (e) {
    // Dropping the connection aborts an open COPY and rolls the transaction back in one step.
    client?.release(true)
    if (imp.kind === 'create') await removeFiles(imp.tempFile, p.signalFile)
    await imp.update({ status: 'failed', failure: toFailure(e), tempFile: null })
    return
  }
  await imp.update({ status: 'analysing' })
  const t1 = performance.now()
  // Compressing the original runs in the thread pool while the analysis uses this thread.
  await Promise.all([analyseAndStore(imp.flightId, outcome.collector.samples()), keepOriginal(imp, compressed)])
  logger.info(
    { flightId: imp.flightId, rows: outcome.report.goodRows, importMs: Math.round(t1 - t0), analysisMs: Math.round(performance.now() - t1) },
    'flight imported',
  )
  // The signal log of a GPX track is read once; the kept original is the track itself.
  await removeFiles(p.signalFile)
  const flight = await Flight.findByPk(imp.flightId, { attributes: ['status'] })
  await imp.update({ status: flight?.status === 'failed' ? 'failed' : 'ready', tempFile: null })
}

/** Moves the upload to raw/ (compressed) and records it on the flight; a re-import reads the kept original in place. */
export async function keepOriginal(imp: FlightImport, compressed: boolean): Promise<void> {
  // A re-import reads the kept original in place.
  if (imp.kind !== 'create') return
  try {
    const raw = await archiveOriginal(imp.tempFile!, compressed)
    const [n] = await Flight.update({ rawFile: raw }, { where: { id: imp.flightId } })
    if (n === 0) await removeFiles(raw)
  } catch (e) {
    logger.warn({ err: (e as Error).message, flightId: imp.flightId }, 'could not keep the original log')
    await removeFiles(imp.tempFile)
  }
}
