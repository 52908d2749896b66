// What only the signed-in screens use, kept out of the first download of the public pages (sign-in,
// public fault report; issue 14): Quasar's Dialog and Notify plugins and the phone's outbox sender
// with the service worker. main.ts loads this module once someone is signed in; MainLayout.vue
// installs the plugins before any signed-in page runs, so `$q.dialog` and `Notify.create` are there.
import { getCurrentInstance, type App } from 'vue'
import { Dialog, Notify, type QVueGlobals } from 'quasar'
import { startOffline } from './offline/start-offline'
import { afterPaint } from './after-paint'

interface LatePlugin {
  install(opts: { $q: QVueGlobals; parentApp: App }): void
  __installed?: boolean
}

let offlineStarted = false

/** Installs Dialog and Notify into the running app once; safe to call again. */
export function installSignedInPlugins(app: App): void {
  const $q = app.config.globalProperties.$q
  for (const plugin of [Dialog, Notify] as unknown as LatePlugin[]) {
    if (plugin.__installed) continue
    plugin.install({ $q, parentApp: app })
    plugin.__installed = true
  }
}

/** For MainLayout.vue's setup: the plugins are there before any signed-in page's setup runs. */
export function useSignedInPlugins(): void {
  const app = getCurrentInstance()?.appContext.app
  if (app) installSignedInPlugins(app)
}

/** The plugins, then (once the first screen has drawn) the service worker and the outbox sender. */
export function startSignedIn(app: App): void {
  installSignedInPlugins(app)
  if (offlineStarted) return
  offlineStarted = true
  afterPaint(startOffline)
}
