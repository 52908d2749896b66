import { z } from 'zod'

/** Mail that has not arrived: waiting for another attempt (`queued` after a failure) or failed for good. */
export const outboxMessage = z.object({
  id: z.number().int(),
  to: z.string(),
  subject: z.string(),
  topic: z.string().nullable(),
  state: z.enum(['queued', 'sending', 'sent', 'failed']),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string().nullable(),
  lastAttemptAt: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
})
export type OutboxMessage = z.infer<typeof outboxMessage>
export const outboxList = z.object({ items: z.array(outboxMessage) })
export const outboxMessageResponse = z.object({ message: outboxMessage })
