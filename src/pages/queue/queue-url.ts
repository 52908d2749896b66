// The queue's filters and page live in the address (issue 13 part 7, issue 14), so a supervisor can
// share or bookmark a view and the back button returns to it. Only values other than the defaults
// are written; anything unknown in the address falls back to the default.
import type { LocationQuery, LocationQueryRaw } from 'vue-router'
import { queueKinds, type QueueKind } from '../../api/queue'
import type { QueueFilterModel } from '../../components/queue/queue-format'

const STATES = ['open', 'snoozed', 'closed', 'all'] as const

export interface QueueView {
  filter: QueueFilterModel
  page: number
}

const one = (v: LocationQuery[string]) => (Array.isArray(v) ? v[0] : v) ?? null

function positiveInt(v: LocationQuery[string]): number | null {
  const s = one(v)
  return s !== null && /^[1-9]\d{0,9}$/.test(s) ? Number(s) : null
}

export function defaultQueueFilter(): QueueFilterModel {
  return { state: 'open', kind: null, clientId: null, siteId: null, crewId: null }
}

export function queueViewFromQuery(q: LocationQuery): QueueView {
  const state = one(q.state)
  const kind = one(q.kind)
  return {
    filter: {
      state: STATES.includes(state as (typeof STATES)[number])
        ? (state as QueueFilterModel['state'])
        : 'open',
      kind: queueKinds.includes(kind as QueueKind) ? (kind as QueueKind) : null,
      clientId: positiveInt(q.clientId),
      siteId: positiveInt(q.siteId),
      crewId: positiveInt(q.crewId),
    },
    page: positiveInt(q.page) ?? 1,
  }
}

export function queryFromQueueView({ filter, page }: QueueView): LocationQueryRaw {
  const q: LocationQueryRaw = {}
  if (filter.state !== 'open') q.state = filter.state
  if (filter.kind) q.kind = filter.kind
  if (filter.clientId) q.clientId = String(filter.clientId)
  if (filter.siteId) q.siteId = String(filter.siteId)
  if (filter.crewId) q.crewId = String(filter.crewId)
  if (page > 1) q.page = String(page)
  return q
}
