import type { RequestHandler } from 'express'
import type { Role } from '../../shared/types/api.js'
import { forbidden, unauthenticated } from '../errors.js'
import type { AuthContext } from '../types/express.js'

export type { AuthContext }

/** Roles that may create and edit team content (courses, setups, flights). Viewers only read. */
export const WRITE_ROLES: readonly Role[] = ['admin', 'instructor', 'pilot']

/** 401 UNAUTHENTICATED unless the request carries a signed-in session with a current team. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  next(req.auth ? undefined : unauthenticated())
}

/** 401 when signed out, 403 FORBIDDEN when the role in the current team is not one of `roles`. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.auth) return next(unauthenticated())
    next(roles.includes(req.auth.role) ? undefined : forbidden())
  }
}

/**
 * Whether the caller may edit or delete a team item owned by `ownerUserId`: admins may edit any,
 * pilots and instructors only their own, viewers none. Team scoping is the caller's job (404 first).
 */
export function canEditOwned(auth: AuthContext | undefined, ownerUserId: number | null): boolean {
  if (!auth) return false
  if (auth.role === 'admin') return true
  if (auth.role === 'pilot' || auth.role === 'instructor') return ownerUserId === auth.userId
  return false
}
