import { createApp, watch } from 'vue'
import { createPinia } from 'pinia'
import { Dark, LocalStorage, Quasar } from 'quasar'
// The default APP_LOCALE's pack (date pickers, table labels); dates themselves come from src/dates.ts.
import lang from 'quasar/lang/en-GB.js'

// Fonts ship with the app (Latin subset only, to keep the bundle small); no font CDN. Three weights:
// 400 body, 500 buttons and subtitles, 600 headings; text set in 700 (strong words, the app's name)
// draws with the 600 face, the nearest heavier one the browser has (CSS font matching), so the first
// screen waits for three font files instead of four (issue 14).
import '@fontsource/roboto/latin-400.css'
import '@fontsource/roboto/latin-500.css'
import '@fontsource/roboto/latin-600.css'
import './css/quasar.sass'
import './css/app.sass'

import App from './App.vue'
import { iconSet } from './quasar-icon-set'
import { setUnauthenticatedHandler } from './api/http'
import { router } from './router'
import { preloadFirstData } from './router/first-data'
import { useAuthStore } from './stores/auth'
import { warmDateTables } from './dates'

// zod's documented `jitless` switch, set where zod reads it so the entry need not import zod: its
// test for `new Function` otherwise breaks the CSP (script-src 'self'), a console issue Lighthouse counts.
const zodGlobal = globalThis as { __zod_globalConfig?: Record<string, unknown> }
Object.assign((zodGlobal.__zod_globalConfig ??= {}), { jitless: true })

// The opened page's first answer downloads beside its code, not after it (issue 14).
preloadFirstData(location.pathname)

const app = createApp(App)

// Dialog and Notify are installed with the signed-in screens (src/signed-in.ts), not here: the public
// pages' first download stays small (issue 14).
app.use(Quasar, {
  plugins: { Dark, LocalStorage },
  iconSet,
  lang,
  config: {
    notify: { position: 'top', timeout: 5000 },
  },
})
app.use(createPinia())
app.use(router)

// ---- offline (crew-b): once someone is signed in, register the service worker and send the outbox at
// start, on `online` and after saves (src/signed-in.ts → offline/start-offline.ts) ----
const auth = useAuthStore()
watch(
  () => auth.user !== null,
  (signedIn) => {
    if (!signedIn) return
    warmDateTables()
    void import('./signed-in').then((m) => m.startSignedIn(app))
  },
  { immediate: true },
)

// A session that expires while a page is open sends the user to sign in and back again afterwards.
setUnauthenticatedHandler(() => {
  const current = router.currentRoute.value
  auth.setUser(null)
  if (!current.meta.public) void router.replace({ name: 'sign-in', query: { next: current.fullPath } })
})

app.mount('#app')
