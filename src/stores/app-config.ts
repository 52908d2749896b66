import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { configApi, type AppConfig } from '../api/config'
import { setDateSettings } from '../dates'
import { applyLocale } from '../locale-packs'
import { DEFAULT_LOCALE, DEFAULT_TIME_ZONE } from '../../shared/local-time'

const FALLBACK: AppConfig = {
  appName: 'Lampwright',
  demoMode: false,
  demoAccounts: [],
  demoPassword: null,
  tiles: { url: null, attribution: '', maxZoom: 20, local: true },
  mailOutbox: false,
  basemap: { kind: 'none', url: null },
  timeZone: DEFAULT_TIME_ZONE,
  locale: DEFAULT_LOCALE,
  publicUrl: null,
}

// Public server settings (demo mode, map tiles, mail fake), fetched once per page load.
export const useAppConfigStore = defineStore('app-config', () => {
  const config = ref<AppConfig>(FALLBACK)
  const loaded = ref(false)
  let pending: Promise<void> | null = null

  const appName = computed(() => config.value.appName || 'Lampwright')
  const showMail = computed(() => config.value.demoMode && config.value.mailOutbox)
  /** The base of links meant to leave this screen (printed labels): PUBLIC_URL, else this page's origin. */
  const linkBase = computed(() => config.value.publicUrl ?? window.location.origin)

  async function fetchConfig(): Promise<void> {
    try {
      config.value = { ...FALLBACK, ...(await configApi.get()) }
      setDateSettings(config.value)
      await applyLocale(config.value.locale)
    } catch {
      // Without config the app still works; demo helpers simply stay hidden.
      pending = null
    } finally {
      loaded.value = true
    }
  }

  function ensureLoaded(): Promise<void> {
    pending ??= fetchConfig()
    return pending
  }

  return { config, loaded, appName, showMail, linkBase, ensureLoaded }
})
