import type { ErrorCode, FieldIssue } from '../shared/types/api.js'

/** An error with an HTTP status and the API's error code; the only thing services throw on purpose. */
export class HttpError extends Error {
  constructor(
    public status: number,
    public code: ErrorCode,
    message: string,
    public details?: FieldIssue[],
  ) {
    super(message)
  }

  /** Seconds for a Retry-After header (429 only). */
  retryAfterS?: number
}

export const badRequest = (message: string, details?: FieldIssue[]) =>
  new HttpError(400, 'VALIDATION_FAILED', message, details)
export const unauthenticated = (message = 'Sign in first') => new HttpError(401, 'UNAUTHENTICATED', message)
export const forbidden = (message = 'Not allowed for your role') => new HttpError(403, 'FORBIDDEN', message)
export const notFound = (what: string) => new HttpError(404, 'NOT_FOUND', `${what} not found`)
export const conflict = (message: string) => new HttpError(409, 'CONFLICT', message)
export const tooMany = (message = 'Too many attempts; try again later') =>
  new HttpError(429, 'RATE_LIMITED', message)
