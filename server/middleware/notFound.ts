import type { RequestHandler } from 'express'
import { notFound as notFoundError } from '../errors.js'

/** Unknown /api paths answer the one error shape, never the client's index.html. */
export const notFound: RequestHandler = (req, _res, next) => next(notFoundError(`Route ${req.method} ${req.path}`))
