import bcrypt from 'bcryptjs'
import { PASSWORD_MAX_BYTES } from '../../shared/schemas/auth.js'
import { config } from '../config.js'
import { badRequest } from '../errors.js'

let dummyHash: Promise<string> | null = null

/**
 * Hashes a password with bcrypt at the configured cost.
 * @throws HttpError 400 when the password is over 72 UTF-8 bytes (bcrypt would silently cut it)
 */
export async function hashPassword(password: string, field = 'password'): Promise<string> {
  if (Buffer.byteLength(password, 'utf8') > PASSWORD_MAX_BYTES) {
    throw badRequest('Password too long', [
      { path: field, message: `Use at most ${PASSWORD_MAX_BYTES} bytes; longer passwords are refused, never cut` },
    ])
  }
  return bcrypt.hash(password, config().bcryptCost)
}

/**
 * Checks a password against a stored hash; with no hash it still spends one bcrypt compare so a
 * missing account takes as long as a wrong password. Over-long input never matches.
 */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const tooLong = Buffer.byteLength(password, 'utf8') > PASSWORD_MAX_BYTES
  dummyHash ??= bcrypt.hash('not-a-real-password', config().bcryptCost)
  const ok = await bcrypt.compare(password, hash ?? (await dummyHash))
  return ok && hash !== null && !tooLong
}
