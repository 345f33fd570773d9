import { Op } from 'sequelize'
import { config } from '../config.js'
import { sequelize } from '../db.js'
import { HttpError } from '../errors.js'
import { logger } from '../logger.js'
import { PasswordReset } from '../models/PasswordReset.js'
import { User } from '../models/User.js'
import { countAddressAttempt, countKeyAttempt } from './loginThrottle.js'
import { sendMail } from './mail.js'
import { hashPassword } from './passwords.js'
import { endUserSessions } from './sessions.js'
import { hashToken, newToken } from './tokens.js'

export const FORGOT_PASSWORD_MESSAGE =
  'If an account uses that e-mail, a reset link is on its way. It works once, within one hour.'
const RESET_TTL_MS = 60 * 60 * 1000
const RESETS_PER_ACCOUNT = 5

async function mailResetLink(email: string): Promise<void> {
  const user = await User.findOne({ where: { email } })
  if (!user) return
  // A per-account cap stops the form being used to flood someone's inbox.
  if (!(await countKeyAttempt(`reset-mail:${email}`, RESETS_PER_ACCOUNT))) return
  const { token, hash } = newToken()
  await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS), usedAt: null })
  const link = `${config().publicUrl}/reset-password?token=${encodeURIComponent(token)}`
  await sendMail({
    to: user.email,
    subject: 'Reset your Ellipsoid password',
    text:
      `Hello ${user.name},\n\nSomeone asked to reset the password of your Ellipsoid account. ` +
      `To choose a new password, open this link within one hour:\n\n${link}\n\n` +
      `The link works once. If you did not ask for this, ignore this message; your password stays as it is.\n`,
  })
}

/**
 * Starts a password reset. Answers the same way, at the same speed, whether or not the account
 * exists: the lookup and the e-mail run after the response.
 * @throws HttpError 429 when the client address is over its limit
 */
export async function requestPasswordReset(email: string, address: string): Promise<void> {
  await countAddressAttempt('forgot', address)
  void mailResetLink(email).catch((err: Error) => logger.error({ err: err.message }, 'password reset mail failed'))
}

/**
 * Sets a new password from a mailed token: the token is claimed atomically (single use, 1 h),
 * every other reset of the user is voided, all the user's sessions end, and a notice is mailed.
 * No session is started.
 * @throws HttpError 400 when the token is unknown, used or expired, or the password is too long
 */
export async function resetPassword(token: string, password: string, keepSid: string | null): Promise<void> {
  const passwordHash = await hashPassword(password)
  const userId = await sequelize().transaction(async (transaction) => {
    const [count, rows] = await PasswordReset.update(
      { usedAt: new Date() },
      {
        where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
        returning: true,
        transaction,
      },
    )
    const claimed = rows[0]
    if (count !== 1 || !claimed) {
      throw new HttpError(400, 'VALIDATION_FAILED', 'This reset link is invalid, used or expired; ask for a new one', [
        { path: 'token', message: 'invalid, used or expired' },
      ])
    }
    await User.update({ passwordHash }, { where: { id: claimed.userId }, transaction })
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: claimed.userId, usedAt: null }, transaction })
    return claimed.userId
  })
  await endUserSessions(userId, keepSid)
  await notifyPasswordChanged(userId)
}

/** Mails the account owner that the password changed; a failed notice is logged, never fatal. */
export async function notifyPasswordChanged(userId: number): Promise<void> {
  const user = await User.findByPk(userId)
  if (!user) return
  await sendMail({
    to: user.email,
    subject: 'Your Ellipsoid password was changed',
    text:
      `Hello ${user.name},\n\nThe password of your Ellipsoid account was just changed. ` +
      `If that was not you, reset it now at ${config().publicUrl}/forgot-password and tell your team admin.\n`,
  }).catch((err: Error) => logger.warn({ err: err.message }, 'password change notice not sent'))
}
