import { beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import type { MeDto } from '@shared/types/api'
import * as authApi from '@/api/auth'
import * as accountApi from '@/api/account'
import { ApiError } from '@/api/client'
import { useAuthStore } from '@/stores/auth'

vi.mock('@/api/auth')
vi.mock('@/api/account')

const ME: MeDto = {
  id: 7,
  email: 'ada@example.test',
  name: 'Ada',
  units: 'imperial',
  currentTeamId: 1,
  teams: [
    { id: 1, name: 'Heron Moor', role: 'admin' },
    { id: 2, name: 'Ridge Crew', role: 'viewer' },
  ],
}

beforeEach(() => {
  setActivePinia(createPinia())
  vi.resetAllMocks()
})

describe('useAuthStore', () => {
  it('starts signed out and not loaded', () => {
    const auth = useAuthStore()
    expect([auth.isSignedIn, auth.loaded, auth.role, auth.units]).toEqual([false, false, null, 'metric'])
  })

  it('fetchMe stores the user and derives role, team and permissions from the current team', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(ME)
    const auth = useAuthStore()
    await auth.fetchMe()
    expect(auth.loaded).toBe(true)
    expect(auth.currentTeam?.name).toBe('Heron Moor')
    expect([auth.role, auth.isAdmin, auth.canWrite, auth.canInvite]).toEqual(['admin', true, true, true])
    expect(auth.units).toBe('imperial')
  })

  it('fetchMe with nobody signed in leaves me null but marks loaded', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(null)
    const auth = useAuthStore()
    await auth.fetchMe()
    expect([auth.isSignedIn, auth.loaded]).toEqual([false, true])
  })

  it('ensureLoaded asks the server only once', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(ME)
    const auth = useAuthStore()
    await auth.ensureLoaded()
    await auth.ensureLoaded()
    expect(authApi.getMe).toHaveBeenCalledTimes(1)
  })

  it('switchTeam takes the new MeDto, so a viewer team makes the user read-only', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(ME)
    vi.mocked(accountApi.switchTeam).mockResolvedValue({ ...ME, currentTeamId: 2 })
    const auth = useAuthStore()
    await auth.fetchMe()
    await auth.switchTeam(2)
    expect(accountApi.switchTeam).toHaveBeenCalledWith(2)
    expect([auth.role, auth.canWrite, auth.isAdmin, auth.canInvite]).toEqual(['viewer', false, false, false])
  })

  it('an instructor may invite but is not an admin', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue({ ...ME, teams: [{ id: 1, name: 'T', role: 'instructor' }] })
    const auth = useAuthStore()
    await auth.fetchMe()
    expect([auth.canWrite, auth.canInvite, auth.isAdmin]).toEqual([true, true, false])
  })

  it('signIn stores the user; a wrong password rejects and leaves nobody signed in', async () => {
    const auth = useAuthStore()
    vi.mocked(authApi.signIn).mockRejectedValueOnce(new ApiError(401, 'UNAUTHENTICATED', 'Wrong e-mail or password'))
    await expect(auth.signIn({ email: 'ada@example.test', password: 'nope' })).rejects.toThrow('Wrong e-mail')
    expect(auth.isSignedIn).toBe(false)
    expect(auth.loading).toBe(false)
    vi.mocked(authApi.signIn).mockResolvedValueOnce(ME)
    await auth.signIn({ email: 'ada@example.test', password: 'correct horse' })
    expect(auth.me?.name).toBe('Ada')
  })

  it('signUp stores the new admin', async () => {
    vi.mocked(authApi.signUp).mockResolvedValue(ME)
    const auth = useAuthStore()
    const input = { email: 'ada@example.test', name: 'Ada', password: 'long enough', teamName: 'Heron Moor' }
    await auth.signUp(input)
    expect(authApi.signUp).toHaveBeenCalledWith(input)
    expect(auth.isAdmin).toBe(true)
  })

  it('signOut forgets the user even when the server call fails', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(ME)
    vi.mocked(authApi.signOut).mockRejectedValue(new ApiError(0, 'UNAVAILABLE', 'offline'))
    const auth = useAuthStore()
    await auth.fetchMe()
    await expect(auth.signOut()).rejects.toThrow('offline')
    expect(auth.isSignedIn).toBe(false)
  })

  it('updateAccount replaces me with the server answer', async () => {
    vi.mocked(authApi.getMe).mockResolvedValue(ME)
    vi.mocked(accountApi.updateAccount).mockResolvedValue({ ...ME, name: 'Ada L.', units: 'metric' })
    const auth = useAuthStore()
    await auth.fetchMe()
    await auth.updateAccount({ name: 'Ada L.', units: 'metric' })
    expect([auth.me?.name, auth.units]).toEqual(['Ada L.', 'metric'])
  })

  it('acceptInvite signs the new member in', async () => {
    vi.mocked(authApi.acceptInvite).mockResolvedValue({ ...ME, teams: [{ id: 1, name: 'T', role: 'viewer' }] })
    const auth = useAuthStore()
    await auth.acceptInvite({ token: 'x'.repeat(40), name: 'Bo', password: 'long enough' })
    expect([auth.isSignedIn, auth.role]).toEqual([true, 'viewer'])
  })
})
