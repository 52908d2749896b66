import type { QueueItem } from '../../api/queue'

export { DEFAULT_TOP_N } from '../../../shared/routing/limits'

/** The first `n` items (already ranked by score) that have a place a crew can drive to. */
export function topItems(items: QueueItem[], n: number): number[] {
  return items
    .filter((i) => i.lat !== null && i.lng !== null)
    .slice(0, n)
    .map((i) => i.id)
}

/** `?items=3,1,2` from the queue page, as ids in that order without repeats. */
export function idsFromQuery(raw: unknown): number[] {
  const text = Array.isArray(raw) ? raw.join(',') : typeof raw === 'string' ? raw : ''
  return [...new Set(text.split(',').map(Number))].filter((n) => Number.isInteger(n) && n > 0)
}
