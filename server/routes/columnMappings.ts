import express from 'express'
import { z } from 'zod'
import { saveColumnMappingSchema } from '../../shared/import/mapping.js'
import { WRITE_ROLES, requireAuth, requireRole } from '../middleware/auth.js'
import { parseWith } from '../middleware/validate.js'
import { listColumnMappings, saveColumnMapping } from '../services/columnMappings.js'

/** /api/column-mappings: the team's saved mappings; `?signature=` finds the one for a header. */
export const columnMappingsRouter = express.Router()

columnMappingsRouter.get('/', requireAuth, async (req, res) => {
  const q = parseWith(z.object({ signature: z.string().max(200).optional() }), req.query)
  res.json(await listColumnMappings(req.auth!.teamId, q.signature))
})

columnMappingsRouter.post('/', requireRole(...WRITE_ROLES), async (req, res) => {
  const { mapping, created } = await saveColumnMapping(req.auth!, parseWith(saveColumnMappingSchema, req.body))
  res.status(created ? 201 : 200).json(mapping)
})
