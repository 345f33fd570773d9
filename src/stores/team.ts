import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import type { InviteDto, MemberDto, Role } from '@shared/types/api'
import * as teamApi from '@/api/team'

/** Members and pending invites of the signed-in user's current team. */
export const useTeamStore = defineStore('team', () => {
  const members = ref<MemberDto[]>([])
  const invites = ref<InviteDto[]>([])
  const loading = ref(false)

  async function fetchMembers(): Promise<void> {
    loading.value = true
    try {
      members.value = (await teamApi.listMembers()).items
    } finally {
      loading.value = false
    }
  }

  async function fetchInvites(): Promise<void> {
    // accepted invites are history, not something to act on
    invites.value = (await teamApi.listInvites()).items.filter((i) => i.acceptedAt === null)
  }

  async function invite(email: string, role: Role): Promise<InviteDto> {
    const created = await teamApi.createInvite(email, role)
    invites.value = [created, ...invites.value.filter((i) => i.id !== created.id)]
    return created
  }

  async function revokeInvite(inviteId: number): Promise<void> {
    await teamApi.revokeInvite(inviteId)
    invites.value = invites.value.filter((i) => i.id !== inviteId)
  }

  async function changeRole(userId: number, role: Role): Promise<void> {
    await teamApi.changeMemberRole(userId, role)
    members.value = members.value.map((m) => (m.userId === userId ? { ...m, role } : m))
  }

  async function removeMember(userId: number): Promise<void> {
    await teamApi.removeMember(userId)
    members.value = members.value.filter((m) => m.userId !== userId)
  }

  /** Drops everything, e.g. after a team switch or sign-out. */
  function reset(): void {
    members.value = []
    invites.value = []
  }

  return {
    members,
    invites,
    loading,
    fetchMembers,
    fetchInvites,
    invite,
    revokeInvite,
    changeRole,
    removeMember,
    reset,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useTeamStore, import.meta.hot))
