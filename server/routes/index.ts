import express, { type Router } from 'express'
import { healthRouter } from './health.js'

/** The /api router: body parsing for JSON, then one router per resource. */
export function apiRouter(): Router {
  const api = express.Router()
  api.use(express.json({ limit: '1mb' }))
  api.use('/health', healthRouter)
  return api
}
