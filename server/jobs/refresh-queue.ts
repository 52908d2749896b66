// The scheduled queue refresh: new forecasts where their inputs changed (or they grew old), every
// forecast rule re-judged from the stored curves, then the queue rules (server/services/queue/) over
// what is out of step. The server runs it every 10 minutes and soon after a visit; tests and
// POST /queue/refresh call it directly. `full: true` forecasts every string and syncs every item.
import type { Db } from '../db'
import { rebuildQueue } from '../services/queue/rebuild'
import { refreshForecasts, type RefreshOptions } from './refresh-forecasts'

export async function refreshQueue(db: Db, now = new Date(), o: RefreshOptions = {}) {
  const fc = await refreshForecasts(db, now, o)
  const queue = await rebuildQueue(db, fc.risks, now, o)
  return { ...queue, forecasts: fc.forecasts, judged: fc.judged }
}
