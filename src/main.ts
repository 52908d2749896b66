import { createApp } from 'vue'
import { createPinia } from 'pinia'
import { Dark, Dialog, Loading, LocalStorage, Notify, Quasar } from 'quasar'
import iconSet from 'quasar/icon-set/svg-mdi-v7'
// The default APP_LOCALE's pack (date pickers, table labels); dates themselves come from src/dates.ts.
import lang from 'quasar/lang/en-GB.js'

// Fonts ship with the app (Latin subset only, to keep the bundle small); no font CDN.
import '@fontsource/roboto/latin-400.css'
import '@fontsource/roboto/latin-500.css'
import '@fontsource/roboto/latin-600.css'
import '@fontsource/roboto/latin-700.css'
import 'quasar/src/css/index.sass'
import './css/app.sass'

import App from './App.vue'
import { setUnauthenticatedHandler } from './api/http'
import { router } from './router'
import { useAuthStore } from './stores/auth'
// ---- offline (crew-b): service worker + outbox sender ----
import { startOffline } from './offline/start-offline'

const app = createApp(App)

app.use(Quasar, {
  plugins: { Notify, Dialog, Dark, LocalStorage, Loading },
  iconSet,
  lang,
  config: {
    notify: { position: 'top', timeout: 5000 },
    loading: { delay: 300 },
  },
})
app.use(createPinia())
app.use(router)

// ---- offline (crew-b): register the service worker; send the outbox at start, on `online`, after saves ----
startOffline()

// A session that expires while a page is open sends the user to sign in and back again afterwards.
setUnauthenticatedHandler(() => {
  const current = router.currentRoute.value
  useAuthStore().setUser(null)
  if (!current.meta.public) void router.replace({ name: 'sign-in', query: { next: current.fullPath } })
})

app.mount('#app')
