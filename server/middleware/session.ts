import type { Request, RequestHandler } from 'express'
import session from 'express-session'
import connectPgSimple from 'connect-pg-simple'
import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type pg from 'pg'
import { config } from '../config.js'
import { pgPool } from '../db.js'
import { logger } from '../logger.js'
import { resolveAuth, verifyCredentials } from '../services/auth.js'
import { rotateCsrfToken } from './csrf.js'

export const SESSION_COOKIE = 'ellipsoid.sid'

const PgStore = connectPgSimple(session)
let store: { pool: pg.Pool; store: session.Store } | null = null

// One store per pool: tests build many apps, and closeDb() replaces the pool.
function sessionStore(): session.Store {
  const pool = pgPool()
  if (store?.pool !== pool) {
    store = {
      pool,
      store: new PgStore({
        pool,
        tableName: 'session',
        createTableIfMissing: false,
        pruneSessionInterval: config().nodeEnv === 'test' ? false : 900,
        errorLog: (...args: unknown[]) => logger.warn({ args: args.map(String) }, 'session store error'),
      }),
    }
  }
  return store.store
}

let passportReady = false
function setUpPassport(): void {
  if (passportReady) return
  passportReady = true
  passport.use(
    new LocalStrategy({ usernameField: 'email', passReqToCallback: true }, (req, email, password, done) => {
      verifyCredentials(email, password, req.ip ?? 'unknown')
        .then((id) => done(null, id === null ? false : { id }))
        .catch((err: unknown) => done(err))
    }),
  )
  passport.serializeUser((user, done) => done(null, user.id))
  passport.deserializeUser((id: number, done) => done(null, { id }))
}

/** Cookie session in PostgreSQL: rolling idle timeout, HttpOnly, SameSite=Lax, Secure over HTTPS. */
function sessionHandler(): RequestHandler {
  const cfg = config()
  const https = cfg.publicUrl.startsWith('https:')
  return session({
    name: https ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE,
    secret: cfg.sessionSecret,
    store: sessionStore(),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: cfg.trustProxy !== false ? true : undefined,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: https ? true : 'auto',
      path: '/',
      maxAge: cfg.sessionIdleMinutes * 60_000,
    },
  })
}

function sessionExpired(req: Request): boolean {
  const at = req.session.signedInAtMs
  return at !== undefined && Date.now() - at > config().sessionMaxHours * 3_600_000
}

/** Sets req.auth from the session's user, re-reading the team role each request; ends over-age sessions. */
const loadAuth: RequestHandler = async (req, _res, next) => {
  const userId = req.session?.passport?.user
  if (typeof userId !== 'number') return next()
  if (sessionExpired(req)) {
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()))
    return next()
  }
  req.auth = (await resolveAuth(userId)) ?? undefined
  next()
}

/** The /api session stack: express-session, passport's session reader, then req.auth. */
export function sessionMiddleware(): RequestHandler[] {
  setUpPassport()
  return [sessionHandler(), passport.session(), loadAuth]
}

/** Runs passport-local on req.body ({ email, password }); resolves the user id or null for wrong credentials. */
export function authenticateLocal(req: Request, res: Parameters<RequestHandler>[1]): Promise<number | null> {
  return new Promise((resolve, reject) => {
    const run = passport.authenticate(
      'local',
      { session: false },
      (err: unknown, user: Express.User | false | undefined) => (err ? reject(err) : resolve(user ? user.id : null)),
    ) as RequestHandler
    void run(req, res, reject)
  })
}

/**
 * Signs the user into this request's session: passport regenerates the session id (fixation guard),
 * then the sign-in time (absolute lifetime) and a fresh CSRF token are stored.
 */
export async function startSession(req: Request, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.login({ id: userId }, (err) => (err ? reject(err) : resolve())))
  req.session.signedInAtMs = Date.now()
  rotateCsrfToken(req)
}

/** Destroys the session row and clears the cookie. */
export async function endSession(req: Request, res: Parameters<RequestHandler>[1]): Promise<void> {
  if (req.session) {
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())))
  }
  const https = config().publicUrl.startsWith('https:')
  res.clearCookie(https ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE, { path: '/' })
}
