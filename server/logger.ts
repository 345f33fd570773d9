import { pino } from 'pino'
import { config } from './config.js'

/** Structured logs; request logs carry the request id (see app.ts). */
export const logger = pino({ level: config().logLevel })
