// Whether a certificate covers a date: the newest record of a kind for each subject, and why it does
// not (missing, failed, expired), in words. The planner's refusals (plan-refusal.ts) and the
// commissioning's fixing check (commissioning.ts) both judge structural approvals by these.
import type { Db } from '../db'
import { formatDay } from '../../shared/local-time'
import { config } from '../config'

export interface Cert {
  subjectId: number
  result: string
  doneOn: string
  nextDue: string | null
  reference?: string | null
}

/** The newest record of `kind` for each subject among `ids`. */
export async function newestCertificates(db: Db, kind: string[], subjectType: string, ids: number[]) {
  if (!ids.length) return new Map<number, Cert>()
  const rows: Cert[] = await db('certificates as c')
    .whereIn('c.kind', kind)
    .where('c.subjectType', subjectType)
    .whereIn('c.subjectId', ids)
    .whereRaw(
      'c.id = (select max(c2.id) from certificates c2 where c2.kind = c.kind and c2.subject_type = c.subject_type and c2.subject_id = c.subject_id)',
    )
    .select('c.subjectId', 'c.result', 'c.doneOn', 'c.nextDue', 'c.reference')
  // A subject with records of both kinds (should not happen) is judged by its later one.
  const map = new Map<number, Cert>()
  for (const r of rows)
    if (!map.has(r.subjectId) || map.get(r.subjectId)!.doneOn < r.doneOn) map.set(r.subjectId, r)
  return map
}

/** Why a record does not cover `date`, in words, or null when it does. */
export function lapse(c: Cert | undefined, date: string, what: string): string | null {
  const day = (d: string) => formatDay(d, config.APP_LOCALE)
  if (!c) return `no ${what} on record`
  if (c.result === 'fail') return `${what} failed ${day(c.doneOn)}`
  if (c.nextDue && c.nextDue < date) return `${what} expired ${day(c.nextDue)}`
  return null
}

/** The structural approval a column or anchor needs before anything is hung on it (trade-reference §7). */
export const STRUCTURAL_APPROVAL = {
  kinds: ['column_structural', 'anchor_test'],
  what: (structureKind: string) =>
    structureKind === 'column' ? 'column structural test' : 'anchor load test',
} as const
