import express from 'express'
import { setupInputSchema, setupListQuerySchema } from '../../shared/schemas/setup.js'
import { parseId, parseWith } from '../middleware/validate.js'
import { WRITE_ROLES, requireAuth, requireRole } from '../middleware/auth.js'
import * as setups from '../services/setups.js'

export const setupsRouter = express.Router()
const write = requireRole(...WRITE_ROLES)

setupsRouter.use(requireAuth)

setupsRouter.get('/', async (req, res) => {
  res.json(await setups.listSetups(req.auth!.teamId, parseWith(setupListQuerySchema, req.query)))
})

setupsRouter.get('/:setupId', async (req, res) => {
  res.json(await setups.getSetup(req.auth!.teamId, parseId(req.params.setupId, 'setupId')))
})

setupsRouter.get('/:setupId/versions', async (req, res) => {
  const items = await setups.listSetupVersions(req.auth!.teamId, parseId(req.params.setupId, 'setupId'))
  res.json({ items, total: items.length })
})

setupsRouter.post('/', write, async (req, res) => {
  res.status(201).json(await setups.createSetup(req.auth!, parseWith(setupInputSchema, req.body)))
})

setupsRouter.put('/:setupId', write, async (req, res) => {
  const id = parseId(req.params.setupId, 'setupId')
  res.json(await setups.updateSetup(req.auth!, id, parseWith(setupInputSchema, req.body)))
})

setupsRouter.delete('/:setupId', write, async (req, res) => {
  await setups.deleteSetup(req.auth!, parseId(req.params.setupId, 'setupId'))
  res.status(204).end()
})
