import express from 'express'
import { forgotPasswordSchema, resetPasswordSchema, signInSchema, signUpSchema } from '../../shared/schemas/auth.js'
import { unauthenticated } from '../errors.js'
import { requireAuth } from '../middleware/auth.js'
import { csrfTokenFor } from '../middleware/csrf.js'
import { authenticateLocal, endSession, startSession } from '../middleware/session.js'
import { parseWith } from '../middleware/validate.js'
import { getMe, signUp } from '../services/auth.js'
import { FORGOT_PASSWORD_MESSAGE, requestPasswordReset, resetPassword } from '../services/passwordReset.js'

export const authRouter = express.Router()

authRouter.get('/csrf', (req, res) => {
  res.json({ token: csrfTokenFor(req) })
})

authRouter.post('/sign-up', async (req, res) => {
  const userId = await signUp(parseWith(signUpSchema, req.body), req.ip ?? 'unknown')
  await startSession(req, userId)
  res.status(201).json(await getMe(userId))
})

authRouter.post('/sign-in', async (req, res) => {
  req.body = parseWith(signInSchema, req.body)
  const userId = await authenticateLocal(req, res)
  if (userId === null) throw unauthenticated('Wrong e-mail or password')
  await startSession(req, userId)
  res.json(await getMe(userId))
})

authRouter.post('/sign-out', async (req, res) => {
  await endSession(req, res)
  res.status(204).end()
})

authRouter.get('/me', requireAuth, async (req, res) => {
  res.json(await getMe(req.auth!.userId))
})

authRouter.post('/forgot-password', async (req, res) => {
  await requestPasswordReset(parseWith(forgotPasswordSchema, req.body).email, req.ip ?? 'unknown')
  res.status(202).json({ message: FORGOT_PASSWORD_MESSAGE })
})

authRouter.post('/reset-password', async (req, res) => {
  const input = parseWith(resetPasswordSchema, req.body)
  await resetPassword(input.token, input.password, req.sessionID ?? null)
  res.status(204).end()
})
