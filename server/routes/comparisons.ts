import express from 'express'
import { comparisonInputSchema, comparisonPreviewSchema } from '../../shared/schemas/comparison.js'
import { parseId, parseWith } from '../middleware/validate.js'
import { WRITE_ROLES, requireAuth, requireRole } from '../middleware/auth.js'
import * as comparisons from '../services/comparisons.js'

export const comparisonsRouter = express.Router()
const write = requireRole(...WRITE_ROLES)

comparisonsRouter.use(requireAuth)

// A preview changes nothing, so viewers may run it too (POST only because the choice is a body)
comparisonsRouter.post('/preview', async (req, res) => {
  res.json(await comparisons.previewComparison(req.auth!.teamId, parseWith(comparisonPreviewSchema, req.body)))
})

comparisonsRouter.get('/', async (req, res) => {
  res.json(await comparisons.listComparisons(req.auth!.teamId))
})

comparisonsRouter.get('/:comparisonId', async (req, res) => {
  res.json(await comparisons.getComparison(req.auth!.teamId, parseId(req.params.comparisonId, 'comparisonId')))
})

comparisonsRouter.post('/', write, async (req, res) => {
  res.status(201).json(await comparisons.createComparison(req.auth!, parseWith(comparisonInputSchema, req.body)))
})

comparisonsRouter.put('/:comparisonId', write, async (req, res) => {
  const id = parseId(req.params.comparisonId, 'comparisonId')
  res.json(await comparisons.updateComparison(req.auth!, id, parseWith(comparisonInputSchema, req.body)))
})

comparisonsRouter.delete('/:comparisonId', write, async (req, res) => {
  await comparisons.deleteComparison(req.auth!, parseId(req.params.comparisonId, 'comparisonId'))
  res.status(204).end()
})
