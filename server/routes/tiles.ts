import express from 'express'
import { getTilePng } from '../services/tiles.js'
import { notFound } from '../errors.js'

/** GET /tiles/:z/:x/:y.png, outside /api: plain graticule tiles, no sign-in needed. */
export const tilesRouter = express.Router()

tilesRouter.get('/:z/:x/:file', (req, res) => {
  const m = /^(\d{1,8})\.png$/.exec(req.params.file)
  const z = /^\d{1,2}$/.test(req.params.z) ? Number(req.params.z) : NaN
  const x = /^\d{1,8}$/.test(req.params.x) ? Number(req.params.x) : NaN
  if (!m || Number.isNaN(z) || Number.isNaN(x)) throw notFound(`Tile ${req.path}`)
  const png = getTilePng(z, x, Number(m[1]))
  res.setHeader('Content-Type', 'image/png')
  res.setHeader('Cache-Control', 'public, max-age=86400')
  res.end(png)
})
