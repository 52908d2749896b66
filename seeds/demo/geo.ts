// Local metres ↔ degrees around the invented town's centre (equirectangular; fine over a few km).
export const CENTRE = { lat: 54.035, lng: -2.3 }
const M_PER_DEG_LAT = 111_320

export function toLatLng(x: number, y: number, centre = CENTRE): { lat: number; lng: number } {
  const lat = centre.lat + y / M_PER_DEG_LAT
  const lng = centre.lng + x / (M_PER_DEG_LAT * Math.cos((centre.lat * Math.PI) / 180))
  return { lat: Math.round(lat * 1e6) / 1e6, lng: Math.round(lng * 1e6) / 1e6 }
}

/** Points every `step` metres along a polyline of [x, y] metres, with the direction there. */
export function along(path: [number, number][], step: number, offset = step / 2) {
  const out: { x: number; y: number; dx: number; dy: number }[] = []
  let carry = offset
  for (let i = 0; i < path.length - 1; i++) {
    const [x0, y0] = path[i]
    const [x1, y1] = path[i + 1]
    const len = Math.hypot(x1 - x0, y1 - y0)
    const dx = (x1 - x0) / len
    const dy = (y1 - y0) / len
    let d = carry
    for (; d <= len; d += step) out.push({ x: x0 + dx * d, y: y0 + dy * d, dx, dy })
    carry = d - len
  }
  return out
}

/** A small deterministic PRNG (mulberry32) so the demo town is the same on every start. */
export function rng(seed: number) {
  let a = seed >>> 0
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
  return {
    next,
    int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)],
    chance: (p: number) => next() < p,
  }
}
export type Rng = ReturnType<typeof rng>
