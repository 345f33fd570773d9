import { analyseFlight, METHOD_VERSION } from '../../../shared/analysis/analyseFlight.js'
import type { FlightSamples } from '../../../shared/analysis/types.js'
import { pgPool } from '../../db.js'
import { logger } from '../../logger.js'
import { Course } from '../../models/Course.js'
import { Flight } from '../../models/Flight.js'
import { LinkSetup } from '../../models/LinkSetup.js'
import { terrainSampler } from '../terrain.js'
import { buildFlightInput } from './analysisInput.js'
import { SeriesCollector } from './seriesCollector.js'
import { OverviewBuilder, saveOverview } from './overview.js'
import { emptySampleRow } from '../../../shared/import/rowConverter.js'

const READ_BATCH = 50_000

/**
 * Reads a stored flight's samples back in seq batches into a bounded collector (re-analysis only; an import
 * analyses the arrays it already parsed). Also feeds `overview` when given, so a re-analysis refreshes it in the same pass.
 * @param flightId the flight
 * @param overview builder of the flight's stored overview
 * @returns the analysis arrays
 */
async function readSeries(flightId: number, overview?: OverviewBuilder): Promise<FlightSamples & { thinnedBy: number }> {
  const c = new SeriesCollector()
  const row = emptySampleRow()
  const n = (v: number | null) => (v === null ? NaN : v)
  for (let from = 0; ; from += READ_BATCH) {
    const { rows } = await pgPool().query<{ seq: number; t: string; la: number; lo: number; a: number | null; r1: number | null; r2: number | null; q: number | null; s: number | null; d: number | null }>(
      `SELECT seq, t_ms AS t, lat AS la, lon AS lo, alt_m AS a, rssi1_dbm AS r1, rssi2_dbm AS r2, lq AS q, snr AS s, dist_m AS d
         FROM samples WHERE flight_id = $1 AND seq >= $2 AND seq < $3 ORDER BY seq`,
      [flightId, from, from + READ_BATCH],
    )
    for (const r of rows) {
      row.tMs = Number(r.t)
      row.lat = r.la
      row.lon = r.lo
      row.altM = n(r.a)
      row.rssi1Dbm = n(r.r1)
      row.rssi2Dbm = n(r.r2)
      row.lq = n(r.q)
      row.snr = n(r.s)
      c.add(row)
      overview?.addValues(r.seq, row.tMs, r.la, r.lo, r.a, r.r1, r.r2, r.q, r.s, r.d)
    }
    if (rows.length < READ_BATCH) break
  }
  return c.samples()
}

/** An analysis computed ahead of storing it: the result, or the reason the core refused the input. */
export type AnalysisOutcome =
  | { analysis: object; failureReason: null }
  | { analysis: null; failureReason: string }

/**
 * Runs the shared analysis on collected arrays (synchronous, no I/O), so an import can run it while PostgreSQL is
 * still working through the COPY.
 * @param series the analysis arrays
 * @param course the flight's course, null when gone
 * @param setup the flight's link setup, null when gone
 * @param terrain the course's terrain sampler, null without terrain
 * @returns the analysis to store, or the failure reason
 */
export function computeAnalysis(
  series: FlightSamples & { thinnedBy: number },
  course: Course | null,
  setup: LinkSetup | null,
  terrain: Awaited<ReturnType<typeof terrainSampler>>,
): AnalysisOutcome {
  try {
    if (!course || !setup) throw new Error('The flight has no course or setup')
    const { result } = analyseFlight(buildFlightInput(series, course, setup, terrain))
    return { analysis: { ...result, thinnedBy: series.thinnedBy, analysedSampleCount: series.timeMs.length }, failureReason: null }
  } catch (e) {
    return { analysis: null, failureReason: `Analysis failed: ${e instanceof Error ? e.message : String(e)}` }
  }
}

/**
 * Stores an analysis computed by computeAnalysis: status ends 'ready', or 'failed' with the reason.
 * @param flightId the flight
 * @param outcome the computed analysis
 */
export async function storeAnalysis(flightId: number, outcome: AnalysisOutcome): Promise<void> {
  if (outcome.failureReason !== null) {
    logger.warn({ flightId, err: outcome.failureReason }, 'flight analysis failed')
    await Flight.update({ status: 'failed', failureReason: outcome.failureReason }, { where: { id: flightId } })
    return
  }
  await Flight.update({ analysis: outcome.analysis, analysisVersion: METHOD_VERSION, status: 'ready', failureReason: null }, { where: { id: flightId } })
}

/**
 * Runs the shared analysis for a stored flight and saves the result with the method version; status ends 'ready',
 * or 'failed' with the reason when the core refuses the input.
 * @param flightId the flight
 * @param samples arrays collected during the import, or undefined to read them back
 */
export async function analyseAndStore(flightId: number, samples?: FlightSamples & { thinnedBy: number }): Promise<void> {
  const flight = await Flight.findByPk(flightId)
  if (!flight) return
  await flight.update({ status: 'analysing', failureReason: null })
  try {
    const [course, setup] = await Promise.all([Course.findByPk(flight.courseId), LinkSetup.findByPk(flight.setupId)])
    if (!course || !setup) throw new Error('The flight has no course or setup')
    // a re-analysis reads the samples back (distances may have changed): refresh the overview from the same pass
    const overview = samples ? undefined : new OverviewBuilder(setup.sensitivityDbm)
    const series = samples ?? (await readSeries(flightId, overview))
    if (overview) await saveOverview(flightId, overview.result())
    const input = buildFlightInput(series, course, setup, await terrainSampler(course.id))
    const { result } = analyseFlight(input)
    const analysis = { ...result, thinnedBy: series.thinnedBy, analysedSampleCount: series.timeMs.length }
    await flight.update({ analysis, analysisVersion: METHOD_VERSION, status: 'ready', failureReason: null })
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e)
    logger.warn({ flightId, err: reason }, 'flight analysis failed')
    await flight.update({ status: 'failed', failureReason: `Analysis failed: ${reason}` })
  }
}
