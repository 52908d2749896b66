import { ref, shallowRef } from 'vue'
import { isApiError } from '../../api/http'
import { stringsApi, type MapItem } from '../../api/strings'
import { distanceM, useGeolocation, type Position } from '../../composables/use-geolocation'

export const NEAR_RADIUS_M = 500
const NEAR_LIST = 10
// Metres in one degree of latitude (mean, WGS 84: 111.32 km).
const M_PER_DEG_LAT = 111320

/** "Near me": the device position and the closest strings within NEAR_RADIUS_M. */
export function useNearby() {
  const geo = useGeolocation()
  const nearby = shallowRef<{ item: MapItem; metres: number }[] | null>(null)
  const geoError = ref<string | null>(null)
  const nearLoading = ref(false)

  async function findNearby(): Promise<Position | null> {
    geoError.value = null
    const pos = await geo.locate()
    if (!pos) {
      geoError.value = geo.error.value
      return null
    }
    const dLat = NEAR_RADIUS_M / M_PER_DEG_LAT
    const dLng = dLat / Math.max(0.01, Math.cos((pos.lat * Math.PI) / 180))
    nearLoading.value = true
    try {
      const res = await stringsApi.inBox([pos.lng - dLng, pos.lat - dLat, pos.lng + dLng, pos.lat + dLat])
      nearby.value = res.items
        .map((item) => ({ item, metres: distanceM(pos, item) }))
        .filter((n) => n.metres <= NEAR_RADIUS_M)
        .sort((a, b) => a.metres - b.metres)
        .slice(0, NEAR_LIST)
    } catch (err) {
      geoError.value = isApiError(err) ? err.message : 'Could not load the strings near you. Try again.'
    } finally {
      nearLoading.value = false
    }
    return pos
  }

  return { here: geo.position, locating: geo.locating, nearby, geoError, nearLoading, findNearby }
}
