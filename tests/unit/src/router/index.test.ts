// @vitest-environment happy-dom
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import type { RouteLocationNormalized } from 'vue-router'
import type { MeDto, Role } from '@shared/types/api'
import * as authApi from '@/api/auth'
import { authGuard, router, safeRedirect } from '@/router/index'

vi.mock('@/api/auth')

const meWith = (role: Role): MeDto => ({
  id: 1,
  email: 'a@example.test',
  name: 'A',
  units: 'metric',
  currentTeamId: 1,
  teams: [{ id: 1, name: 'T', role }],
})
const to = (path: string) => router.resolve(path) as unknown as RouteLocationNormalized

beforeEach(() => {
  setActivePinia(createPinia())
  vi.resetAllMocks()
})

describe('authGuard', () => {
  it('sends a signed-out visitor to sign-in with the page to come back to', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(null)
    await expect(authGuard(to('/team/members?x=1'))).resolves.toEqual({
      name: 'sign-in',
      query: { redirect: '/team/members?x=1' },
    })
  })

  it('lets a signed-out visitor open public pages', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(null)
    await expect(authGuard(to('/accept-invite?token=abc'))).resolves.toBe(true)
    await expect(authGuard(to('/sign-in'))).resolves.toBe(true)
  })

  it('sends a signed-in user away from sign-in to the redirect target', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(meWith('pilot'))
    await expect(authGuard(to('/sign-in?redirect=/account'))).resolves.toBe('/account')
  })

  it('keeps non-admins out of the admin-only outbox', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(meWith('viewer'))
    await expect(authGuard(to('/dev/outbox'))).resolves.toEqual({ name: 'home' })
  })

  it('lets an admin into the outbox and a viewer onto the members list', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(meWith('admin'))
    await expect(authGuard(to('/dev/outbox'))).resolves.toBe(true)
    setActivePinia(createPinia())
    vi.mocked(authApi.getMe).mockResolvedValue(meWith('viewer'))
    await expect(authGuard(to('/team/members'))).resolves.toBe(true)
  })
})

describe('safeRedirect', () => {
  it('accepts in-app paths only', () => {
    expect(safeRedirect('/team/members')).toBe('/team/members')
    expect(safeRedirect('//evil.example')).toBe('/')
    expect(safeRedirect('https://evil.example')).toBe('/')
    expect(safeRedirect(undefined)).toBe('/')
  })
})
