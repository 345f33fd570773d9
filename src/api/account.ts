import type { MeDto, UnitSystem } from '@shared/types/api'
import { apiPatch, apiPost } from './client'

export interface UpdateAccountInput {
  name?: string
  units?: UnitSystem
}

export interface ChangePasswordInput {
  currentPassword: string
  newPassword: string
  endOtherSessions?: boolean
}

export function updateAccount(input: UpdateAccountInput): Promise<MeDto> {
  return apiPatch<MeDto>('/account', input)
}

export function changePassword(input: ChangePasswordInput): Promise<void> {
  return apiPost<void>('/account/password', input)
}

/** Makes another of the user's teams the current one; every team-scoped call then uses it. */
export function switchTeam(teamId: number): Promise<MeDto> {
  return apiPost<MeDto>('/account/team', { teamId })
}
