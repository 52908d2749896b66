// The queue list in pages (issue 13 part 7): the filters of queueQuery plus a page, sorted and
// counted on the server so a supervisor's phone never loads thousands of items at once.
import { z } from 'zod'
import { queueList, queueQuery } from './queue'
import { QUEUE_PAGE_DEFAULT, QUEUE_PAGE_MAX } from '../vocab/queue'

export const queuePageQuery = queueQuery.extend({
  page: z.coerce.number().int().min(1, 'Pages count from 1.').default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1, 'A page holds at least 1 item.')
    .max(QUEUE_PAGE_MAX, `A page holds at most ${QUEUE_PAGE_MAX} items.`)
    .default(QUEUE_PAGE_DEFAULT),
})

export const queuePage = queueList.extend({
  /** Items under the filter, on every page. */
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
})
