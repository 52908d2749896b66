// The queue one page at a time (GET /queue with page and pageSize; shared/schemas/queue-page.ts).
import type { z } from 'zod'
import type { queuePage } from '../../shared/schemas/queue-page'
import { http } from './http'
import type { QueueFilter } from './queue'

export { QUEUE_PAGE_DEFAULT, QUEUE_PAGE_MAX } from '../../shared/vocab/queue'

export type QueuePage = z.infer<typeof queuePage>

export const queuePageApi = {
  list: (filter: QueueFilter & { page: number; pageSize: number }, signal?: AbortSignal) =>
    http.get<QueuePage>('/queue', filter, signal),
}
