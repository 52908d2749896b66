import { Dark, LocalStorage } from 'quasar'
import { computed } from 'vue'
import type { Role } from '../api/auth'

const STORAGE_KEY = 'lw.theme'
type ThemeChoice = 'dark' | 'light'

// Browser chrome colour follows the page so the status bar does not flash white at night.
const THEME_COLOURS: Record<ThemeChoice, string> = { dark: '#15110D', light: '#FAF5EC' }

function paintChrome(): void {
  const meta = document.querySelector('meta[name="theme-color"]')
  meta?.setAttribute('content', THEME_COLOURS[Dark.isActive ? 'dark' : 'light'])
}

function savedChoice(): ThemeChoice | null {
  const value = LocalStorage.getItem(STORAGE_KEY)
  return value === 'dark' || value === 'light' ? value : null
}

/**
 * A remembered choice always wins. Without one, crews get the night theme (they work after dark),
 * everyone else the day theme, and a signed-out visitor follows the device setting.
 */
export function applyThemeDefault(role: Role | null): void {
  const saved = savedChoice()
  if (saved) Dark.set(saved === 'dark')
  else if (role) Dark.set(role === 'crew')
  else Dark.set(window.matchMedia?.('(prefers-color-scheme: dark)').matches ?? true)
  paintChrome()
}

export function useTheme() {
  const isDark = computed(() => Dark.isActive)

  function toggle(): void {
    Dark.set(!Dark.isActive)
    LocalStorage.set(STORAGE_KEY, Dark.isActive ? 'dark' : 'light')
    paintChrome()
  }

  return { isDark, toggle }
}
