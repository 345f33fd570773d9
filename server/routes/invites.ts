import express from 'express'
import { z } from 'zod'
import { acceptInviteSchema } from '../../shared/schemas/auth.js'
import { startSession } from '../middleware/session.js'
import { parseWith } from '../middleware/validate.js'
import { getMe } from '../services/auth.js'
import { acceptInvite, previewInvite } from '../services/invites.js'

/** /api/invites: the invitee's side (no sign-in needed). */
export const invitesRouter = express.Router()
const previewQuery = z.object({ token: z.string().min(20).max(200) })

invitesRouter.get('/preview', async (req, res) => {
  res.json(await previewInvite(parseWith(previewQuery, req.query).token))
})

invitesRouter.post('/accept', async (req, res) => {
  const userId = await acceptInvite(parseWith(acceptInviteSchema, req.body), req.auth?.userId ?? null)
  await startSession(req, userId)
  res.json(await getMe(userId))
})
