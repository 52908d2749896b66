// Which register columns a manager sees on a desktop: their own choice, kept in this browser's
// LocalStorage, so the table fits the screen they use. The default fits a 1,440 px screen with the
// side menu open; the tag is always shown (it opens the string).
import { ref, watch } from 'vue'

export const REGISTER_COLUMNS = [
  { name: 'assetTag', label: 'Tag', required: true },
  { name: 'name', label: 'Name' },
  { name: 'status', label: 'State' },
  { name: 'seasonState', label: 'Season' },
  { name: 'lampsOut', label: 'Lamps out' },
  { name: 'type', label: 'Type' },
  { name: 'site', label: 'Site' },
  { name: 'client', label: 'Client' },
  { name: 'circuit', label: 'Circuit' },
  { name: 'structure', label: 'Structure' },
  { name: 'installedOn', label: 'Installed' },
  { name: 'lastVisitAt', label: 'Last visit' },
  { name: 'forecastDarkAt', label: 'Forecast dark' },
] as const

export type RegisterColumn = (typeof REGISTER_COLUMNS)[number]['name']

export const DEFAULT_COLUMNS: RegisterColumn[] = [
  'assetTag',
  'name',
  'status',
  'lampsOut',
  'type',
  'site',
  'lastVisitAt',
]

export const COLUMNS_KEY = 'lw.register.columns'
const known = new Set<string>(REGISTER_COLUMNS.map((c) => c.name))

/** The saved choice, or the default when nothing (or nothing readable) is saved. */
export function readColumns(storage: Pick<Storage, 'getItem'> | undefined): RegisterColumn[] {
  try {
    const saved: unknown = JSON.parse(storage?.getItem(COLUMNS_KEY) ?? 'null')
    if (!Array.isArray(saved)) return [...DEFAULT_COLUMNS]
    const names = saved.filter((n): n is RegisterColumn => typeof n === 'string' && known.has(n))
    return names.includes('assetTag') ? names : ['assetTag', ...names]
  } catch {
    return [...DEFAULT_COLUMNS]
  }
}

export function useRegisterColumns() {
  const storage = typeof localStorage === 'undefined' ? undefined : localStorage
  const visible = ref<RegisterColumn[]>(readColumns(storage))
  watch(visible, (names) => storage?.setItem(COLUMNS_KEY, JSON.stringify(names)), { deep: true })
  const reset = () => (visible.value = [...DEFAULT_COLUMNS])
  return { visible, reset }
}
