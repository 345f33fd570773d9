import type { Role } from '../../shared/types/api.js'

/** Who is calling, resolved from the session on every /api request (undefined when signed out). */
export interface AuthContext {
  userId: number
  teamId: number
  role: Role
}

declare global {
  namespace Express {
    interface Request {
      auth?: AuthContext
    }
    // What passport keeps in the session and puts on req.user: the user id only.
    interface User {
      id: number
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string
    /** Epoch ms of the sign-in; the absolute session lifetime counts from here. */
    signedInAtMs?: number
    passport?: { user?: number }
  }
}
