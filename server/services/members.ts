import type { Transaction } from 'sequelize'
import type { ListResult, MemberDto, Role } from '../../shared/types/api.js'
import { sequelize } from '../db.js'
import { conflict, notFound } from '../errors.js'
import { Membership } from '../models/Membership.js'
import { Team } from '../models/Team.js'
import { User } from '../models/User.js'
import { hashPassword } from './passwords.js'

function toMemberDto(m: Membership): MemberDto {
  return { userId: m.userId, email: m.user?.email ?? '', name: m.user?.name ?? '', role: m.role }
}

/** Every member of a team with their role, by name. */
export async function listMembers(teamId: number): Promise<ListResult<MemberDto>> {
  const rows = await Membership.findAll({
    where: { teamId },
    include: [{ model: User, as: 'user', attributes: ['id', 'email', 'name'] }],
    order: [[{ model: User, as: 'user' }, 'name', 'ASC']],
  })
  return { items: rows.map(toMemberDto), total: rows.length }
}

// Locks the team's admin rows so two admins demoting each other cannot leave the team with none.
async function guardLastAdmin(teamId: number, m: Membership, transaction: Transaction): Promise<void> {
  if (m.role !== 'admin') return
  const admins = await Membership.findAll({ where: { teamId, role: 'admin' }, lock: transaction.LOCK.UPDATE, transaction })
  if (admins.length <= 1) throw conflict('A team needs at least one admin; make someone else admin first')
}

async function findMember(teamId: number, userId: number, transaction: Transaction): Promise<Membership> {
  const m = await Membership.findOne({ where: { teamId, userId }, transaction })
  if (!m) throw notFound(`Member ${userId}`)
  return m
}

/**
 * Changes a member's role in the team.
 * @throws HttpError 404 for a user who is not in the team; 409 when it would leave no admin
 */
export async function changeMemberRole(teamId: number, userId: number, role: Role): Promise<MemberDto> {
  await sequelize().transaction(async (transaction) => {
    const m = await findMember(teamId, userId, transaction)
    if (role !== 'admin') await guardLastAdmin(teamId, m, transaction)
    await m.update({ role }, { transaction })
  })
  const m = await Membership.findOne({ where: { teamId, userId }, include: [{ model: User, as: 'user' }] })
  return toMemberDto(m!)
}

/**
 * Removes a member from the team (their account stays; they lose access at their next request).
 * @throws HttpError 404 for a user who is not in the team; 409 for the last admin
 */
export async function removeMember(teamId: number, userId: number): Promise<void> {
  await sequelize().transaction(async (transaction) => {
    const m = await findMember(teamId, userId, transaction)
    await guardLastAdmin(teamId, m, transaction)
    await m.destroy({ transaction })
  })
}

/**
 * Creates a team and its members in one transaction (demo seed and fixtures); passwords are hashed
 * at the configured bcrypt cost, one hash per distinct password.
 * @returns the team id and each user's id, in input order
 */
export async function createTeamWithMembers(
  teamName: string,
  members: { email: string; name: string; password: string; role: Role }[],
): Promise<{ teamId: number; userIds: number[] }> {
  const hashes = new Map<string, string>()
  for (const m of members) if (!hashes.has(m.password)) hashes.set(m.password, await hashPassword(m.password))
  return sequelize().transaction(async (transaction) => {
    const team = await Team.create({ name: teamName }, { transaction })
    const userIds: number[] = []
    for (const m of members) {
      const user = await User.create(
        { email: m.email.toLowerCase(), name: m.name, passwordHash: hashes.get(m.password)!, currentTeamId: team.id },
        { transaction },
      )
      await Membership.create({ userId: user.id, teamId: team.id, role: m.role }, { transaction })
      userIds.push(user.id)
    }
    return { teamId: team.id, userIds }
  })
}

/** How many user accounts exist (the demo seeds only an empty database). */
export async function countUsers(): Promise<number> {
  return User.count()
}
