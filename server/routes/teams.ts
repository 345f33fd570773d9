import express from 'express'
import { changeRoleSchema, inviteSchema } from '../../shared/schemas/auth.js'
import { requireAuth, requireRole } from '../middleware/auth.js'
import { parseId, parseWith } from '../middleware/validate.js'
import { createInvite, deleteInvite, listInvites } from '../services/invites.js'
import { changeMemberRole, listMembers, removeMember } from '../services/members.js'

/** /api/teams/current/...: members and invites of the caller's current team. */
export const teamsRouter = express.Router()
const admin = requireRole('admin')
const inviter = requireRole('admin', 'instructor')

teamsRouter.get('/current/members', requireAuth, async (req, res) => {
  res.json(await listMembers(req.auth!.teamId))
})

teamsRouter.patch('/current/members/:userId', admin, async (req, res) => {
  const userId = parseId(req.params.userId, 'userId')
  res.json(await changeMemberRole(req.auth!.teamId, userId, parseWith(changeRoleSchema, req.body).role))
})

teamsRouter.delete('/current/members/:userId', admin, async (req, res) => {
  await removeMember(req.auth!.teamId, parseId(req.params.userId, 'userId'))
  res.status(204).end()
})

teamsRouter.get('/current/invites', inviter, async (req, res) => {
  res.json(await listInvites(req.auth!.teamId))
})

teamsRouter.post('/current/invites', inviter, async (req, res) => {
  const input = parseWith(inviteSchema, req.body)
  res.status(201).json(await createInvite(req.auth!, input.email, input.role))
})

teamsRouter.delete('/current/invites/:inviteId', inviter, async (req, res) => {
  await deleteInvite(req.auth!, parseId(req.params.inviteId, 'inviteId'))
  res.status(204).end()
})
