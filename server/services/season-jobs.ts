// What the planner needs of season work: a take-down is one job per site, on site for as long as its
// strings take to come down (the per-string minutes of SERVICE_MINUTES.take_down each).
import type { Db } from '../db'
import { UP_STATES } from './queue/season'

/** Strings still up at each of these sites. */
export async function stringsUpBySite(db: Db, siteIds: number[]): Promise<Map<number, number>> {
  if (!siteIds.length) return new Map()
  const rows: { siteId: number; n: number }[] = await db('strings')
    .whereIn('siteId', siteIds)
    .whereNull('archivedAt')
    .whereIn('seasonState', UP_STATES)
    .groupBy('siteId')
    .select('siteId', db.raw('count(*) as n'))
  return new Map(rows.map((r) => [r.siteId, Number(r.n)]))
}

/** Minutes on site for one queue item: a take-down's per-string minutes times the strings up there. */
export function seasonMinutes(
  kind: string,
  perString: number,
  siteId: number | null,
  up: Map<number, number>,
) {
  if (kind !== 'take_down' || !siteId) return perString
  return perString * Math.max(1, up.get(siteId) ?? 1)
}
