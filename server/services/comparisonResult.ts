import { censoredMatchedAdvantage, type ComparedSeries } from '../../shared/compare/censoredAdvantage.js'
import { advantageEquivalents, predictionFlag } from '../../shared/compare/equivalents.js'
import { predictedAdvantageDb, typicalDirection, type TypicalDirection } from '../../shared/compare/predictedAdvantage.js'
import type { FlightAnalysis } from '../../shared/analysis/types.js'
import { localOffsetM } from '../../shared/geo/localOffset.js'
import { predictedRangeM } from '../../shared/propagation/predictions.js'
import type { ComparisonPreviewInput } from '../../shared/schemas/comparison.js'
import type { AdvantageDto, ComparedFlightDto, ComparisonResultDto } from '../../shared/types/comparison.js'
import type { CourseDto } from '../../shared/types/course.js'
import type { LinkSetupDto } from '../../shared/types/setup.js'
import { pgPool } from '../db.js'
import { conflict, notFound } from '../errors.js'
import { loadCourse } from './courses.js'
import { loadSetup } from './setups.js'

/** Distance bin of the matched comparison, m. */
export const COMPARISON_BIN_WIDTH_M = 50
const SCATTER_POINTS = 700
const TRACK_POINTS = 500

interface FlightRow {
  id: number
  name: string
  flown_on: string
  course_id: number
  setup_id: number
  status: string
  analysis: FlightAnalysis | null
}

interface LoadedFlight {
  row: FlightRow
  analysis: FlightAnalysis
  setup: LinkSetupDto
  course: CourseDto
  series: ComparedSeries
  lat: Float64Array
  lon: Float64Array
  direction: TypicalDirection | null
}

async function loadFlightRows(teamId: number, ids: number[]): Promise<FlightRow[]> {
  // bigint[]: an id past the int range is simply not found (404), instead of a cast error (500)
  const { rows } = await pgPool().query<FlightRow>(
    `SELECT id, name, flown_on::text AS flown_on, course_id, setup_id, status, analysis
       FROM flights WHERE team_id = $1 AND id = ANY($2::bigint[])`,
    [teamId, ids],
  )
  const missing = ids.filter((id) => !rows.some((r) => r.id === id))
  if (missing.length) throw notFound(`Flight ${missing.join(', ')}`)
  const notReady = rows.filter((r) => r.status !== 'ready' || !r.analysis)
  if (notReady.length) throw conflict(`Flight ${notReady.map((r) => r.id).join(', ')} is not analysed yet`)
  return ids.map((id) => rows.find((r) => r.id === id)!)
}

/** Reads one flight's positions and signals in one query (best antenna of a diversity pair). */
async function loadSeries(flightId: number, course: CourseDto, setup: LinkSetupDto) {
  const { rows } = await pgPool().query<{ la: number; lo: number; a: number | null; r1: number | null; r2: number | null; d: number | null }>(
    `SELECT lat AS la, lon AS lo, alt_m AS a, rssi1_dbm AS r1, rssi2_dbm AS r2, dist_m AS d
       FROM samples WHERE flight_id = $1 ORDER BY seq`,
    [flightId],
  )
  const n = rows.length
  const lat = new Float64Array(n)
  const lon = new Float64Array(n)
  const east = new Float64Array(n)
  const north = new Float64Array(n)
  const height = new Float64Array(n)
  const distanceM = new Float64Array(n)
  const rxDbm = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const r = rows[i]!
    lat[i] = r.la
    lon[i] = r.lo
    const o = localOffsetM(course.stationLat, course.stationLon, r.la, r.lo)
    east[i] = o.eastM
    north[i] = o.northM
    height[i] = r.a === null ? NaN : r.a - course.antennaHeightM
    distanceM[i] = r.d ?? Math.hypot(o.eastM, o.northM)
    const r1 = r.r1 ?? NaN
    const r2 = r.r2 ?? NaN
    rxDbm[i] = Number.isNaN(r2) ? r1 : Number.isNaN(r1) ? r2 : Math.max(r1, r2)
  }
  const series: ComparedSeries = {
    distanceM,
    rxDbm,
    floorDbm: setup.floorDbm,
    sensitivityDbm: setup.sensitivityDbm,
  }
  return { series, lat, lon, direction: typicalDirection(east, north, height) }
}

async function loadFlight(row: FlightRow): Promise<LoadedFlight> {
  const [setup, course] = await Promise.all([loadSetup(row.setup_id), loadCourse(row.course_id)])
  if (!setup || !course) throw conflict(`Flight ${row.id} has lost its setup or course`)
  const s = await loadSeries(row.id, course, setup)
  return { row, analysis: row.analysis!, setup, course, ...s }
}

function decimate<T>(n: number, max: number, pick: (i: number) => T | null): T[] {
  const step = Math.max(1, Math.ceil(n / max))
  const out: T[] = []
  for (let i = 0; i < n; i += step) {
    const v = pick(i)
    if (v !== null) out.push(v)
  }
  return out
}

function budgetTerms(s: LinkSetupDto) {
  return { txPowerDbm: s.txPowerDbm, txGainDbi: s.txAntenna.gainDbi, cableLossDb: s.cableLossDb, rxAntennas: s.rxAntennas }
}

