import fs from 'node:fs'
import path from 'node:path'
import { randomUUID } from 'node:crypto'
import express, { type Express } from 'express'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import { config } from './config.js'
import { logger } from './logger.js'
import { sequelize } from './db.js'
import { apiRouter } from './routes/index.js'
import { tilesRouter } from './routes/tiles.js'
import { notFound } from './middleware/notFound.js'
import { errorHandler } from './middleware/errorHandler.js'

const DIST = path.resolve('dist')

/** Builds the Express app (no listen): security headers, API, client, 404 and the error handler. */
export function createApp(): Express {
  const cfg = config()
  sequelize() // models are initialised before the first request, whoever builds the app
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', cfg.trustProxy)
  app.set('query parser', 'simple')

  // Headers first so every response, errors included, carries them. HSTS and upgrade-insecure-requests
  // only when served over HTTPS: on plain http://127.0.0.1 they would break the app in some browsers.
  const https = cfg.publicUrl.startsWith('https:')
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'base-uri': ["'none'"],
          'frame-ancestors': ["'none'"],
          'img-src': ["'self'", 'data:', 'blob:', ...tileHosts(cfg.tileUrl)],
          'upgrade-insecure-requests': https ? [] : null,
        },
      },
      strictTransportSecurity: https ? { maxAge: 31_536_000, includeSubDomains: true } : false,
    }),
  )
  // Request ids before logging so each log line carries one. Log lines stay short: no headers, so
  // cookies and CSRF tokens never reach the logs; query strings (reset/invite tokens) are cut off.
  app.use(
    pinoHttp({
      logger,
      genReqId: (_req, res) => {
        const id = randomUUID()
        res.setHeader('X-Request-Id', id)
        return id
      },
      autoLogging: cfg.nodeEnv !== 'test',
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url.split('?')[0] }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
    }),
  )
  // API responses are per-user data: never cached by browsers or proxies.
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store')
    next()
  })
  app.use('/api', apiRouter())
  app.use('/api', notFound)
  // Local map tiles: outside /api (no session, cacheable), before the client's catch-all route.
  app.use('/tiles', tilesRouter)

  if (fs.existsSync(path.join(DIST, 'index.html'))) {
    app.use(express.static(DIST, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(DIST, 'index.html')))
  }
  // Our own last 404 (no client build, or a non-GET outside /api) keeps helmet's headers, which Express's
  // built-in one would replace with its own CSP.
  app.use((_req, res) => {
    res.status(404).type('text/plain').send('Not found')
  })
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
