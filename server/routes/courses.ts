import express from 'express'
import multer from 'multer'
import { courseInputSchema, courseListQuerySchema, terrainProfileQuerySchema } from '../../shared/schemas/course.js'
import { parseId, parseWith } from '../middleware/validate.js'
import { WRITE_ROLES, requireAuth, requireRole } from '../middleware/auth.js'
import * as courses from '../services/courses.js'
import * as terrain from '../services/terrain.js'
import { badRequest } from '../errors.js'

/** Terrain files: one file, at most 64 MB (a 1-arc-second SRTM tile is 25.9 MB). */
const TERRAIN_MAX_BYTES = 64 * 1024 * 1024
const terrainUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: TERRAIN_MAX_BYTES, files: 1, fields: 4, parts: 6, fieldSize: 1024 },
}).single('file')

export const coursesRouter = express.Router()
const write = requireRole(...WRITE_ROLES)

coursesRouter.use(requireAuth)

coursesRouter.get('/', async (req, res) => {
  res.json(await courses.listCourses(req.auth!.teamId, parseWith(courseListQuerySchema, req.query)))
})

coursesRouter.get('/:courseId', async (req, res) => {
  res.json(await courses.getCourse(req.auth!.teamId, parseId(req.params.courseId, 'courseId')))
})

coursesRouter.get('/:courseId/terrain/profile', async (req, res) => {
  const id = parseId(req.params.courseId, 'courseId')
  res.json(await terrain.courseTerrainProfile(req.auth!.teamId, id, parseWith(terrainProfileQuerySchema, req.query)))
})

coursesRouter.post('/', write, async (req, res) => {
  res.status(201).json(await courses.createCourse(req.auth!, parseWith(courseInputSchema, req.body)))
})

coursesRouter.put('/:courseId', write, async (req, res) => {
  const id = parseId(req.params.courseId, 'courseId')
  res.json(await courses.updateCourse(req.auth!, id, parseWith(courseInputSchema, req.body)))
})

coursesRouter.delete('/:courseId', write, async (req, res) => {
  await courses.deleteCourse(req.auth!, parseId(req.params.courseId, 'courseId'))
  res.status(204).end()
})

// The course is resolved (404 for another team) before multer reads any of the body.
coursesRouter.post(
  '/:courseId/terrain',
  write,
  async (req, _res, next) => {
    await courses.findCourseRow(req.auth!.teamId, parseId(req.params.courseId, 'courseId'))
    next()
  },
  terrainUpload,
  async (req, res) => {
    if (!req.file) throw badRequest('Attach the elevation file as the "file" field', [{ path: 'file', message: 'missing' }])
    res.status(201).json(await terrain.uploadTerrain(req.auth!, parseId(req.params.courseId, 'courseId'), req.file))
  },
)

coursesRouter.delete('/:courseId/terrain', write, async (req, res) => {
  res.json(await terrain.deleteTerrain(req.auth!, parseId(req.params.courseId, 'courseId')))
})
