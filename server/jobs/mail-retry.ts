// Retries mail whose sending failed (backoff in server/mail/outbox.ts), and picks up messages a
// stopped process left claimed. Safe in several processes at once: each row is claimed by one UPDATE.
import type { Mailer } from '../mail/mailer'
import type { DeliveryRound } from '../mail/outbox'
import { logger } from '../logger'

/** Every minute: the shortest wait between attempts is one minute. */
export const MAIL_RETRY_MS = 60_000

/** One round: every due message is attempted once. The mailer's clock decides what is due. */
export async function retryMail(mailer: Mailer): Promise<DeliveryRound> {
  return (await mailer.deliverDue?.()) ?? { sent: 0, retrying: 0, failed: 0 }
}

/** Runs `retryMail` every minute inside the server; returns the stop function. */
export function startMailRetry(mailer: Mailer, everyMs = MAIL_RETRY_MS): () => void {
  let running = false
  const tick = async () => {
    if (running) return
    running = true
    try {
      const r = await retryMail(mailer)
      if (r.sent || r.retrying || r.failed) logger.info(r, 'mail retried')
      if (r.failed) logger.warn({ failed: r.failed }, 'mail: messages failed for good (see Mail outbox)')
    } catch (err) {
      logger.error({ err }, 'mail retry failed')
    } finally {
      running = false
    }
  }
  const timer = setInterval(tick, everyMs)
  timer.unref()
  return () => clearInterval(timer)
}
