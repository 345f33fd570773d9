import { describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.js'
import { signedIn, signedInElsewhere, signedInToTeam } from './helpers.js'
import { useMailSuite } from './mail-suite.js'

const app = createApp()

useMailSuite()

describe('GET /api/dev/outbox', () => {
  it('shows an admin the messages to their team\'s invitees, newest first, and nothing of other teams', async () => {
    const admin = await signedIn(app)
    const other = await signedInElsewhere(app)
    for (const email of ['one@example.test', 'two@example.test']) {
      await admin.agent.post('/api/teams/current/invites').set('X-CSRF-Token', admin.csrf).send({ email, role: 'viewer' })
    }
    await other.agent.post('/api/teams/current/invites').set('X-CSRF-Token', other.csrf).send({ email: 'elsewhere@example.test', role: 'viewer' })
    const res = await admin.agent.get('/api/dev/outbox')
    expect(res.status).toBe(200)
    expect(res.body.total).toBe(2)
    expect(res.body.items.map((m: { to: string }) => m.to)).toEqual(['two@example.test', 'one@example.test'])
    expect(res.body.items[0]).toMatchObject({ subject: expect.stringContaining(admin.team.name), text: expect.stringContaining('/accept-invite?token=') })
  })

  it('responds 403 FORBIDDEN to a pilot', async () => {
    const admin = await signedIn(app)
    const pilot = await signedInToTeam(app, admin.team.id, 'pilot')
    const res = await pilot.agent.get('/api/dev/outbox')
    expect([res.status, res.body.error.code]).toEqual([403, 'FORBIDDEN'])
  })
})
