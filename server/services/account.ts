import type { MeDto, UnitSystem } from '../../shared/types/api.js'
import { badRequest, notFound, unauthenticated } from '../errors.js'
import { Membership } from '../models/Membership.js'
import { User } from '../models/User.js'
import { getMe, verifyCredentials } from './auth.js'
import { hashPassword } from './passwords.js'
import { notifyPasswordChanged } from './passwordReset.js'

/**
 * Changes the caller's own name and unit preference (nothing else is accepted).
 * @returns the updated MeDto
 */
export async function updateAccount(userId: number, input: { name?: string; units?: UnitSystem }): Promise<MeDto> {
  const user = await User.findByPk(userId)
  if (!user) throw unauthenticated()
  await user.update({ ...(input.name !== undefined && { name: input.name }), ...(input.units && { units: input.units }) })
  return getMe(userId)
}

/**
 * Changes the password after checking the current one (counted like a sign-in attempt) and mails a notice.
 * @throws HttpError 400 with details on currentPassword when it is wrong; 429 when over the sign-in limit
 */
export async function changePassword(userId: number, currentPassword: string, newPassword: string, address: string): Promise<void> {
  const user = await User.findByPk(userId)
  if (!user) throw unauthenticated()
  const ok = await verifyCredentials(user.email, currentPassword, address)
  if (ok !== userId) {
    throw badRequest('Current password is wrong', [{ path: 'currentPassword', message: 'Current password is wrong' }])
  }
  await user.update({ passwordHash: await hashPassword(newPassword, 'newPassword') })
  await notifyPasswordChanged(userId)
}

/**
 * Makes another of the caller's teams the current one.
 * @throws HttpError 404 when the caller is not a member of that team
 */
export async function switchTeam(userId: number, teamId: number): Promise<MeDto> {
  const m = await Membership.findOne({ where: { userId, teamId } })
  if (!m) throw notFound(`Team ${teamId}`)
  await User.update({ currentTeamId: teamId }, { where: { id: userId } })
  return getMe(userId)
}
