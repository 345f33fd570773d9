import { Op } from 'sequelize'
import type { InviteDto, ListResult, Role } from '../../shared/types/api.js'
import type { AuthContext } from '../types/express.js'
import { config } from '../config.js'
import { sequelize } from '../db.js'
import { HttpError, badRequest, conflict, forbidden, notFound, unauthenticated } from '../errors.js'
import { Invite } from '../models/Invite.js'
import { Membership } from '../models/Membership.js'
import { Team } from '../models/Team.js'
import { User } from '../models/User.js'
import { sendMail } from './mail.js'
import { hashPassword, verifyPassword } from './passwords.js'
import { hashToken, newToken } from './tokens.js'

const INVITE_TTL_MS = 7 * 24 * 3600 * 1000
const ROLE_LABEL: Record<Role, string> = { admin: 'an admin', instructor: 'an instructor', pilot: 'a pilot', viewer: 'a viewer' }

function toInviteDto(i: Invite): InviteDto {
  return {
    id: i.id,
    email: i.email,
    role: i.role,
    expiresAt: i.expiresAt.toISOString(),
    acceptedAt: i.acceptedAt ? i.acceptedAt.toISOString() : null,
  }
}

const invalidInvite = () => new HttpError(404, 'NOT_FOUND', 'This invite link is invalid, used or expired')

/** The team's invites, newest first. */
export async function listInvites(teamId: number): Promise<ListResult<InviteDto>> {
  const rows = await Invite.findAll({ where: { teamId }, order: [['id', 'DESC']] })
  return { items: rows.map(toInviteDto), total: rows.length }
}

/**
 * Invites an e-mail address into the caller's team with a role and mails a single-use link (7 days).
 * A pending invite to the same address is replaced. Instructors may invite viewers only.
 * @throws HttpError 403 for a role the caller may not grant; 409 when the address is already a member; 503 when mail fails
 */
export async function createInvite(auth: AuthContext, email: string, role: Role): Promise<InviteDto> {
  if (auth.role !== 'admin' && !(auth.role === 'instructor' && role === 'viewer')) {
    throw forbidden('Instructors may invite viewers only')
  }
  const team = await Team.findByPk(auth.teamId)
  const inviter = await User.findByPk(auth.userId)
  if (!team || !inviter) throw unauthenticated()
  const existing = await User.findOne({ where: { email } })
  if (existing && (await Membership.findOne({ where: { userId: existing.id, teamId: team.id } }))) {
    throw conflict(`${email} is already a member of this team`)
  }
  const { token, hash } = newToken()
  // The e-mail goes out inside the transaction: no invite is stored that nobody was told about.
  const invite = await sequelize().transaction(async (transaction) => {
    await Invite.destroy({ where: { teamId: team.id, email, acceptedAt: null }, transaction })
    const row = await Invite.create(
      { teamId: team.id, email, role, tokenHash: hash, expiresAt: new Date(Date.now() + INVITE_TTL_MS), acceptedAt: null, invitedBy: inviter.id },
      { transaction },
    )
    await sendMail(inviteMail(email, team.name, inviter.name, role, token))
    return row
  })
  return toInviteDto(invite)
}

function inviteMail(to: string, teamName: string, inviterName: string, role: Role, token: string) {
  const link = `${config().publicUrl}/accept-invite?token=${encodeURIComponent(token)}`
  return {
    to,
    subject: `${inviterName} invited you to ${teamName} on Ellipsoid`,
    text:
      `Hello,\n\n${inviterName} invited you to join the team "${teamName}" on Ellipsoid as ${ROLE_LABEL[role]}.\n\n` +
      `To accept, open this link within 7 days:\n\n${link}\n\nThe link works once. If you did not expect this, ignore this message.\n`,
  }
}

/**
 * Withdraws an invite of the caller's team; instructors only their own.
 * @throws HttpError 404 when the invite is not in the caller's team; 403 for another person's invite
 */
export async function deleteInvite(auth: AuthContext, inviteId: number): Promise<void> {
  const invite = await Invite.findOne({ where: { id: inviteId, teamId: auth.teamId } })
  if (!invite) throw notFound(`Invite ${inviteId}`)
  if (auth.role !== 'admin' && invite.invitedBy !== auth.userId) throw forbidden('You may withdraw only your own invites')
  await invite.destroy()
}

async function findPending(token: string): Promise<Invite> {
  const invite = await Invite.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: Team, as: 'team' }],
  })
  if (!invite) throw invalidInvite()
  return invite
}

/**
 * What an invite link offers, for the accept screen.
 * @throws HttpError 404 when the token is unknown, used or expired
 */
export async function previewInvite(token: string): Promise<{ email: string; teamName: string; role: Role; existingUser: boolean }> {
  const invite = await findPending(token)
  const existing = await User.findOne({ where: { email: invite.email }, attributes: ['id'] })
  return { email: invite.email, teamName: invite.team?.name ?? '', role: invite.role, existingUser: existing !== null }
}

export interface AcceptInput {
  token: string
  name?: string
  password?: string
}

/**
 * Redeems an invite: a new address gets an account (name and password required); an existing account
 * must be the signed-in user or give its password. The claim is atomic, so a link works exactly once.
 * Team and role come only from the stored invite.
 * @returns the id of the user to sign in
 * @throws HttpError 404 invalid/used/expired; 400 missing name or password; 401 wrong password; 409 already a member
 */
export async function acceptInvite(input: AcceptInput, signedInUserId: number | null): Promise<number> {
  const invite = await findPending(input.token)
  const existing = await User.findOne({ where: { email: invite.email } })
  let newPasswordHash: string | null = null
  if (existing) {
    const mayJoin = signedInUserId === existing.id || (input.password !== undefined && (await verifyPassword(input.password, existing.passwordHash)))
    if (!mayJoin) throw unauthenticated(`Sign in as ${invite.email} or enter that account's password to accept`)
  } else {
    const details = [
      ...(input.name ? [] : [{ path: 'name', message: 'Enter your name' }]),
      ...(input.password ? [] : [{ path: 'password', message: 'Choose a password' }]),
    ]
    if (details.length) throw badRequest('Name and password are needed for a new account', details)
    newPasswordHash = await hashPassword(input.password!)
  }
  return sequelize().transaction(async (transaction) => {
    const [claimed] = await Invite.update(
      { acceptedAt: new Date() },
      { where: { id: invite.id, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
    )
    if (claimed !== 1) throw invalidInvite()
    const user =
      existing ??
      (await User.create({ email: invite.email, name: input.name!, passwordHash: newPasswordHash!, currentTeamId: invite.teamId }, { transaction }))
    if (await Membership.findOne({ where: { userId: user.id, teamId: invite.teamId }, transaction })) {
      throw conflict('You are already a member of this team')
    }
    await Membership.create({ userId: user.id, teamId: invite.teamId, role: invite.role }, { transaction })
    await user.update({ currentTeamId: invite.teamId }, { transaction })
    return user.id
  })
}
