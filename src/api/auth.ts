import type { MeDto, Role } from '@shared/types/api'
import type { SignInInput, SignUpInput } from '@shared/schemas/auth'
import { ApiError, apiGet, apiPost, resetCsrfToken } from './client'

/** What an invite link offers, shown before the invitee accepts. */
export interface InvitePreviewDto {
  email: string
  teamName: string
  role: Role
  existingUser: boolean
}

export interface AcceptInviteInput {
  token: string
  name?: string
  password?: string
}

/** The signed-in user, or null when nobody is signed in (401). */
export async function getMe(): Promise<MeDto | null> {
  try {
    return await apiGet<MeDto>('/auth/me')
  } catch (e) {
    if (e instanceof ApiError && e.status === 401) return null
    throw e
  }
}

export async function signIn(input: SignInInput): Promise<MeDto> {
  const me = await apiPost<MeDto>('/auth/sign-in', input)
  resetCsrfToken() // the session was regenerated, so is the token
  return me
}

export async function signUp(input: SignUpInput): Promise<MeDto> {
  const me = await apiPost<MeDto>('/auth/sign-up', input)
  resetCsrfToken()
  return me
}

export async function signOut(): Promise<void> {
  try {
    await apiPost<void>('/auth/sign-out')
  } finally {
    resetCsrfToken()
  }
}

export function requestPasswordReset(email: string): Promise<{ message: string }> {
  return apiPost<{ message: string }>('/auth/forgot-password', { email })
}

export function resetPassword(token: string, password: string): Promise<void> {
  return apiPost<void>('/auth/reset-password', { token, password })
}

export function previewInvite(token: string): Promise<InvitePreviewDto> {
  return apiGet<InvitePreviewDto>(`/invites/preview?token=${encodeURIComponent(token)}`)
}

export async function acceptInvite(input: AcceptInviteInput): Promise<MeDto> {
  const me = await apiPost<MeDto>('/invites/accept', input)
  resetCsrfToken()
  return me
}
