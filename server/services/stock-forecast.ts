// A run's forecast use (lamps out and failed fuse lamps on its stops' strings, by class) against the
// crew van's stock: the planner's warning and the printable load-out sheet.
import type { Db } from '../db'
import { lampsByClass, needLines, type NeedLine } from '../../shared/stock-use'
import { loadType } from './strings'
import { lampItemId, vanOf } from './stock-places'
import { notFound } from '../errors'

/** What the strings need now, by stock item. */
export async function forecastUse(db: Db, stringIds: number[]) {
  const need = new Map<number, { itemName: string; quantity: number }>()
  const ids = [...new Set(stringIds)]
  if (!ids.length) return need
  const strings = await db('strings').whereIn('id', ids).select('typeId', 'lampsOut', 'fuseFailed')
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  for (const s of strings) {
    if (!types.has(s.typeId)) types.set(s.typeId, await loadType(db, s.typeId))
    const type = types.get(s.typeId)!
    for (const u of lampsByClass(type, { lamps: Number(s.lampsOut), fuse: !!s.fuseFailed })) {
      const itemId = await lampItemId(db, type.classes[u.classIndex])
      const had = need.get(itemId)
      if (had) had.quantity += u.quantity
      else need.set(itemId, { itemName: '', quantity: u.quantity })
    }
  }
  const names = await db('stockItems')
    .whereIn('id', [...need.keys()])
    .select('id', 'name')
  for (const n of names) need.get(n.id)!.itemName = n.name
  return need
}

/** Forecast use of the strings against the crew's van, one line per item needed. */
export async function vanCover(
  db: Db,
  crewId: number,
  stringIds: number[],
): Promise<{ locationId: number; lines: NeedLine[] }> {
  const van = await vanOf(db, crewId)
  const need = await forecastUse(db, stringIds)
  const levels = await db('stockLevels')
    .where({ locationId: van.id })
    .whereIn('itemId', [...need.keys()])
    .select('itemId', 'quantity')
  const have = new Map(levels.map((l) => [l.itemId as number, Number(l.quantity)]))
  return { locationId: van.id, lines: needLines(need, have) }
}

/** The planner's warning: the items a run needs more of than its van holds (none: an empty list). */
export async function runShortfalls(db: Db, crewId: number, stringIds: number[]): Promise<NeedLine[]> {
  return (await vanCover(db, crewId, stringIds)).lines.filter((l) => l.short > 0)
}

/** Adds each run's shortfalls to a plan answer (proposal or saved runs). */
export async function withStockWarnings<R extends { crewId: number; stops: { stringId: number | null }[] }>(
  db: Db,
  runs: R[],
): Promise<(R & { stockShortfalls: NeedLine[] })[]> {
  const out = []
  for (const r of runs) {
    const ids = r.stops.map((s) => s.stringId).filter((id): id is number => id !== null)
    out.push({ ...r, stockShortfalls: await runShortfalls(db, r.crewId, ids) })
  }
  return out
}

/** The load-out sheet: what the crew's van should carry for its run on `date`. */
export async function loadOutSheet(db: Db, crewId: number, date: string) {
  const crew = await db('crews').where({ id: crewId }).first('id', 'name')
  if (!crew) throw notFound('Crew')
  const run = await db('runs').where({ crewId, runDate: date }).first('id', 'state')
  const stops = run
    ? await db('runStops').where({ runId: run.id }).whereNull('doneAt').select('stringId')
    : []
  const cover = await vanCover(
    db,
    crewId,
    stops.map((s) => s.stringId).filter((id) => id != null),
  )
  return {
    date,
    crew: { id: crew.id as number, name: crew.name as string },
    locationId: cover.locationId,
    run: run ? { id: run.id as number, state: run.state as string, stops: stops.length } : null,
    lines: cover.lines,
  }
}
