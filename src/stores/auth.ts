import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { authApi, type SessionUser } from '../api/auth'
import { isApiError } from '../api/http'

// The session lives in an httpOnly cookie the client cannot read, so "who am I" always comes
// from GET /auth/session (`user: null` when signed out, never a 401 in the console). `ensureLoaded`
// runs that once per page load and every guard awaits it.
export const useAuthStore = defineStore('auth', () => {
  const user = ref<SessionUser | null>(null)
  const loaded = ref(false)
  // Set when /me failed for a reason other than "not signed in", e.g. the server is unreachable.
  const loadError = ref<string | null>(null)
  let pending: Promise<void> | null = null

  const role = computed(() => user.value?.role ?? null)
  const isSignedIn = computed(() => user.value !== null)

  async function fetchMe(): Promise<void> {
    try {
      user.value = (await authApi.session()).user
      loadError.value = null
    } catch (err) {
      user.value = null
      // A server older than /auth/session may still answer 401 for "not signed in".
      loadError.value = isApiError(err) && err.status === 401 ? null : String((err as Error).message)
    } finally {
      loaded.value = true
    }
  }

  function ensureLoaded(): Promise<void> {
    pending ??= fetchMe()
    return pending
  }

  async function signIn(email: string, password: string): Promise<SessionUser> {
    const res = await authApi.signIn(email, password)
    setUser(res.user)
    return res.user
  }

  async function acceptInvite(token: string, password: string): Promise<SessionUser> {
    const res = await authApi.acceptInvite(token, password)
    setUser(res.user)
    return res.user
  }

  async function changePassword(currentPassword: string, newPassword: string): Promise<void> {
    const res = await authApi.changePassword(currentPassword, newPassword)
    setUser(res.user)
  }

  async function signOut(): Promise<void> {
    try {
      await authApi.signOut()
    } catch {
      // The server ends the session everywhere (token version). Offline, forget the user locally
      // anyway; the cookie then expires on its own.
    }
    user.value = null
  }

  function setUser(next: SessionUser | null): void {
    user.value = next
    loaded.value = true
    loadError.value = null
    pending = Promise.resolve()
  }

  return {
    user,
    role,
    loaded,
    loadError,
    isSignedIn,
    ensureLoaded,
    signIn,
    acceptInvite,
    changePassword,
    signOut,
    setUser,
  }
})
