import type { InviteDto, ListResult, MemberDto, Role } from '@shared/types/api'
import { apiDelete, apiGet, apiPatch, apiPost } from './client'

const BASE = '/teams/current'

export function listMembers(): Promise<ListResult<MemberDto>> {
  return apiGet<ListResult<MemberDto>>(`${BASE}/members`)
}

export function changeMemberRole(userId: number, role: Role): Promise<MemberDto> {
  return apiPatch<MemberDto>(`${BASE}/members/${userId}`, { role })
}

export function removeMember(userId: number): Promise<void> {
  return apiDelete(`${BASE}/members/${userId}`)
}

export function listInvites(): Promise<ListResult<InviteDto>> {
  return apiGet<ListResult<InviteDto>>(`${BASE}/invites`)
}

export function createInvite(email: string, role: Role): Promise<InviteDto> {
  return apiPost<InviteDto>(`${BASE}/invites`, { email, role })
}

export function revokeInvite(inviteId: number): Promise<void> {
  return apiDelete(`${BASE}/invites/${inviteId}`)
}
