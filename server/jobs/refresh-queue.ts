// The scheduled queue refresh: new forecasts, then the queue rules (server/services/queue/) over
// everything. The server runs it every 10 minutes; tests and POST /queue/refresh call it directly.
import type { Db } from '../db'
import { rebuildQueue } from '../services/queue/rebuild'
import { refreshForecasts } from './refresh-forecasts'

export async function refreshQueue(db: Db, now = new Date()) {
  return rebuildQueue(db, await refreshForecasts(db, now), now)
}
