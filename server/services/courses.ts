import { ForeignKeyConstraintError, type WhereOptions } from 'sequelize'
import type { AuthContext } from '../types/express.js'
import type { ListResult } from '../../shared/types/api.js'
import type { CourseDto, CourseSortKey, CourseTerrainDto } from '../../shared/types/course.js'
import type { CourseInput, CourseListQuery } from '../../shared/schemas/course.js'
import { conflict, forbidden, notFound } from '../errors.js'
import { canEditOwned } from '../middleware/auth.js'
import { sequelize } from '../db.js'
import { Course } from '../models/Course.js'
import { CourseTerrain } from '../models/CourseTerrain.js'
import { idsUsedByFlights } from './flightUsage.js'
import { reanalyseCourseFlights } from './flights/flights.js'
import { orderThenId, searchAnyColumn } from './listQuery.js'

const SORT_COLUMNS: Record<CourseSortKey, string> = { name: 'name', createdAt: 'createdAt', updatedAt: 'updatedAt' }
const TERRAIN_SUMMARY = { exclude: ['elevations'] }

function toTerrainDto(t: CourseTerrain): CourseTerrainDto {
  return {
    id: t.id,
    format: t.format,
    fileName: t.fileName,
    width: t.width,
    height: t.height,
    bbox: [t.west, t.south, t.east, t.north],
    minElevM: t.minElevM,
    maxElevM: t.maxElevM,
    createdAt: t.createdAt.toISOString(),
  }
}

async function terrainsById(ids: (number | null)[]): Promise<Map<number, CourseTerrain>> {
  const wanted = ids.filter((x): x is number => x !== null)
  if (wanted.length === 0) return new Map()
  const rows = await CourseTerrain.findAll({ where: { id: wanted }, attributes: TERRAIN_SUMMARY })
  return new Map(rows.map((t) => [t.id, t]))
}

// One course's DTO with its terrain summary.
async function courseDto(row: Course): Promise<CourseDto> {
  const terrain = row.terrainId == null ? null : await CourseTerrain.findByPk(row.terrainId, { attributes: TERRAIN_SUMMARY })
  return toCourseDto(row, terrain)
}

/** Maps a course row (and its terrain summary, if any) to its DTO. */
function toCourseDto(c: Course, terrain: CourseTerrain | null): CourseDto {
  return {
    id: c.id,
    teamId: c.teamId,
    createdBy: c.createdBy,
    name: c.name,
    notes: c.notes,
    stationLat: c.stationLat,
    stationLon: c.stationLon,
    antennaHeightM: c.antennaHeightM,
    groundElevM: c.groundElevM,
    route: c.route,
    obstacles: c.obstacles ?? [],
    terrainId: c.terrainId ?? null,
    hasTerrain: terrain !== null,
    terrain: terrain ? toTerrainDto(terrain) : null,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  }
}

/**
 * The team's courses, searched by name or notes, sorted by a whitelisted column, one page.
 * @param teamId the caller's team
 * @param q search text, sort key, order, limit (1–200) and offset
 * @returns one page and the total count
 */
export async function listCourses(teamId: number, q: CourseListQuery): Promise<ListResult<CourseDto>> {
  const where: WhereOptions = { teamId }
  if (q.q) Object.assign(where, searchAnyColumn(['name', 'notes'], q.q))
  const { rows, count } = await Course.findAndCountAll({
    where,
    order: orderThenId(SORT_COLUMNS[q.sort], q.order),
    limit: q.limit,
    offset: q.offset,
  })
  const terrains = await terrainsById(rows.map((r) => r.terrainId ?? null))
  return { items: rows.map((r) => toCourseDto(r, terrains.get(r.terrainId ?? -1) ?? null)), total: count }
}

/**
 * The course row of a team; another team's course answers 404 like a missing one.
 * @throws HttpError 404 NOT_FOUND
 */
export async function findCourseRow(teamId: number, id: number): Promise<Course> {
  const row = await Course.findOne({ where: { id, teamId } })
  if (!row) throw notFound(`Course ${id}`)
  return row
}

/**
 * One course of the caller's team.
 * @throws HttpError 404 NOT_FOUND for an unknown id or another team's course
 */
export async function getCourse(teamId: number, id: number): Promise<CourseDto> {
  const row = await findCourseRow(teamId, id)
  return courseDto(row)
}

/**
 * A course by id without team scoping, for server-side callers (analysis jobs) that already hold a
 * flight of the same team.
 * @returns the course, or null when it does not exist
 */
export async function loadCourse(id: number): Promise<CourseDto | null> {
  const row = await Course.findByPk(id)
  if (!row) return null
  return courseDto(row)
}

/**
 * Creates a course in the caller's team.
 * @param auth the caller (a writing role; checked by the route)
 * @param input validated course fields
 * @returns the created course
 */
export async function createCourse(auth: AuthContext, input: CourseInput): Promise<CourseDto> {
  const row = await Course.create({ ...input, teamId: auth.teamId, createdBy: auth.userId })
  return toCourseDto(row, null)
}

/**
 * Replaces a course's fields (the terrain stays).
 * @throws HttpError 404 for another team's course
 */
export async function updateCourse(auth: AuthContext, id: number, input: CourseInput): Promise<CourseDto> {
  const row = await findCourseRow(auth.teamId, id)
  const [stationBefore, restBefore] = analysisInputs(row)
  await row.update({ ...input })
  const [stationAfter, restAfter] = analysisInputs(row)
  const moved = stationBefore !== stationAfter
  if (moved || restBefore !== restAfter) await reanalyseCourseFlights(id, moved)
  return courseDto(row)
}

/** What of a course the flight analysis reads, as comparable strings: the station's position, then the rest. */
function analysisInputs(row: Course): [string, string] {
  return [
    JSON.stringify([row.stationLat, row.stationLon]),
    JSON.stringify([row.antennaHeightM, row.groundElevM, row.obstacles]),
  ]
}

/**
 * Deletes a course and its terrain. Only its creator or an admin may delete.
 * @throws HttpError 404 for another team's course, 403 for someone else's course, 409 when flights use it
 */
export async function deleteCourse(auth: AuthContext, id: number): Promise<void> {
  const row = await findCourseRow(auth.teamId, id)
  if (!canEditOwned(auth, row.createdBy)) throw forbidden('Only the course’s creator or an admin can delete it')
  const inUse = () => conflict('Flights use this course; delete them first')
  try {
    await sequelize().transaction(async (transaction) => {
      if ((await idsUsedByFlights('course_id', [id], transaction)).size > 0) throw inUse()
      await row.update({ terrainId: null }, { transaction })
      await CourseTerrain.destroy({ where: { courseId: id }, transaction })
      await row.destroy({ transaction })
    })
  } catch (e) {
    // a flight inserted meanwhile trips the RESTRICT foreign key
    if (e instanceof ForeignKeyConstraintError) throw inUse()
    throw e
  }
}
