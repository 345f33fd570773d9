import { createHash, randomBytes } from 'node:crypto'

/** A fresh single-use secret (256 random bits, base64url) and the sha256 hex that is stored instead. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, hash: hashToken(token) }
}

/** sha256 hex of a token as mailed; tokens are looked up by this hash only. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex')
}
