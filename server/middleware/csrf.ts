import { randomBytes, timingSafeEqual } from 'node:crypto'
import type { Request, RequestHandler } from 'express'
import { config } from '../config.js'
import { HttpError } from '../errors.js'

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])
export const CSRF_HEADER = 'X-CSRF-Token'

const csrfFailed = (message: string) => new HttpError(403, 'CSRF_FAILED', message)

/** The session's synchronizer token, created on first use (256 random bits). */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url')
  return req.session.csrfToken
}

/** Replaces the token (after sign-in) and tells the client the new one in the response header. */
export function rotateCsrfToken(req: Request): string {
  req.session.csrfToken = randomBytes(32).toString('base64url')
  req.res?.setHeader(CSRF_HEADER, req.session.csrfToken)
  return req.session.csrfToken
}

function sameOrigin(req: Request, origin: string): boolean {
  try {
    const o = new URL(origin)
    return o.host === req.get('host') || o.origin === new URL(config().publicUrl).origin
  } catch {
    return false
  }
}

function tokenMatches(expected: string | undefined, got: string | undefined): boolean {
  if (!expected || !got) return false
  const a = Buffer.from(expected)
  const b = Buffer.from(got)
  return a.length === b.length && timingSafeEqual(a, b)
}

/**
 * Refuses every unsafe method under /api unless the X-CSRF-Token header matches the session's token.
 * Fetch Metadata and Origin are checked first, so a cross-site form post fails even with a token.
 */
export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next()
  if (req.get('sec-fetch-site') === 'cross-site') return next(csrfFailed('Cross-site request refused'))
  const origin = req.get('origin')
  if (origin && !sameOrigin(req, origin)) return next(csrfFailed('Request from another origin refused'))
  if (!tokenMatches(req.session?.csrfToken, req.get(CSRF_HEADER))) {
    return next(csrfFailed('Missing or stale security token; reload the page and try again'))
  }
  next()
}
