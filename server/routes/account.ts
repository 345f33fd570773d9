import express from 'express'
import { changePasswordSchema, switchTeamSchema, updateAccountSchema } from '../../shared/schemas/auth.js'
import { requireAuth } from '../middleware/auth.js'
import { startSession } from '../middleware/session.js'
import { parseWith } from '../middleware/validate.js'
import { changePassword, switchTeam, updateAccount } from '../services/account.js'
import { endUserSessions } from '../services/sessions.js'

export const accountRouter = express.Router()
accountRouter.use(requireAuth)

accountRouter.patch('/', async (req, res) => {
  res.json(await updateAccount(req.auth!.userId, parseWith(updateAccountSchema, req.body)))
})

accountRouter.post('/password', async (req, res) => {
  const input = parseWith(changePasswordSchema, req.body)
  const userId = req.auth!.userId
  await changePassword(userId, input.currentPassword, input.newPassword, req.ip ?? 'unknown')
  await startSession(req, userId) // a new session id after a credential change
  if (input.endOtherSessions) await endUserSessions(userId, req.sessionID)
  res.status(204).end()
})

accountRouter.post('/team', async (req, res) => {
  res.json(await switchTeam(req.auth!.userId, parseWith(switchTeamSchema, req.body).teamId))
})
