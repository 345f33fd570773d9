import type { MeDto, Role, TeamRef } from '../../shared/types/api.js'
import type { SignUpInput } from '../../shared/schemas/auth.js'
import type { AuthContext } from '../types/express.js'
import { sequelize } from '../db.js'
import { conflict, unauthenticated } from '../errors.js'
import { Membership } from '../models/Membership.js'
import { Team } from '../models/Team.js'
import { User } from '../models/User.js'
import { clearAccountAttempts, countAddressAttempt, countSignInAttempt } from './loginThrottle.js'
import { hashPassword, verifyPassword } from './passwords.js'

/**
 * Creates a user and a new team with that user as its admin, in one transaction.
 * @returns the new user's id
 * @throws HttpError 409 when the e-mail is taken, 400 for an over-long password, 429 when the address is over its limit
 */
export async function signUp(input: SignUpInput, address: string): Promise<number> {
  await countAddressAttempt('signup', address)
  const passwordHash = await hashPassword(input.password)
  return sequelize().transaction(async (transaction) => {
    if (await User.findOne({ where: { email: input.email }, transaction })) {
      throw conflict('An account with this e-mail already exists; sign in or reset your password')
    }
    const team = await Team.create({ name: input.teamName }, { transaction })
    const user = await User.create(
      { email: input.email, name: input.name, passwordHash, currentTeamId: team.id },
      { transaction },
    )
    await Membership.create({ userId: user.id, teamId: team.id, role: 'admin' }, { transaction })
    return user.id
  })
}

/**
 * Checks e-mail and password after counting the attempt; a missing account costs the same bcrypt
 * time as a wrong password, so neither status, body nor timing tells them apart.
 * @returns the user id, or null for wrong credentials
 * @throws HttpError 429 RATE_LIMITED when the account or the address is over its limit
 */
export async function verifyCredentials(email: string, password: string, address: string): Promise<number | null> {
  await countSignInAttempt(email, address)
  const user = await User.findOne({ where: { email } })
  const ok = await verifyPassword(password, user?.passwordHash ?? null)
  if (!ok || !user) return null
  await clearAccountAttempts(email, address)
  return user.id
}

// The current team's membership; falls back to the oldest membership (and records it) when the current team is gone.
async function currentMembership<M extends Membership>(user: User, memberships: M[]): Promise<M | null> {
  const current = memberships.find((m) => m.teamId === user.currentTeamId) ?? memberships[0]
  if (!current) return null
  if (current.teamId !== user.currentTeamId) await user.update({ currentTeamId: current.teamId })
  return current
}

/**
 * Resolves the caller's current team and role (read on every request, so role changes apply at
 * once). Falls back to another membership when the current team is gone; null without any.
 */
export async function resolveAuth(userId: number): Promise<AuthContext | null> {
  const user = await User.findByPk(userId, { attributes: ['id', 'currentTeamId'] })
  if (!user) return null
  const memberships = await Membership.findAll({ where: { userId }, order: [['id', 'ASC']] })
  const current = await currentMembership(user, memberships)
  return current ? { userId, teamId: current.teamId, role: current.role } : null
}

/**
 * The signed-in user with every team they belong to.
 * @throws HttpError 401 when the user no longer exists or has no team
 */
export async function getMe(userId: number): Promise<MeDto> {
  const user = await User.findByPk(userId)
  if (!user) throw unauthenticated()
  const memberships = await Membership.findAll({
    where: { userId },
    include: [{ model: Team, as: 'team' }],
    order: [['id', 'ASC']],
  })
  const current = await currentMembership(user, memberships)
  if (!current) throw unauthenticated()
  const teams: TeamRef[] = [...memberships]
    .sort((a, b) => a.teamId - b.teamId)
    .map((m) => ({ id: m.teamId, name: m.team?.name ?? '', role: m.role as Role }))
  return { id: user.id, email: user.email, name: user.name, units: user.units, currentTeamId: current.teamId, teams }
}
