import express from 'express'
import { getMapConfig } from '../services/mapConfig.js'

/** GET /api/config/map: the tile source; public, it holds no secret. */
export const mapConfigRouter = express.Router()

mapConfigRouter.get('/map', (_req, res) => {
  res.json(getMapConfig())
})
