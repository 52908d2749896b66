// The changes that notify someone, in one place: each is called inside the transaction of its change,
// so a notice exists exactly when the change was saved.
import type { Db } from '../db'
import { addNotices } from './notices'
import { config } from '../config'
import { formatDay } from '../../shared/local-time'

/** An isolation record rejected by the safety officer: its author is told, with the reviewer's note. */
export async function noticeIsolationRejected(
  db: Db,
  isolation: { id: number; userId: number; stringId?: number | null },
  note?: string,
): Promise<void> {
  await addNotices(db, [isolation.userId], {
    kind: 'isolation_rejected',
    title: `Your isolation record #${isolation.id} was rejected by the safety officer`,
    body: note ? `Safety officer's note: ${note}` : 'Ask the safety officer what to put right.',
    link: isolation.stringId ? `/strings/${isolation.stringId}` : undefined,
  })
}

/** The queue items on a run, in stop order. */
export async function runStopItems(db: Db, runId: number): Promise<number[]> {
  const rows = await db('runStops').where({ runId }).orderBy('position').select('queueItemId')
  return rows.map((r) => Number(r.queueItemId))
}

/** Members of a crew, by role (the link differs: crews have tonight's run, supervisors the planner). */
async function crewMembers(db: Db, crewId: number, except?: number) {
  const rows = await db('users').where({ crewId, active: true }).select('id', 'role')
  const others = rows.filter((r) => r.id !== except)
  return {
    crew: others.filter((r) => r.role === 'crew').map((r) => Number(r.id)),
    rest: others.filter((r) => r.role !== 'crew').map((r) => Number(r.id)),
  }
}

async function toMembers(
  db: Db,
  crewId: number,
  except: number | undefined,
  n: Parameters<typeof addNotices>[2],
) {
  const m = await crewMembers(db, crewId, except)
  await addNotices(db, m.crew, { ...n, link: '/run' })
  await addNotices(db, m.rest, { ...n, link: '/plan' })
}

export interface PublishedRun {
  crewId: number
  date: string
  /** Whether the run had been published before this publish. */
  wasPublished: boolean
  /** Queue items on the run before (empty for a new run) and after, in stop order. */
  before: number[]
  after: number[]
  /** Who published: not told about their own change. */
  publishedBy?: number
}

/**
 * A run published: its crew is told when a published run changed (a stop added, removed or moved) and
 * when a public report is put on it.
 */
export async function noticeRunPublished(db: Db, r: PublishedRun): Promise<void> {
  // The run's calendar day in words, as the run e-mail gives it (a date: no zone to convert).
  const day = formatDay(r.date, config.APP_LOCALE)
  const added = r.after.filter((id) => !r.before.includes(id))
  const removed = r.before.filter((id) => !r.after.includes(id))
  const moved = !added.length && !removed.length && r.before.join() !== r.after.join()
  if (r.wasPublished && (added.length || removed.length || moved)) {
    const parts = [
      added.length ? `${added.length} stop${added.length === 1 ? '' : 's'} added` : '',
      removed.length ? `${removed.length} stop${removed.length === 1 ? '' : 's'} removed` : '',
      moved ? 'stops in a new order' : '',
    ].filter(Boolean)
    await toMembers(db, r.crewId, r.publishedBy, {
      kind: 'run_changed',
      title: `Your run for ${day} has changed`,
      body: `${parts.join(', ')}. Check the run before you set out.`,
    })
  }
  if (!added.length) return
  const reports = await db('queueItems as q')
    .join('reports as p', 'p.id', 'q.reportId')
    .leftJoin('strings as s', 's.id', 'q.stringId')
    .whereIn('q.id', added)
    .where('q.kind', 'public_report')
    .select('p.ref', 'p.description', 'p.hazard', 's.assetTag')
  for (const p of reports) {
    const where = p.assetTag ? ` on ${p.assetTag}` : ''
    await toMembers(db, r.crewId, r.publishedBy, {
      kind: 'report_assigned',
      title: `${p.hazard ? 'Hazard report' : 'Public report'} ${p.ref}${where} is on your run for ${day}`,
      body: `The reporter says: ${p.description}`,
    })
  }
}

/** A place's count of an item fell to its low-stock level (or below zero): supervisors are told, once. */
export async function noticeLowStock(
  db: Db,
  s: { itemId: number; locationId: number; quantity: number; lowAt: number | null },
): Promise<void> {
  const [item, place, supervisors] = await Promise.all([
    db('stockItems').where({ id: s.itemId }).first('name'),
    db('stockLocations').where({ id: s.locationId }).first('name'),
    db('users').where({ role: 'supervisor', active: true }).select('id'),
  ])
  const level = s.lowAt === null ? '' : ` (low at ${s.lowAt})`
  await addNotices(
    db,
    supervisors.map((u) => Number(u.id)),
    {
      kind: 'low_stock',
      title: `${place?.name ?? 'A van'} is low on ${item?.name ?? 'an item'}: ${s.quantity} left${level}`,
      body:
        s.quantity < 0
          ? 'More were fitted than the count said were on board: count the van and correct it.'
          : 'Move more from the depot, or order, before the next run.',
      link: '/stock',
    },
  )
}
