// The queue as a safety officer reads it: only certificate work (due, failed tests, failed RCDs),
// in the planners' order (emergencies first, then by score), one page at a time. Certificate items
// are few (one per subject and kind at most), so they are ranked in memory.
import type { Db } from '../db'
import type { QueueFilter } from './queue/list'
import { listQueue } from './queue/list'
import { safetyQueueKinds } from '../../shared/vocab/certificates'
import { forbidden } from '../errors'

export async function safetyQueuePage(db: Db, f: QueueFilter & { page: number; pageSize: number }) {
  if (f.kind && !(safetyQueueKinds as readonly string[]).includes(f.kind))
    throw forbidden('Safety officers see certificate work in the queue: choose a certificate kind or none.')
  const kinds = f.kind ? [f.kind] : safetyQueueKinds
  const lists = await Promise.all(kinds.map((kind) => listQueue(db, { ...f, kind })))
  const all = lists
    .flat()
    .sort(
      (a, b) =>
        Number(b.severity === 'emergency') - Number(a.severity === 'emergency') ||
        b.score - a.score ||
        a.id - b.id,
    )
  return { items: all.slice((f.page - 1) * f.pageSize, f.page * f.pageSize), total: all.length }
}
