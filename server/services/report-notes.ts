// The reporter's own words where the work is done: each waiting report (received, in hand or
// scheduled) on a queue item or a string, with its description, the place it names and its photo.
// Only these columns are read: no name, e-mail or network hash ever leaves here.
import type { Db } from '../db'
import type { ReportNote } from '../../shared/schemas/report-work'
import { reportOpenStates } from '../../shared/vocab/reports'
import { iso } from '../../shared/iso-time'
import { reportPhotoUrls } from './report-photos'

const columns = [
  'r.id',
  'r.ref',
  'r.hazard',
  'r.description',
  'r.landmark',
  'r.streetText',
  'r.createdAt',
  'r.queueItemId',
  'r.stringId',
  'p.id as photoId',
] as const

function waiting(db: Db) {
  return db('reports as r')
    .leftJoin('reportPhotos as p', 'p.reportId', 'r.id')
    .whereIn('r.state', reportOpenStates)
    .orderBy([{ column: 'r.hazard', order: 'desc' }, { column: 'r.createdAt' }, { column: 'r.id' }])
    .select(...columns)
}

type Row = { [k: string]: unknown }

function toNote(r: Row): ReportNote {
  return {
    ref: r.ref as string,
    hazard: !!r.hazard,
    description: r.description as string,
    near: (r.landmark as string | null) ?? null,
    street: (r.streetText as string | null) ?? null,
    createdAt: iso(r.createdAt as Date),
    photo: r.photoId ? reportPhotoUrls(Number(r.photoId)) : null,
  }
}

/** Waiting reports carried by each of these queue items (an item's own report and those joined to it). */
export async function reportNotesForItems(db: Db, itemIds: number[]): Promise<Map<number, ReportNote[]>> {
  const out = new Map<number, ReportNote[]>()
  const ids = [...new Set(itemIds)]
  if (!ids.length) return out
  const rows: Row[] = await waiting(db).where((w) =>
    w
      .whereIn('r.queueItemId', ids)
      .orWhereIn('r.id', db('queueItems').whereIn('id', ids).whereNotNull('reportId').select('reportId')),
  )
  const leadOf = new Map(
    (await db('queueItems').whereIn('id', ids).whereNotNull('reportId').select('id', 'reportId')).map((q) => [
      q.reportId as number,
      q.id as number,
    ]),
  )
  for (const r of rows) {
    const itemId = (ids.includes(r.queueItemId as number) ? r.queueItemId : leadOf.get(r.id as number)) as
      number | undefined
    if (itemId === undefined) continue
    const list = out.get(itemId) ?? []
    if (!list.some((n) => n.ref === r.ref)) list.push(toNote(r))
    out.set(itemId, list)
  }
  return out
}

/** Waiting reports on a string, for the crew's string page. */
export async function reportNotesForString(db: Db, stringId: number): Promise<ReportNote[]> {
  const rows: Row[] = await waiting(db).where('r.stringId', stringId)
  return rows.map(toNote)
}
