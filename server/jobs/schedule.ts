// Scheduled work inside the server process: the queue (and the forecasts it needs) every 10 minutes.
import type { Db } from '../db'
import { logger } from '../logger'
import { refreshQueue } from './refresh-queue'

export const QUEUE_REFRESH_MS = 10 * 60_000

export function startJobs(db: Db): () => void {
  let running = false
  const tick = async () => {
    if (running) return
    running = true
    try {
      const r = await refreshQueue(db)
      logger.info(r, 'queue refreshed')
    } catch (err) {
      logger.error({ err }, 'queue refresh failed')
    } finally {
      running = false
    }
  }
  const timer = setInterval(tick, QUEUE_REFRESH_MS)
  timer.unref()
  void tick()
  return () => clearInterval(timer)
}
