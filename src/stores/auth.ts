import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { MeDto, Role, TeamRef, UnitSystem } from '@shared/types/api'
import type { SignInInput, SignUpInput } from '@shared/schemas/auth'
import * as authApi from '@/api/auth'
import * as accountApi from '@/api/account'
import { setUnauthenticatedHandler } from '@/api/client'

/** Roles that may create and edit courses, setups and flights. */
export const WRITER_ROLES: readonly Role[] = ['admin', 'instructor', 'pilot']
/** Roles that may send invites (instructors: viewers only). */
export const INVITER_ROLES: readonly Role[] = ['admin', 'instructor']

export const useAuthStore = defineStore('auth', () => {
  const me = ref<MeDto | null>(null)
  /** True once the first fetchMe answered, so guards know whether "nobody" is final. */
  const loaded = ref(false)
  const loading = ref(false)

  const isSignedIn = computed(() => me.value !== null)
  const currentTeam = computed<TeamRef | null>(
    () => me.value?.teams.find((t) => t.id === me.value?.currentTeamId) ?? null,
  )
  const role = computed<Role | null>(() => currentTeam.value?.role ?? null)
  const isAdmin = computed(() => role.value === 'admin')
  const canWrite = computed(() => role.value !== null && WRITER_ROLES.includes(role.value))
  const canInvite = computed(() => role.value !== null && INVITER_ROLES.includes(role.value))
  const units = computed<UnitSystem>(() => me.value?.units ?? 'metric')

  async function track<T>(work: () => Promise<T>): Promise<T> {
    loading.value = true
    try {
      return await work()
    } finally {
      loading.value = false
    }
  }

  async function fetchMe(): Promise<MeDto | null> {
    return track(async () => {
      try {
        me.value = await authApi.getMe()
        return me.value
      } finally {
        loaded.value = true
      }
    })
  }

  async function ensureLoaded(): Promise<void> {
    if (!loaded.value) await fetchMe()
  }

  const signIn = (input: SignInInput) =>
    track(async () => (me.value = await authApi.signIn(input)))
  const signUp = (input: SignUpInput) =>
    track(async () => (me.value = await authApi.signUp(input)))
  const acceptInvite = (input: authApi.AcceptInviteInput) =>
    track(async () => (me.value = await authApi.acceptInvite(input)))

  async function signOut(): Promise<void> {
    await track(async () => {
      try {
        await authApi.signOut()
      } finally {
        me.value = null
      }
    })
  }

  const updateAccount = (input: accountApi.UpdateAccountInput) =>
    track(async () => (me.value = await accountApi.updateAccount(input)))
  const changePassword = (input: accountApi.ChangePasswordInput) =>
    track(() => accountApi.changePassword(input))
  const switchTeam = (teamId: number) =>
    track(async () => (me.value = await accountApi.switchTeam(teamId)))

  // signed-out flows: no state of their own, but views reach the API only through stores
  const requestPasswordReset = (email: string) => authApi.requestPasswordReset(email)
  const resetPassword = (token: string, password: string) => authApi.resetPassword(token, password)
  const previewInvite = (token: string) => authApi.previewInvite(token)

  /** Forgets the user locally, e.g. when the server says the session ended (401). */
  function clear(): void {
    me.value = null
  }
  // any later 401 outside /auth/ means the session ended (expired, or signed out elsewhere)
  setUnauthenticatedHandler(clear)

  return {
    me,
    loaded,
    loading,
    isSignedIn,
    currentTeam,
    role,
    isAdmin,
    canWrite,
    canInvite,
    units,
    fetchMe,
    ensureLoaded,
    signIn,
    signUp,
    acceptInvite,
    signOut,
    updateAccount,
    changePassword,
    switchTeam,
    requestPasswordReset,
    resetPassword,
    previewInvite,
    clear,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useAuthStore, import.meta.hot))
