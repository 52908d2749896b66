/// <reference types="vite-plugin-pwa/client" />
// The service worker (built by vite-plugin-pwa, generateSW) keeps the app shell and the last answers
// for the run, strings, config, basemap and session on the phone. It updates itself: a new build takes
// over on the next start, with nothing to click.
import { registerSW } from 'virtual:pwa-register'

/** Cache names, kept equal to the runtimeCaching entries in vite.config.ts. */
export const SW_CACHES = { api: 'lw-api', session: 'lw-session' } as const

export function registerServiceWorker(): void {
  if (!('serviceWorker' in navigator)) return
  registerSW({
    immediate: true,
    onRegisterError(err: unknown) {
      // Without the worker the app still runs online, and the outbox still queues in IndexedDB.
      console.warn('Service worker registration failed', err)
    },
  })
}

/** After sign-out the phone must not open the app offline as the previous user. */
export async function forgetSession(): Promise<void> {
  if (typeof caches === 'undefined') return
  await caches.delete(SW_CACHES.session)
}
