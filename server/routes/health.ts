import express from 'express'
import { getHealth } from '../services/health.js'

export const healthRouter = express.Router()

healthRouter.get('/', async (_req, res) => {
  const h = await getHealth()
  res.status(h.database === 'up' ? 200 : 503).json(h)
})
