import express from 'express'
import { z } from 'zod'
import { columnMappingSchema } from '../../shared/import/mapping.js'
import { WRITE_ROLES, requireAuth, requireRole } from '../middleware/auth.js'
import { flightUpload } from '../middleware/upload.js'
import { parseId, parseWith } from '../middleware/validate.js'
import { createFlightFromUpload, type UploadedFile } from '../services/flights/createFlight.js'
import {
  deleteFlight,
  flightListQuerySchema,
  flightPatchSchema,
  getFlight,
  getFlightStatus,
  listFlights,
  reanalyseFlight,
  updateFlight,
} from '../services/flights/flights.js'
import { reimportFlight } from '../services/flights/reimport.js'
import { flightSamples, samplesQuerySchema } from '../services/flights/samples.js'

/** /api/flights: upload (multipart, 202), list, one flight, status, samples, edit, delete, re-import, re-analyse. */
export const flightsRouter = express.Router()
const writer = requireRole(...WRITE_ROLES)
const id = (req: express.Request) => parseId(req.params.id)

// Role check before multer so a viewer or a signed-out caller is refused before the body is read.
flightsRouter.post('/', writer, flightUpload(), async (req, res) => {
  const files = (req.files ?? {}) as Record<string, UploadedFile[] | undefined>
  res.status(202).json(await createFlightFromUpload(req.auth!, files.file?.[0], files.signalFile?.[0], req.body))
})

flightsRouter.get('/', requireAuth, async (req, res) => {
  res.json(await listFlights(req.auth!.teamId, parseWith(flightListQuerySchema, req.query)))
})

flightsRouter.get('/:id', requireAuth, async (req, res) => {
  res.json(await getFlight(req.auth!.teamId, id(req)))
})

flightsRouter.get('/:id/status', requireAuth, async (req, res) => {
  res.json(await getFlightStatus(req.auth!.teamId, id(req)))
})

flightsRouter.get('/:id/samples', requireAuth, async (req, res) => {
  res.json(await flightSamples(req.auth!.teamId, id(req), parseWith(samplesQuerySchema, req.query)))
})

flightsRouter.patch('/:id', writer, async (req, res) => {
  res.json(await updateFlight(req.auth!, id(req), parseWith(flightPatchSchema, req.body)))
})

flightsRouter.delete('/:id', writer, async (req, res) => {
  await deleteFlight(req.auth!, id(req))
  res.status(204).end()
})

flightsRouter.post('/:id/reimport', writer, async (req, res) => {
  const body = parseWith(z.object({ mapping: columnMappingSchema }), req.body)
  res.status(202).json(await reimportFlight(req.auth!, id(req), body.mapping))
})

flightsRouter.post('/:id/reanalyse', writer, async (req, res) => {
  res.status(202).json(await reanalyseFlight(req.auth!, id(req)))
})
