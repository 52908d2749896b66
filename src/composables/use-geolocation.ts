import { ref, shallowRef } from 'vue'

export interface Position {
  lat: number
  lng: number
  /** metres, 95 % radius as reported by the device */
  accuracy: number
}

// Messages a crew member can act on: what went wrong and what to do instead.
const MESSAGES: Record<number, string> = {
  1: 'Location is blocked for Lampwright. Allow it in the browser or phone settings, or search by tag or street instead.',
  2: 'This device could not find its position. Step outside or away from tall buildings and try again, or search by tag or street.',
  3: 'Finding your position took too long. Try again, or search by tag or street.',
}

/** One-shot position fix: `locate()` resolves with the position, or null with `error` set. */
export function useGeolocation() {
  const position = shallowRef<Position | null>(null)
  const error = ref<string | null>(null)
  const locating = ref(false)

  function locate(): Promise<Position | null> {
    error.value = null
    if (!('geolocation' in navigator)) {
      error.value = 'This browser cannot share its location. Search by tag or street instead.'
      return Promise.resolve(null)
    }
    locating.value = true
    return new Promise((resolve) => {
      navigator.geolocation.getCurrentPosition(
        (p) => {
          locating.value = false
          position.value = { lat: p.coords.latitude, lng: p.coords.longitude, accuracy: p.coords.accuracy }
          resolve(position.value)
        },
        (e) => {
          locating.value = false
          error.value = MESSAGES[e.code] ?? e.message
          resolve(null)
        },
        // A fix up to a minute old is fine for "which strings are near me"; waiting longer drains batteries.
        { enableHighAccuracy: true, timeout: 15000, maximumAge: 60000 },
      )
    })
  }

  return { position, error, locating, locate }
}

/** Great-circle distance in metres (haversine, mean Earth radius 6 371 km: IUGG). */
export function distanceM(a: { lat: number; lng: number }, b: { lat: number; lng: number }): number {
  const rad = Math.PI / 180
  const dLat = (b.lat - a.lat) * rad
  const dLng = (b.lng - a.lng) * rad
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(dLng / 2) ** 2
  return 2 * 6371000 * Math.asin(Math.min(1, Math.sqrt(h)))
}
