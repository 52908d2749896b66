// Called once from main.ts: the service worker, and the outbox sender (at start, on `online`, after
// each save, when the app comes back to the foreground).
import { watch } from 'vue'
import { API_BASE } from '../api/http'
import { useAuthStore } from '../stores/auth'
import { useOutboxStore } from '../stores/outbox'
import { forgetSession, registerServiceWorker } from './register-sw'

/**
 * Asks for the session once through the service worker, so its cache holds it. Sign-in itself never
 * calls /auth/session, and the very first visit runs before the worker controls the page: without this a
 * crew who signs in and loses signal straight away could not reopen the app.
 */
async function warmSessionCache(): Promise<void> {
  if (!('serviceWorker' in navigator) || !navigator.onLine) return
  await navigator.serviceWorker.ready
  if (!navigator.serviceWorker.controller) return
  await fetch(`${API_BASE}/auth/session`, {
    credentials: 'include',
    headers: { Accept: 'application/json' },
  }).catch(() => undefined)
}

export function startOffline(): void {
  registerServiceWorker()
  useOutboxStore().start()
  const auth = useAuthStore()
  watch(
    () => auth.user?.id ?? null,
    (id, before) => {
      if (id) void warmSessionCache()
      else if (before) void forgetSession()
    },
    { immediate: true },
  )
  navigator.serviceWorker?.addEventListener('controllerchange', () => {
    if (auth.user) void warmSessionCache()
  })
}
