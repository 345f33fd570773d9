import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import type { InviteDto, MemberDto } from '@shared/types/api'
import * as teamApi from '@/api/team'
import { useTeamStore } from '@/stores/team'

vi.mock('@/api/team')

const members: MemberDto[] = [
  { userId: 1, email: 'ada@example.test', name: 'Ada', role: 'admin' },
  { userId: 2, email: 'bo@example.test', name: 'Bo', role: 'pilot' },
]
const invite = (id: number, acceptedAt: string | null = null): InviteDto => ({
  id,
  email: `i${id}@example.test`,
  role: 'viewer',
  expiresAt: '2026-12-09T00:00:00.000Z',
  acceptedAt,
})

beforeEach(() => {
  setActivePinia(createPinia())
  vi.resetAllMocks()
})

describe('useTeamStore', () => {
  it('fetchMembers loads the list and clears loading', async () => {
    vi.mocked(teamApi.listMembers).mockResolvedValue({ items: members, total: 2 })
    const team = useTeamStore()
    await team.fetchMembers()
    expect([team.members.length, team.loading]).toEqual([2, false])
  })

  it('fetchInvites keeps only invites not yet accepted', async () => {
    vi.mocked(teamApi.listInvites).mockResolvedValue({
      items: [invite(1), invite(2, '2026-12-01T00:00:00.000Z')],
      total: 2,
    })
    const team = useTeamStore()
    await team.fetchInvites()
    expect(team.invites.map((i) => i.id)).toEqual([1])
  })

  it('invite puts the new invite first and replaces a resent one', async () => {
    vi.mocked(teamApi.listInvites).mockResolvedValue({ items: [invite(1), invite(2)], total: 2 })
    vi.mocked(teamApi.createInvite).mockResolvedValue(invite(2))
    const team = useTeamStore()
    await team.fetchInvites()
    await team.invite('i2@example.test', 'viewer')
    expect(teamApi.createInvite).toHaveBeenCalledWith('i2@example.test', 'viewer')
    expect(team.invites.map((i) => i.id)).toEqual([2, 1])
  })

  it('changeRole and removeMember update the list after the server agreed', async () => {
    vi.mocked(teamApi.listMembers).mockResolvedValue({ items: members, total: 2 })
    const team = useTeamStore()
    await team.fetchMembers()
    await team.changeRole(2, 'instructor')
    expect(team.members.find((m) => m.userId === 2)?.role).toBe('instructor')
    await team.removeMember(2)
    expect(team.members.map((m) => m.userId)).toEqual([1])
  })

  it('leaves the list alone when the server refuses a removal', async () => {
    vi.mocked(teamApi.listMembers).mockResolvedValue({ items: members, total: 2 })
    vi.mocked(teamApi.removeMember).mockRejectedValue(new Error('The last admin cannot leave'))
    const team = useTeamStore()
    await team.fetchMembers()
    await expect(team.removeMember(1)).rejects.toThrow('last admin')
    expect(team.members).toHaveLength(2)
  })
})
