import type { AuthContext } from '../types/express.js'
import type { CourseDto, TerrainProfileDto } from '../../shared/types/course.js'
import type { TerrainProfileQuery } from '../../shared/schemas/course.js'
import { HttpError } from '../errors.js'
import { type ElevationGrid, type GroundProfile, sampleGridBilinear, sampleProfile } from '../../shared/terrain/grid.js'
import { groundDistanceM } from '../../shared/geo/localOffset.js'
import { sequelize } from '../db.js'
import { Course } from '../models/Course.js'
import { CourseTerrain } from '../models/CourseTerrain.js'
import { parseTerrainFile } from './terrainFormats.js'
import { findCourseRow, getCourse } from './courses.js'
import { reanalyseCourseFlights } from './flights/flights.js'

/** Elevation lookup: (lat, lon) in degrees → metres above mean sea level, NaN outside the data. */
export type TerrainSampler = (latDeg: number, lonDeg: number) => number

const CACHE_MAX = 4
const gridCache = new Map<string, ElevationGrid>()

function elevationRange(e: Float32Array): [number, number] {
  let lo = Infinity
  let hi = -Infinity
  for (const v of e) {
    if (Number.isNaN(v)) continue
    if (v < lo) lo = v
    if (v > hi) hi = v
  }
  return [lo, hi]
}

/**
 * Stores an uploaded elevation file as the course's terrain, replacing any earlier one, in one transaction.
 * @param auth the caller (team scope)
 * @param courseId the course, in the caller's team
 * @param file the upload (whole file in memory) and its client name
 * @returns the updated course
 * @throws HttpError 404 for another team's course, 415/422/400 for an unusable file
 */
export async function uploadTerrain(
  auth: AuthContext,
  courseId: number,
  file: { buffer: Buffer; originalname: string },
): Promise<CourseDto> {
  await findCourseRow(auth.teamId, courseId)
  const { format, grid } = await parseTerrainFile(file.buffer, file.originalname)
  const [minElevM, maxElevM] = elevationRange(grid.elevationsM)
  if (!Number.isFinite(minElevM)) throw new HttpError(422, 'UNPROCESSABLE', 'The file holds no elevation values')
  const fileName = file.originalname.replace(/[^\w.\- ]+/g, '_').slice(0, 120) || 'terrain'
  await sequelize().transaction(async (transaction) => {
    const course = await Course.findOne({ where: { id: courseId, teamId: auth.teamId }, transaction, lock: true })
    if (!course) return
    const old = course.terrainId
    const t = await CourseTerrain.create(
      {
        courseId,
        format,
        fileName,
        width: grid.width,
        height: grid.height,
        west: grid.west,
        south: grid.south,
        east: grid.east,
        north: grid.north,
        minElevM,
        maxElevM,
        elevations: Buffer.from(grid.elevationsM.buffer, grid.elevationsM.byteOffset, grid.elevationsM.byteLength),
      },
      { transaction },
    )
    await course.update({ terrainId: t.id }, { transaction })
    if (old) await CourseTerrain.destroy({ where: { id: old }, transaction })
  })
  await reanalyseCourseFlights(courseId, false)
  return getCourse(auth.teamId, courseId)
}

/**
 * Removes the course's terrain; the Fresnel check then uses flat ground at the course's elevation.
 * @returns the updated course
 * @throws HttpError 404 for another team's course
 */
export async function deleteTerrain(auth: AuthContext, courseId: number): Promise<CourseDto> {
  await sequelize().transaction(async (transaction) => {
    const course = await Course.findOne({ where: { id: courseId, teamId: auth.teamId }, transaction, lock: true })
    if (!course) return
    await course.update({ terrainId: null }, { transaction })
    await CourseTerrain.destroy({ where: { courseId }, transaction })
  })
  await reanalyseCourseFlights(courseId, false)
  return getCourse(auth.teamId, courseId)
}

// Keyed by id and creation time: ids can repeat after a database restore or reset.
async function loadGrid(terrainId: number): Promise<ElevationGrid | null> {
  const meta = await CourseTerrain.findByPk(terrainId, { attributes: { exclude: ['elevations'] } })
  if (!meta) return null
  const key = `${terrainId}:${meta.createdAt.getTime()}`
  const hit = gridCache.get(key)
  if (hit) {
    gridCache.delete(key)
    gridCache.set(key, hit)
    return hit
  }
  const t = await CourseTerrain.findByPk(terrainId, { attributes: ['elevations'] })
  if (!t) return null
  // copy into an aligned buffer: pg's Buffer may start at an odd offset
  const bytes = new Uint8Array(t.elevations)
  const grid: ElevationGrid = {
    width: meta.width,
    height: meta.height,
    west: meta.west,
    south: meta.south,
    east: meta.east,
    north: meta.north,
    elevationsM: new Float32Array(bytes.buffer, 0, meta.width * meta.height),
  }
  gridCache.set(key, grid)
  if (gridCache.size > CACHE_MAX) gridCache.delete(gridCache.keys().next().value!)
  return grid
}

/**
 * An elevation lookup over the course's uploaded terrain (bilinear between samples).
 * Not team-scoped: callers (the analysis) have already resolved the course.
 * @param courseId the course id
 * @returns (lat, lon) → metres AMSL, NaN outside the data; null when the course has no terrain
 */
export async function terrainSampler(courseId: number): Promise<TerrainSampler | null> {
  const course = await Course.findByPk(courseId, { attributes: ['id', 'terrainId'] })
  if (!course?.terrainId) return null
  const grid = await loadGrid(course.terrainId)
  if (!grid) return null
  return (latDeg, lonDeg) => sampleGridBilinear(grid, latDeg, lonDeg)
}

/**
 * Terrain profile between two points, for the Fresnel view.
 * @param courseId the course id (not team-scoped, as terrainSampler)
 * @param from start position in degrees (usually the ground station)
 * @param to end position in degrees
 * @param n number of samples, integer >= 2
 * @returns distances (m from `from`) and elevations (m AMSL, NaN outside the data); null without terrain
 */
export async function terrainProfile(
  courseId: number,
  from: { latDeg: number; lonDeg: number },
  to: { latDeg: number; lonDeg: number },
  n: number,
): Promise<GroundProfile | null> {
  const sampler = await terrainSampler(courseId)
  if (!sampler) return null
  const d = groundDistanceM(from.latDeg, from.lonDeg, to.latDeg, to.lonDeg)
  return sampleProfile(sampler, from, to, n, d)
}

/**
 * The course's terrain between two points, for the flight screen's Fresnel profile.
 * @param teamId the caller's team (another team's course answers 404)
 * @param courseId the course
 * @param q the two ends in degrees and the number of samples
 * @returns distances and elevations (null outside the data)
 * @throws HttpError 404 when the course is not the team's or has no terrain
 */
export async function courseTerrainProfile(teamId: number, courseId: number, q: TerrainProfileQuery): Promise<TerrainProfileDto> {
  await findCourseRow(teamId, courseId)
  const p = await terrainProfile(courseId, { latDeg: q.fromLat, lonDeg: q.fromLon }, { latDeg: q.toLat, lonDeg: q.toLon }, q.n)
  if (!p) throw new HttpError(404, 'NOT_FOUND', 'This course has no terrain')
  return {
    distanceM: Array.from(p.distanceM),
    elevationM: Array.from(p.elevationM, (e) => (Number.isNaN(e) ? null : e)),
  }
}
