import { QueryTypes } from 'sequelize'
import { config } from '../config.js'
import { sequelize } from '../db.js'
import { HttpError, tooMany } from '../errors.js'

/** Adds one attempt to a counter in a fixed window; the window restarts once it has passed. */
async function bump(key: string, windowMinutes: number): Promise<{ attempts: number; resetInS: number }> {
  const rows = await sequelize().query<{ attempts: number; reset_in_s: number }>(
    `INSERT INTO login_throttles (key, attempts, window_start) VALUES (:key, 1, now())
     ON CONFLICT (key) DO UPDATE SET
       attempts = CASE WHEN login_throttles.window_start < now() - make_interval(mins => :win)
                       THEN 1 ELSE login_throttles.attempts + 1 END,
       window_start = CASE WHEN login_throttles.window_start < now() - make_interval(mins => :win)
                           THEN now() ELSE login_throttles.window_start END
     RETURNING attempts,
       ceil(extract(epoch FROM window_start + make_interval(mins => :win) - now()))::int AS reset_in_s`,
    { replacements: { key, win: windowMinutes }, type: QueryTypes.SELECT },
  )
  const r = rows[0]!
  return { attempts: r.attempts, resetInS: Math.max(1, r.reset_in_s) }
}

function limited(resetInS: number): HttpError {
  const e = tooMany('Too many sign-in attempts; try again later or reset your password')
  e.retryAfterS = resetInS
  return e
}

/**
 * Counts a sign-in attempt against the account and the client address before the password is
 * checked (count first, so parallel requests on several instances cannot exceed the limit).
 * @throws HttpError 429 RATE_LIMITED with retryAfterS once either counter is over its limit
 */
export async function countSignInAttempt(email: string, address: string): Promise<void> {
  const cfg = config()
  const acct = await bump(`acct:${email}`, cfg.loginWindowMinutes)
  const addr = await bump(`addr:${address}`, cfg.loginWindowMinutes)
  if (acct.attempts > cfg.loginMaxPerAccount) throw limited(acct.resetInS)
  if (addr.attempts > cfg.loginMaxPerAddress) throw limited(addr.resetInS)
}

/**
 * Counts an unauthenticated request of some kind (sign-up, forgot-password) per client address.
 * @throws HttpError 429 RATE_LIMITED over the per-address limit
 */
export async function countAddressAttempt(kind: string, address: string): Promise<void> {
  const cfg = config()
  const r = await bump(`${kind}:${address}`, cfg.loginWindowMinutes)
  if (r.attempts > cfg.loginMaxPerAddress) throw limited(r.resetInS)
}

/**
 * A successful sign-in clears the account's counter and takes its own attempt back off the address
 * counter, so only failures add up per address (colleagues behind one NAT are not locked out).
 */
export async function clearAccountAttempts(email: string, address: string): Promise<void> {
  await sequelize().query('DELETE FROM login_throttles WHERE key = :key', { replacements: { key: `acct:${email}` } })
  await sequelize().query('UPDATE login_throttles SET attempts = greatest(attempts - 1, 0) WHERE key = :key', {
    replacements: { key: `addr:${address}` },
  })
}

/** Counts one event under `key`; false once the window holds more than `max` events. */
export async function countKeyAttempt(key: string, max: number): Promise<boolean> {
  const r = await bump(key, config().loginWindowMinutes)
  return r.attempts <= max
}
