import { LocalStorage } from 'quasar'

export { REF_PATTERN } from '../../../shared/report-rules'

/** Accepts what people type: lower case, spaces, a missing dash or prefix ("lw 7k3qd", "7K3QD"). */
export function normaliseRef(typed: string): string {
  const bare = typed.toUpperCase().replace(/[^0-9A-Z]/g, '')
  const code = bare.startsWith('LW') && bare.length === 7 ? bare.slice(2) : bare
  return `LW-${code}`
}

/** A point from the device, rounded; accuracy in metres as the phone reports it. */
export interface Place {
  lat: number
  lng: number
  accuracy: number | null
}

// References this device sent, so someone checking later need not have written theirs down.
const KEY = 'lw.reports'
const KEEP = 5

export function rememberedRefs(): string[] {
  const saved = LocalStorage.getItem(KEY)
  return Array.isArray(saved) ? saved.filter((r): r is string => typeof r === 'string') : []
}

export function rememberRef(ref: string): void {
  LocalStorage.set(KEY, [ref, ...rememberedRefs().filter((r) => r !== ref)].slice(0, KEEP))
}
