import fsp from 'node:fs/promises'
import { Op, type WhereOptions } from 'sequelize'
import { z } from 'zod'
import type { AuthContext } from '../../types/express.js'
import type { ListResult } from '../../../shared/types/api.js'
import type { FlightDetailDto, FlightDto, FlightStatusDto } from '../../../shared/types/flight.js'
import { canEditOwned } from '../../middleware/auth.js'
import { forbidden, notFound } from '../../errors.js'
import { pgPool } from '../../db.js'
import { WGS84_A_M, WGS84_E2 } from '../../../shared/geo/wgs84.js'
import { Flight } from '../../models/Flight.js'
import { FlightImport } from '../../models/FlightImport.js'
import { teamCourseAndSetup } from './createFlight.js'
import { orderThenId, searchAnyColumn } from '../listQuery.js'
import { enqueueAnalysis } from './queue.js'
import { insideDataDir, removeFiles } from './storage.js'

const SORT_KEYS = { flownOn: 'flownOn', name: 'name', createdAt: 'createdAt', rowCount: 'rowCount' } as const
type SortKey = keyof typeof SORT_KEYS

/** Query of GET /api/flights (every value a single string; arrays are refused). */
export const flightListQuerySchema = z.object({
  courseId: z.coerce.number().int().positive().optional(),
  setupId: z.coerce.number().int().positive().optional(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  q: z.string().trim().max(200).optional(),
  sort: z
    .string()
    .regex(/^-?(flownOn|name|createdAt|rowCount)$/, 'sort must be one of flownOn, name, createdAt, rowCount, optionally with a leading -')
    .optional()
    .default('-flownOn'),
  page: z.coerce.number().int().min(1).max(100_000).optional().default(1),
  pageSize: z.coerce.number().int().min(1).max(100).optional().default(20),
})
export type FlightListQuery = z.infer<typeof flightListQuerySchema>

/** Body of PATCH /api/flights/:id; unknown keys are refused. */
export const flightPatchSchema = z
  .object({
    name: z.string().trim().min(1).max(200),
    flownOn: z.iso.date(),
    notes: z.string().max(5000),
    courseId: z.number().int().positive(),
    setupId: z.number().int().positive(),
  })
  .partial()
  .strict()
export type FlightPatch = z.infer<typeof flightPatchSchema>

function toFlightDto(f: Flight): FlightDto {
  return {
    id: f.id,
    courseId: f.courseId,
    setupId: f.setupId,
    createdBy: f.createdBy,
    name: f.name,
    flownOn: f.flownOn,
    notes: f.notes,
    status: f.status,
    failureReason: f.failureReason,
    rowCount: f.rowCount,
    badRowCount: f.badRowCount,
    sourceFormat: f.sourceFormat,
    analysisVersion: f.analysisVersion,
    createdAt: f.createdAt.toISOString(),
    updatedAt: f.updatedAt.toISOString(),
  }
}

const LIST_ATTRIBUTES = { exclude: ['analysis', 'rowErrors', 'mapping', 'rawFile', 'progress'] }

/**
 * Lists the team's stored flights with filters, a whitelisted sort and paging.
 * @param teamId the caller's team
 * @param q validated query
 */
export async function listFlights(teamId: number, q: FlightListQuery): Promise<ListResult<FlightDto>> {
  const where: WhereOptions<Flight> & Record<string | symbol, unknown> = {
    teamId,
    status: { [Op.notIn]: ['queued', 'importing'] },
  }
  if (q.courseId) where.courseId = q.courseId
  if (q.setupId) where.setupId = q.setupId
  if (q.from || q.to) where.flownOn = { ...(q.from ? { [Op.gte]: q.from } : {}), ...(q.to ? { [Op.lte]: q.to } : {}) }
  if (q.q) Object.assign(where, searchAnyColumn(['name', 'notes'], q.q))
  const desc = q.sort.startsWith('-')
  const key = SORT_KEYS[q.sort.replace(/^-/, '') as SortKey]
  const { rows, count } = await Flight.findAndCountAll({
    where,
    attributes: LIST_ATTRIBUTES,
    order: orderThenId(key, desc ? 'desc' : 'asc'),
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  })
  return { items: rows.map(toFlightDto), total: count }
}

/** The team's flight row or 404 (another team's id answers the same). */
async function findTeamFlight(teamId: number, id: number): Promise<Flight> {
  const f = await Flight.findOne({ where: { id, teamId } })
  if (!f) throw notFound(`Flight ${id}`)
  return f
}

/** One flight with its analysis and bad-row report. */
export async function getFlight(teamId: number, id: number): Promise<FlightDetailDto> {
  const f = await findTeamFlight(teamId, id)
  return { ...toFlightDto(f), mapping: f.mapping, rowErrors: f.rowErrors, analysis: f.analysis }
}

/**
 * Status of an upload or re-import and the flight it feeds; a refused upload is only visible here.
 * @param teamId the caller's team
 * @param id the flight id returned by the upload
 */
export async function getFlightStatus(teamId: number, id: number): Promise<FlightStatusDto> {
  const [imp, flight] = await Promise.all([
    FlightImport.findOne({ where: { flightId: id, teamId }, order: [['id', 'DESC']] }),
    Flight.findOne({ where: { id, teamId }, attributes: ['id', 'status', 'failureReason', 'rowCount'] }),
  ])
  if (!imp && !flight) throw notFound(`Flight ${id}`)
  // Until its job has finished (samples, analysis and the kept original), an import speaks for the flight.
  const pending = imp && (imp.status === 'queued' || imp.status === 'importing' || imp.status === 'analysing')
  const status = pending || !flight ? imp!.status : flight.status
  const failure =
    imp?.status === 'failed' && imp.failure
      ? imp.failure
      : flight?.status === 'failed'
        ? { status: 500, code: 'INTERNAL' as const, message: flight.failureReason ?? 'Analysis failed' }
        : null
  const progress = imp?.progress ?? { bytesDone: 0, bytesTotal: 0, rowsDone: flight?.rowCount ?? 0 }
  return { id, status, progress, failure, stored: Boolean(flight) }
}

/** The team's flight, if the caller may change it (403 otherwise). */
export async function editableFlight(auth: AuthContext, id: number): Promise<Flight> {
  const f = await findTeamFlight(auth.teamId, id)
  if (!canEditOwned(auth, f.createdBy)) throw forbidden('Only the pilot who uploaded a flight, or an admin, may change it')
  return f
}

/**
 * Edits metadata, course or setup; a new course or setup queues a re-analysis (the course also moves distances).
 * @param auth the caller
 * @param id flight id
 * @param patch validated changes
 */
export async function updateFlight(auth: AuthContext, id: number, patch: FlightPatch): Promise<FlightDetailDto> {
  const f = await editableFlight(auth, id)
  const courseChanged = patch.courseId !== undefined && patch.courseId !== f.courseId
  const setupChanged = patch.setupId !== undefined && patch.setupId !== f.setupId
  if (courseChanged || setupChanged) await teamCourseAndSetup(auth.teamId, patch.courseId ?? f.courseId, patch.setupId ?? f.setupId)
  await f.update({ ...patch, ...(courseChanged || setupChanged ? { status: 'analysing' as const } : {}) })
  if (courseChanged || setupChanged) await enqueueAnalysis(f.id, courseChanged)
  return getFlight(auth.teamId, id)
}

/** Queues a re-analysis on demand. */
export async function reanalyseFlight(auth: AuthContext, id: number): Promise<FlightStatusDto> {
  const f = await editableFlight(auth, id)
  await f.update({ status: 'analysing' })
  await enqueueAnalysis(f.id, false)
  return getFlightStatus(auth.teamId, id)
}

/**
 * Queues a re-analysis of every flight flown on a course whose geometry changed (station, antenna height, ground
 * elevation, obstacles or terrain), so stored analyses never describe a course that no longer exists.
 * @param courseId the course (already checked to be in the caller's team)
 * @param recomputeDistances true when the station moved, so sample distances change too
 * @returns how many flights were queued
 */
export async function reanalyseCourseFlights(courseId: number, recomputeDistances: boolean): Promise<number> {
  const flights = await Flight.findAll({ where: { courseId }, attributes: ['id'] })
  if (flights.length === 0) return 0
  await Flight.update({ status: 'analysing' }, { where: { courseId } })
  for (const f of flights) await enqueueAnalysis(f.id, recomputeDistances)
  return flights.length
}

/**
 * Deletes a flight, its samples (cascade), its import records and its kept original.
 * @param auth the caller
 * @param id flight id
 */
export async function deleteFlight(auth: AuthContext, id: number): Promise<void> {
  const f = await editableFlight(auth, id)
  const raw = f.rawFile
  await Flight.sequelize!.transaction(async (transaction) => {
    await FlightImport.destroy({ where: { flightId: id }, transaction })
    await f.destroy({ transaction })
  })
  if (raw && insideDataDir(raw)) await removeFiles(raw)
}

/** Whether a kept original is on disk (for re-import). */
export async function rawFileExists(file: string | null): Promise<boolean> {
  if (!file || !insideDataDir(file)) return false
  return fsp.access(file).then(
    () => true,
    () => false,
  )
}

/**
 * Recomputes every sample's ground distance after the course (station) changed, with the same mid-latitude
 * WGS-84 plane formula as shared/geo/localOffset.ts, in one statement.
 */
export async function recomputeDistances(flightId: number): Promise<void> {
  const m = 'radians((c.slat + s.lat) / 2)'
  const w = `(1 - ${WGS84_E2} * sin(${m}) ^ 2)`
  const n = `(${WGS84_A_M} / sqrt(${w}))`
  const east = `radians((s.lon - c.slon) - 360 * round((s.lon - c.slon) / 360)) * ${n} * cos(${m})`
  const north = `radians(s.lat - c.slat) * ${n} * (1 - ${WGS84_E2}) / ${w}`
  await pgPool().query(
    `UPDATE samples s SET dist_m = sqrt((${east}) ^ 2 + (${north}) ^ 2)
       FROM (SELECT f.id, co.station_lat AS slat, co.station_lon AS slon
               FROM flights f JOIN courses co ON co.id = f.course_id WHERE f.id = $1) c
      WHERE s.flight_id = c.id`,
    [flightId],
  )
}
