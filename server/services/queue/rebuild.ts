// The whole queue brought in step with strings, forecasts, public reports and certificates. Safe to
// run at any time: open items are keyed, so nothing is opened twice, and settled reports stay settled.
// Only strings out of step with their items are touched (string-items.ts finds them); `full` goes
// over every string whose state needs an item, for safety.
import { wakeSnoozed } from './actions'
import type { Db } from '../../db'
import { syncCertificateItems } from './certificates'
import { syncReportItems } from './reports'
import { syncSeasonItems } from './season'
import { syncForecastItems, syncStateItems, type StringForecastRisk } from './strings'

const openCount = async (db: Db) =>
  Number((await db('queueItems').where('state', 'open').count({ n: '*' }))[0].n)

/** `risks` are the latest forecasts the forecast job judged (its answer). */
export async function rebuildQueue(
  db: Db,
  risks: StringForecastRisk[],
  now = new Date(),
  o: { full?: boolean } = {},
) {
  const before = await openCount(db)
  await wakeSnoozed(db, now)
  const synced = await syncStateItems(db, now, o)
  await syncForecastItems(db, risks, now)
  await syncReportItems(db, now)
  await syncCertificateItems(db, now)
  await syncSeasonItems(db, now)
  const after = await openCount(db)
  return { opened: Math.max(0, after - before), open: after, synced }
}
