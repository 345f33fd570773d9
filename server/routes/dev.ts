import express from 'express'
import { notFound } from '../errors.js'
import { requireRole } from '../middleware/auth.js'
import { usingLocalSink } from '../services/mail.js'
import { listOutbox } from '../services/outbox.js'

/** /api/dev: tools that exist only while mail goes to the local sink. */
export const devRouter = express.Router()

devRouter.use((_req, _res, next) => next(usingLocalSink() ? undefined : notFound('Route')))

devRouter.get('/outbox', requireRole('admin'), async (req, res) => {
  res.json(await listOutbox(req.auth!.teamId))
})
