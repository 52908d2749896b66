// The facts the stop-progress rule reads (shared/stop-progress.ts), loaded for every stop of some
// saved runs in one query: the visits logged on each stop's string since its run was first published.
// A run row is created by its first publish; publishing again mid-shift (an emergency added) moves
// publishedAt but must not send finished stops back to "to do", so the row's creation is the start.
import type { Db } from '../db'
import { iso, isoOrNull } from '../../shared/iso-time'
import { stopState, type StopVisit } from '../../shared/stop-progress'
import type { StopProgress } from '../../shared/schemas/runs'

export interface ProgressStop {
  id: number
  runId: number
  stringId: number | null
  kind: string | null
  doneAt: unknown
  /** The stop's queue item state (null: no item). */
  itemState: string | null
}

/** Each stop's progress by its run_stops id; stops of runs never published have none. */
export async function stopProgressOf(
  db: Db,
  runs: { id: number; publishedAt: unknown; createdAt?: unknown }[],
  stops: ProgressStop[],
): Promise<Map<number, StopProgress>> {
  const since = new Map(
    runs.filter((r) => r.publishedAt).map((r) => [r.id, iso(r.createdAt ?? r.publishedAt)]),
  )
  const out = new Map<number, StopProgress>()
  if (!since.size) return out
  const stringIds = [...new Set(stops.map((s) => s.stringId).filter((id): id is number => !!id))]
  const earliest = [...since.values()].sort()[0]
  const rows = stringIds.length
    ? await db('visits')
        .whereIn('stringId', stringIds)
        .where('visitedAt', '>=', new Date(earliest))
        .orderBy(['visitedAt', 'id'])
        .select('stringId', 'visitedAt', 'statusAfter', 'lampsOutAfter', 'failedFound', 'darkOnArrival')
    : []
  const visits = rows.map((v) => ({
    stringId: v.stringId as number,
    at: iso(v.visitedAt),
    statusAfter: v.statusAfter,
    lampsOutAfter: v.lampsOutAfter as number,
    failedFound: v.failedFound as number,
    darkOnArrival: !!v.darkOnArrival,
  }))
  for (const s of stops) {
    const from = since.get(s.runId)
    if (!from) continue
    const mine: StopVisit[] = s.stringId
      ? visits.filter((v) => v.stringId === s.stringId && v.at >= from)
      : []
    out.set(
      s.id,
      stopState({
        kind: s.kind,
        doneAt: isoOrNull(s.doneAt),
        itemClosed: s.itemState === 'closed' || s.itemState === 'merged',
        visits: mine,
      }),
    )
  }
  return out
}