function flightColumn(f: LoadedFlight, index: number, baselineId: number, fadeMarginDb: number): ComparedFlightDto {
  const a = f.analysis
  const { setup, series } = f
  const n = series.distanceM.length
  let range: number | null = null
  try {
    range = predictedRangeM(a.model, setup.sensitivityDbm, fadeMarginDb)
  } catch {
    range = null
  }
  const heard = (i: number) => {
    const v = series.rxDbm[i]!
    return Number.isFinite(v) && (setup.floorDbm === null || v > setup.floorDbm) && Number.isFinite(series.distanceM[i]!)
  }
  return {
    flightId: f.row.id,
    name: f.row.name,
    flownOn: f.row.flown_on,
    styleIndex: index,
    isBaseline: f.row.id === baselineId,
    setup: {
      id: setup.id,
      name: setup.name,
      version: setup.version,
      band: setup.band,
      freqMHz: setup.freqMHz,
      txPowerDbm: setup.txPowerDbm,
      txPowerMw: setup.txPowerMw,
      txAntenna: setup.txAntenna,
      rxAntennas: setup.rxAntennas,
      cableLossDb: setup.cableLossDb,
      sensitivityDbm: setup.sensitivityDbm,
      floorDbm: setup.floorDbm,
    },
    eirpDbm: setup.eirpDbm,
    fit: a.fit
      ? {
          exponent: a.fit.exponent,
          exponentLower: a.fit.exponentLower,
          exponentUpper: a.fit.exponentUpper,
          sigmaDb: a.fit.residualSigmaDb,
          rSquared: a.fit.rSquared,
          sampleCount: a.fit.sampleCount,
        }
      : null,
    model: a.model,
    maxDistanceWithLinkM: a.summary.maxDistanceWithLinkM,
    predictedRangeM: range,
    dropoutsByCause: a.summary.dropoutsByCause,
    dropoutCount: a.summary.dropoutCount,
    timeWithoutLinkMs: Math.max(0, a.summary.durationMs - a.summary.timeWithLinkMs),
    durationMs: a.summary.durationMs,
    scatter: decimate(n, SCATTER_POINTS, (i) =>
      heard(i) ? [Math.round(series.distanceM[i]!), Math.round(series.rxDbm[i]! * 10) / 10] : null,
    ),
    track: decimate(n, TRACK_POINTS, (i) =>
      Number.isFinite(f.lat[i]!) ? [Math.round(f.lat[i]! * 1e6) / 1e6, Math.round(f.lon[i]! * 1e6) / 1e6] : null,
    ),
    typicalAzimuthDeg: f.direction?.azimuthDeg ?? null,
    typicalElevationDeg: f.direction?.elevationDeg ?? null,
  }
}

function advantageRow(base: LoadedFlight, f: LoadedFlight): AdvantageDto {
  const adv = censoredMatchedAdvantage(base.series, f.series, { binWidthM: COMPARISON_BIN_WIDTH_M })
  const fallback: TypicalDirection = { azimuthDeg: 0, elevationDeg: 0 }
  const predictedDb = predictedAdvantageDb(
    budgetTerms(base.setup),
    budgetTerms(f.setup),
    base.direction ?? f.direction ?? fallback,
    f.direction ?? base.direction ?? fallback,
  )
  const exponent = f.analysis.fit?.exponent ?? f.analysis.model.exponent
  const m = adv.meanDifferenceDb
  const half = adv.upperDb !== null && m !== null ? adv.upperDb - m : null
  const eq = m === null ? null : advantageEquivalents(m, exponent > 0 ? exponent : null)
  return {
    flightId: f.row.id,
    measuredDb: m,
    lowerDb: adv.lowerDb,
    upperDb: adv.upperDb,
    halfWidthDb: half,
    binCount: adv.binCount,
    censoredBinCount: adv.censoredBinCount,
    powerFactor: eq?.powerFactor ?? null,
    rangeFactor: eq?.rangeFactor ?? null,
    exponentUsed: exponent > 0 ? exponent : null,
    phrase: eq?.phrase ?? null,
    predictedDb,
    differenceDb: m === null ? null : m - predictedDb,
    flag: m === null ? null : predictionFlag(m, half, predictedDb),
    bins: adv.bins.map((b) => [(b.startM + b.endM) / 2, b.differenceDb]),
  }
}

/**
 * Compares 2–6 analysed flights of a team against a baseline: the side-by-side table, the measured
 * matched-distance advantage of each flight with its interval, power and range equivalents, the advantage the
 * datasheets predict and a flag when the two disagree by more than the interval.
 * @param teamId the caller's team (other teams' flights answer 404)
 * @param input flight ids (2–6, in display order), baseline id among them, fade margin in dB
 * @returns the comparison result
 * @throws HttpError 404 for unknown flights, 409 for flights not analysed yet
 */
export async function computeComparison(teamId: number, input: ComparisonPreviewInput): Promise<ComparisonResultDto> {
  const rows = await loadFlightRows(teamId, input.flightIds)
  const flights: LoadedFlight[] = []
  for (const r of rows) flights.push(await loadFlight(r))
  const base = flights.find((f) => f.row.id === input.baselineId)!
  const c = base.course
  return {
    flightIds: input.flightIds,
    baselineId: input.baselineId,
    fadeMarginDb: input.fadeMarginDb,
    binWidthM: COMPARISON_BIN_WIDTH_M,
    course: { id: c.id, name: c.name, stationLat: c.stationLat, stationLon: c.stationLon, obstacles: c.obstacles },
    mixedCourses: flights.some((f) => f.row.course_id !== base.row.course_id),
    flights: flights.map((f, i) => flightColumn(f, i, input.baselineId, input.fadeMarginDb)),
    advantages: flights.filter((f) => f !== base).map((f) => advantageRow(base, f)),
  }
}
