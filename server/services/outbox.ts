import { Op } from 'sequelize'
import type { ListResult, OutboxMessageDto } from '../../shared/types/api.js'
import { notFound } from '../errors.js'
import { Invite } from '../models/Invite.js'
import { Membership } from '../models/Membership.js'
import { OutgoingMail } from '../models/OutgoingMail.js'
import { User } from '../models/User.js'
import { usingLocalSink } from './mail.js'

const OUTBOX_LIMIT = 100

/**
 * The local sink's messages to a team's members and invitees, newest first (dev only).
 * @throws HttpError 404 when a real SMTP server is configured (the outbox does not exist then)
 */
export async function listOutbox(teamId: number): Promise<ListResult<OutboxMessageDto>> {
  if (!usingLocalSink()) throw notFound('Outbox')
  const members = await Membership.findAll({ where: { teamId }, include: [{ model: User, as: 'user', attributes: ['email'] }] })
  const invites = await Invite.findAll({ where: { teamId }, attributes: ['email'] })
  const addresses = [...new Set([...members.map((m) => m.user?.email ?? ''), ...invites.map((i) => i.email)])]
  const where = { to: { [Op.in]: addresses } }
  const { rows, count } = await OutgoingMail.findAndCountAll({ where, order: [['id', 'DESC']], limit: OUTBOX_LIMIT })
  return {
    items: rows.map((r) => ({ id: r.id, to: r.to, subject: r.subject, text: r.text, receivedAt: r.receivedAt.toISOString() })),
    total: count,
  }
}
