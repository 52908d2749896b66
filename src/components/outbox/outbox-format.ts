// Words for outbox entries: what each is, and where it stands.
import { isolationSteps } from '../../../shared/vocab/visits'
import { emergencyOutcomeLabel } from '../../../shared/vocab/report-work'
import type { OutboxEntry } from '../../offline/outbox-types'
import { formatDate, isToday } from '../../dates'
import type { SeasonRecord } from '../../offline/season-record'

export const KIND_WORD: Record<OutboxEntry['kind'], string> = {
  isolation: 'Isolation',
  visit: 'Visit',
  photo: 'Photo',
  emergency: 'Emergency log',
  season: 'Season record',
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`
}

export function entrySummary(e: OutboxEntry): string {
  if (e.kind === 'photo') return e.fileName
  if (e.kind === 'isolation') return `${e.body.steps.length} of ${isolationSteps.length} steps stamped`
  if (e.kind === 'emergency') return emergencyOutcomeLabel[e.body.outcome]
  if (e.kind === 'season') return seasonSummary(e.record)
  const b = e.body
  const parts = [`${b.failedFound} found`, `${b.replaced} replaced`]
  if (b.fuseReplaced) parts.push('fuse lamp replaced')
  if (b.darkOnArrival) parts.push('dark on arrival')
  if (b.leaveMadeSafe) parts.push('left made safe')
  return parts.join(', ')
}

export function entryStatus(e: OutboxEntry, now = Date.now()): string {
  if (e.state === 'sent') return `Sent ${formatDate(e.sentAt, 'time')}`
  if (e.state === 'failed') return 'Refused by the server'
  if (e.attempts === 0) return 'Waiting to send'
  const wait = Math.ceil((e.nextAttemptAt - now) / 1000)
  const tries = plural(e.attempts, 'try', 'tries')
  return wait > 0
    ? `Waiting · ${tries} so far, next in ${wait < 60 ? `${wait} s` : `${Math.ceil(wait / 60)} min`}`
    : `Waiting · ${tries} so far`
}

export function madeAt(e: OutboxEntry): string {
  return `Saved ${formatDate(e.createdAt, isToday(e.createdAt) ? 'time' : 'dayMonthTime')}`
}

export function waitingHeadline(visits: number, others: number): string {
  if (visits === 0 && others === 0) return 'Everything has been sent'
  if (visits === 0) return `${plural(others, 'item')} waiting to send`
  const rest = others ? ` (and ${plural(others, 'other item')})` : ''
  return `${plural(visits, 'visit')} waiting to send${rest}`
}

/** A season record in a few words: what it was and what it found. */
export function seasonSummary(r: SeasonRecord): string {
  if (r.type === 'take_down')
    return `Take-down into ${r.body.storeBin}${r.body.forRepair ? ', for repair' : ''}`
  const what = r.type === 'commissioning' ? 'Commissioning' : 'Inspection in store'
  return `${what}, ${plural(r.body.lampsOut, 'lamp')} out at test`
}
