import fs from 'node:fs'
import path from 'node:path'
import { randomUUID } from 'node:crypto'
import express, { type Express } from 'express'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import { config } from './config.js'
import { logger } from './logger.js'
import { apiRouter } from './routes/index.js'
import { notFound } from './middleware/notFound.js'
import { errorHandler } from './middleware/errorHandler.js'

const DIST = path.resolve('dist')

/** Builds the Express app (no listen): security headers, API, client, 404 and the error handler. */
export function createApp(): Express {
  const cfg = config()
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', cfg.trustProxy)
  app.set('query parser', 'simple')

  // Headers first so every response, errors included, carries them.
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'base-uri': ["'none'"],
          'frame-ancestors': ["'none'"],
          'img-src': ["'self'", 'data:', 'blob:', ...tileHosts(cfg.tileUrl)],
          'upgrade-insecure-requests': cfg.nodeEnv === 'production' ? [] : null,
        },
      },
    }),
  )
  // Request ids before logging so each log line carries one.
  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = randomUUID()
        res.setHeader('X-Request-Id', id)
        return id
      },
      autoLogging: cfg.nodeEnv !== 'test',
    }),
  )
  // API responses are per-user data: never cached by browsers or proxies.
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store')
    next()
  })
  app.use('/api', apiRouter())
  app.use('/api', notFound)

  if (fs.existsSync(path.join(DIST, 'index.html'))) {
    app.use(express.static(DIST, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(DIST, 'index.html')))
  }
  app.use(errorHandler)
  return app
}

function tileHosts(url: string | null): string[] {
  if (!url) return []
  try {
    const u = new URL(url.replace(/\{[a-z]\}/g, 'a'))
    return [`${u.protocol}//${u.host.replace(/^a\./, '*.')}`]
  } catch {
    return []
  }
}
