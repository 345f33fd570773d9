import express, { type Router } from 'express'
import { csrfProtection } from '../middleware/csrf.js'
import { sessionMiddleware } from '../middleware/session.js'
import { healthRouter } from './health.js'
import { authRouter } from './auth.js'
import { accountRouter } from './account.js'
import { teamsRouter } from './teams.js'
import { invitesRouter } from './invites.js'
import { devRouter } from './dev.js'
import { coursesRouter } from './courses.js'
import { setupsRouter } from './setups.js'
import { mapConfigRouter } from './mapConfig.js'
import { flightsRouter } from './flights.js'
import { columnMappingsRouter } from './columnMappings.js'
import { comparisonsRouter } from './comparisons.js'

/** The /api router: body parsing for JSON, then one router per resource. */
export function apiRouter(): Router {
  const api = express.Router()
  api.use(express.json({ limit: '1mb' }))
  api.use('/health', healthRouter)
  // Session (and req.auth) before the CSRF check, which needs the session's token; both before every
  // router, so no state-changing route (multipart uploads included) can skip them.
  api.use(sessionMiddleware())
  api.use(csrfProtection)
  api.use('/auth', authRouter)
  api.use('/account', accountRouter)
  api.use('/teams', teamsRouter)
  api.use('/invites', invitesRouter)
  api.use('/dev', devRouter)
  api.use('/courses', coursesRouter)
  api.use('/setups', setupsRouter)
  api.use('/config', mapConfigRouter)
  api.use('/flights', flightsRouter)
  api.use('/column-mappings', columnMappingsRouter)
  api.use('/comparisons', comparisonsRouter)
  return api
}
