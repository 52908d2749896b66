import type { QueueItem, QueueKind, QueueState } from '../../api/queue'
import { formatNumber } from '../../dates'

export interface QueueFilterModel {
  state: QueueState
  kind: QueueKind | null
  clientId: number | null
  siteId: number | null
  crewId: number | null
}
export interface FilterOption {
  value: number
  label: string
  clientId?: number
}

// Score parts and their ceilings as the server defines them (server/services/queue/score.ts):
// risk 0–50, importance 0–25, clock 0–25, so a full bar is a score of 100.
export const SCORE_PARTS = [
  { key: 'risk', label: 'Risk', max: 50 },
  { key: 'importance', label: 'Importance', max: 25 },
  { key: 'clock', label: 'Clock', max: 25 },
] as const
export const SCORE_MAX = 100

export const STATE_LABEL: Record<QueueItem['state'], string> = {
  open: 'Open',
  snoozed: 'Snoozed',
  closed: 'Closed',
  merged: 'Merged',
}

export const STATE_FILTERS: { value: QueueState; label: string }[] = [
  { value: 'open', label: 'Open' },
  { value: 'snoozed', label: 'Snoozed' },
  { value: 'closed', label: 'Closed' },
  { value: 'all', label: 'All' },
]

function hours(h: number): string {
  const abs = Math.abs(h)
  return formatNumber(abs, abs < 10 ? 1 : 0)
}

/** "12 h left" or "overdue by 3.5 h": said in words, never by colour alone. */
export function dueText(item: Pick<QueueItem, 'hoursLeft' | 'overdue'>): string {
  return item.overdue ? `overdue by ${hours(item.hoursLeft)} h` : `${hours(item.hoursLeft)} h left`
}

export function score(n: number): string {
  return formatNumber(n, 1)
}

/** Where the item is: site, then client, whichever are known. */
export function placeText(item: QueueItem): string {
  return [item.site?.name, item.client?.name].filter(Boolean).join(' · ') || 'No site'
}
