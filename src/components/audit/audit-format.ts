// Words for the audit log: what was done, to what, and which fields changed.
import type { AuditEntry } from '../../api/audit'

const ENTITY_WORDS: Record<string, string> = {
  certificate: 'Certificate',
  circuit: 'Circuit',
  client: 'Client',
  crew: 'Crew',
  isolation: 'Isolation',
  job: 'Scheduled job',
  platform: 'Platform',
  queue_item: 'Queue item',
  run: 'Run',
  site: 'Site',
  string: 'String',
  strings: 'Strings (import)',
  string_type: 'String type',
  structure: 'Structure',
  supply_point: 'Supply point',
  user: 'User',
}

/** "String type" for string_type; an unknown kind reads as its own words. */
export function entityWord(entity: string): string {
  return ENTITY_WORDS[entity] ?? entity.replace(/_/g, ' ').replace(/^./, (c) => c.toUpperCase())
}

/** "update" → "Changed"; other actions as written, first letter up. */
export function actionWord(action: string): string {
  const known: Record<string, string> = {
    create: 'Created',
    update: 'Changed',
    archive: 'Archived',
    invite: 'Invited',
    run: 'Ran',
    close: 'Closed',
    snooze: 'Snoozed',
    merge: 'Merged',
  }
  return known[action] ?? action.replace(/[_-]/g, ' ').replace(/^./, (c) => c.toUpperCase())
}

export interface FieldChange {
  field: string
  before: string
  after: string
}

const show = (v: unknown): string =>
  v === null || v === undefined || v === '' ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v)

/** "emergencyPhone" → "emergency phone". */
const fieldWord = (k: string) =>
  k
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase()

/**
 * The fields that differ between before and after (an edit), or every field of `after` when there
 * is no before (a creation, or a change stored as it was asked). Bookkeeping fields are left out.
 */
export function fieldChanges(e: Pick<AuditEntry, 'before' | 'after'>): FieldChange[] {
  const obj = (v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : null
  const before = obj(e.before)
  const after = obj(e.after)
  if (!after)
    return e.after === null ? [] : [{ field: 'value', before: show(e.before), after: show(e.after) }]
  const skip = new Set(['version', 'updatedAt', 'createdAt'])
  return Object.keys({ ...before, ...after })
    .filter((k) => !skip.has(k))
    .filter((k) => !before || JSON.stringify(before[k]) !== JSON.stringify(after[k]))
    .map((k) => ({ field: fieldWord(k), before: before ? show(before[k]) : '', after: show(after[k]) }))
}
