import type { z } from 'zod'
import type { queueItem, queueList, queueQuery, refreshResult } from '../../shared/schemas/queue'
import type { queueKinds } from '../../shared/vocab/queue'
import type { ReportClosedState } from '../../shared/vocab/reports'
import { http } from './http'

export { queueKindLabel, queueKinds } from '../../shared/vocab/queue'

export type QueueItem = z.infer<typeof queueItem>
export type QueueKind = (typeof queueKinds)[number]
export type QueueList = z.infer<typeof queueList>
export type QueueState = z.infer<typeof queueQuery>['state']
export type QueueFilter = {
  clientId?: number
  siteId?: number
  kind?: QueueKind
  crewId?: number
  state?: QueueState
}
export type RefreshResult = z.infer<typeof refreshResult>

export const queueApi = {
  list: (filter: QueueFilter = {}) => http.get<QueueList>('/queue', filter),
  refresh: () => http.post<RefreshResult>('/queue/refresh'),
  /** `until` is an ISO date-time with offset; the reason is required (3 characters or more). */
  snooze: (id: number, until: string, reason: string) =>
    http.post<void>(`/queue/${id}/snooze`, { until, reason }),
  /** Opens a snoozed item again now, before its time. */
  wake: (id: number) => http.post<{ id: number; state: 'open' }>(`/queue/${id}/wake`),
  /** Folds `ids` into `into`; the target keeps its place and counts the merged items. */
  merge: (into: number, ids: number[]) => http.post<void>('/queue/merge', { into, ids }),
  /** `reportState`, for a public-report item only: what the reporter's status page says now. */
  close: (id: number, reason: string, reportState?: ReportClosedState) =>
    http.post<void>(`/queue/${id}/close`, { reason, reportState }),
}
