import { EARTH_RADIUS_M } from './limits'

const RAD = Math.PI / 180

/**
 * Great-circle distance in metres by the haversine formula (R. W. Sinnott, "Virtues of the
 * Haversine", Sky and Telescope 68(2), 1984) on a sphere of the IUGG mean radius.
 */
export function haversineMetres(lat1: number, lng1: number, lat2: number, lng2: number): number {
  const sinDLat = Math.sin(((lat2 - lat1) * RAD) / 2)
  const sinDLng = Math.sin(((lng2 - lng1) * RAD) / 2)
  const a = sinDLat * sinDLat + Math.cos(lat1 * RAD) * Math.cos(lat2 * RAD) * sinDLng * sinDLng
  return 2 * EARTH_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(a)))
}

/** Unit vectors on the sphere: the chord between two of them gives the same great-circle distance
 * as haversine (central angle = 2·asin(chord/2)) with one asin and no other trigonometry per pair. */
export function unitVectors(lats: ArrayLike<number>, lngs: ArrayLike<number>): Float64Array {
  const n = lats.length
  const out = new Float64Array(3 * n)
  for (let i = 0; i < n; i++) {
    const phi = lats[i] * RAD
    const lambda = lngs[i] * RAD
    out[3 * i] = Math.cos(phi) * Math.cos(lambda)
    out[3 * i + 1] = Math.cos(phi) * Math.sin(lambda)
    out[3 * i + 2] = Math.sin(phi)
  }
  return out
}
