import type { ErrorRequestHandler } from 'express'
import { ConnectionError, UniqueConstraintError, ValidationError } from 'sequelize'
import { ZodError } from 'zod'
import { HttpError, badRequest } from '../errors.js'
import { logger } from '../logger.js'

const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', '57P01', '57P02', '57P03', '08006', '08001'])

function toHttpError(err: unknown): HttpError {
  if (err instanceof HttpError) return err
  if (err instanceof ZodError) {
    return badRequest(
      'Invalid input',
      err.issues.map((i) => ({ path: i.path.join('.'), message: i.message })),
    )
  }
  // UniqueConstraintError extends ValidationError, so it must be tested first
  if (err instanceof UniqueConstraintError) return new HttpError(409, 'CONFLICT', 'Already exists')
  if (err instanceof ValidationError) {
    return badRequest('Invalid data', err.errors.map((e) => ({ path: e.path ?? '', message: e.message })))
  }
  const e = err as { type?: string; status?: number; code?: string }
  // The database (or the session store on it) is unreachable or restarting: a generic, retryable 503.
  if (err instanceof ConnectionError || DB_DOWN_CODES.has(e?.code ?? '')) {
    return new HttpError(503, 'UNAVAILABLE', 'The service is briefly unavailable; try again shortly')
  }
  if (e?.type === 'entity.too.large') return new HttpError(413, 'PAYLOAD_TOO_LARGE', 'Request body too large')
  if (e?.type === 'entity.parse.failed') return badRequest('Malformed JSON body')
  if (e?.code === 'LIMIT_FILE_SIZE') return new HttpError(413, 'PAYLOAD_TOO_LARGE', 'File too large')
  if (typeof e?.code === 'string' && e.code.startsWith('LIMIT_')) return badRequest(`Upload refused: ${e.code}`)
  return new HttpError(500, 'INTERNAL', 'Internal error')
}

/** The only writer of error bodies; registered last in app.ts. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const e = toHttpError(err)
  if (e.status >= 500) logger.error({ err, requestId: req.id }, 'unhandled error')
  if (res.headersSent) return
  if (e.retryAfterS !== undefined) res.setHeader('Retry-After', String(e.retryAfterS))
  res.status(e.status).json({ error: { code: e.code, message: e.message, details: e.details } })
}
