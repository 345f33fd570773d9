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
import { computeAnalysis, storeAnalysis, type AnalysisOutcome } from './analyse.js'
import { terrainSampler } from '../terrain.js'
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
  overview: OverviewBuilder
}

/**
 * Parses the file and COPYs its rows on `client` (inside the caller's transaction). `whileDraining` gets the
 * analysis arrays once every row is parsed and accepted, and runs while PostgreSQL still works through the queued COPY.
 */
async function copyRows(
  client: pg.PoolClient,
  imp: FlightImport,
  course: Course,
  setup: LinkSetup | null,
  compressed: boolean,
  bytesTotal: number,
  whileDraining: (collector: SeriesCollector) => void,
): Promise<ScanOutcome> {
  // A deep write buffer lets parsing run ahead while PostgreSQL works through the previous chunks.
  const copy = client.query(copyStreams.from(`COPY samples (${SAMPLE_COPY_COLUMNS}) FROM STDIN`, { highWaterMark: COPY_BUFFER_BYTES }))
  // Errors reach the writer through drain/finish waits; this listener only keeps a late one (after the connection
  // is dropped on failure) from becoming an unhandled 'error' event.
  copy.on('error', () => undefined)
  const writer = new CopyRowWriter(copy, imp.flightId)
  const collector = new SeriesCollector()
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
  // Queue the last rows first (the delimited scanner already has), so PostgreSQL has work while this thread is busy.
  const queued = writer.flush(true)
  whileDraining(collector)
  await queued
  await writer.end()
  report(bytesTotal, rowReport.goodRows, true)
  return { report: rowReport, overview }
}

/** Turns any error into the failure record kept on the import. */
function toFailure(e: unknown): ImportFailure {
  if (e instanceof HttpError) return { status: e.status, code: e.code, message: e.message, details: e.details }
  logger.error({ err: e }, 'flight import failed')
  return { status: 500, code: 'INTERNAL', message: 'The import failed unexpectedly' }
}

/**
 * The import job: one transaction creates (or, on re-import, refills) the flight and COPYs its samples; a refused
 * file rolls everything back and leaves only the failure on the import record. The analysis runs on the arrays
 * collected while parsing, while the COPY drains; it is stored after the commit, and the original is kept compressed.
 * @param importId the import record
 */
export async function runImport(importId: number): Promise<void> {
  const imp = await FlightImport.findByPk(importId)
  if (!imp || imp.status !== 'queued' || !imp.tempFile) return
  await imp.update({ status: 'importing' })
  const p = imp.params
  let client: pg.PoolClient | null = null
  let outcome: ScanOutcome
  let analysed: AnalysisOutcome | null = null
  let archiving: Promise<string | null> | null = null
  const compressed = imp.params.compressed === true
  const t0 = performance.now()
  let t1 = t0
  try {
    const course = await Course.findByPk(p.courseId)
    if (!course) throw unprocessable('The course no longer exists')
    const [setup, terrain] = await Promise.all([LinkSetup.findByPk(p.setupId), terrainSampler(course.id)])
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
    // The analysis needs every row but not the stored ones: it runs while PostgreSQL drains the COPY queue, and
    // is stored only after the samples commit.
    outcome = await copyRows(client, imp, course, setup, compressed, size, (collector) => {
      t1 = performance.now()
      analysed = computeAnalysis(collector.samples(), course, setup, terrain)
      // Compressing the original (thread pool) overlaps the rest of the COPY too; it is recorded after the commit.
      archiving = archiveUpload(imp, compressed)
    })
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
    const raw = await archiving
    if (imp.kind === 'create') await removeFiles(imp.tempFile, p.signalFile, raw)
    await imp.update({ status: 'failed', failure: toFailure(e), tempFile: null })
    return
  }
  await imp.update({ status: 'analysing' })
  const t2 = performance.now()
  await Promise.all([storeAnalysis(imp.flightId, analysed!), archiving!.then((raw) => recordOriginal(imp, raw))])
  logger.info(
    { flightId: imp.flightId, rows: outcome.report.goodRows, parseMs: Math.round(t1 - t0), importMs: Math.round(t2 - t0), afterCommitMs: Math.round(performance.now() - t2) },
    'flight imported',
  )
  // The signal log of a GPX track is read once; the kept original is the track itself.
  await removeFiles(p.signalFile)
  const flight = await Flight.findByPk(imp.flightId, { attributes: ['status'] })
  await imp.update({ status: flight?.status === 'failed' ? 'failed' : 'ready', tempFile: null })
}

/** Moves the upload to raw/ (compressed) and records it on the flight; a re-import reads the kept original in place. */
export async function keepOriginal(imp: FlightImport, compressed: boolean): Promise<void> {
  await recordOriginal(imp, await archiveUpload(imp, compressed))
}

/** Compresses an upload into raw/; null for a re-import (it reads the kept original in place) or when that fails. */
function archiveUpload(imp: FlightImport, compressed: boolean): Promise<string | null> {
  if (imp.kind !== 'create') return Promise.resolve(null)
  return archiveOriginal(imp.tempFile!, compressed).catch(async (e: Error) => {
    logger.warn({ err: e.message, flightId: imp.flightId }, 'could not keep the original log')
    await removeFiles(imp.tempFile)
    return null
  })
}

/** Records a kept original on the flight; removes it when the flight is gone or the update fails. */
async function recordOriginal(imp: FlightImport, raw: string | null): Promise<void> {
  if (!raw) return
  try {
    const [n] = await Flight.update({ rawFile: raw }, { where: { id: imp.flightId } })
    if (n === 0) await removeFiles(raw)
  } catch (e) {
    logger.warn({ err: (e as Error).message, flightId: imp.flightId }, 'could not keep the original log')
    await removeFiles(raw)
  }
}
