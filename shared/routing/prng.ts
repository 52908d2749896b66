/**
 * Small seeded generator (mulberry32, T. Ettinger, public domain) so that the same request always
 * gives the same tour; Math.random would make answers differ between calls.
 */
export function createRandom(seed: number): () => number {
  let state = seed >>> 0
  return () => {
    state = (state + 0x6d2b79f5) >>> 0
    let t = state
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Integer in [0, bound). */
export function randomInt(random: () => number, bound: number): number {
  return Math.floor(random() * bound)
}
