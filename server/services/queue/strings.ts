// A string's queue items follow its state: dark and replace-now strings have an item of that kind,
// a visit that leaves the string lit, on watch or made safe closes its items (public reports on it
// included), and lit strings likely to go dark soon get a forecast item.
// The rule itself is planStringItems (string-items.ts), for one string here and thousands in a refresh.
import { stringStatusKind } from '../../../shared/vocab/queue'
import type { StringStatus } from '../../../shared/vocab/string-states'
import { openItems, type OpenItem } from './items'
import type { Db } from '../../db'
import {
  activeStringItems,
  applyStringPlans,
  type ActiveItem,
  planStringItems,
  stringsOutOfStep,
  syncStringItems,
  type QueuedString,
} from './string-items'

/** Forecast risk that opens an item: the string may go dark within 72 burning hours. */
export const FORECAST_DARK_P72 = 0.25

/** What the queue needs of a string (and its site's client). */
export type KnownString = QueuedString

/**
 * Keeps a string's queue items in step with its state: opens what it needs and closes what no longer
 * applies. Only a visit closes the public reports on a string (its crew saw it); a changed threshold
 * does not answer a reporter.
 */
export async function syncStringQueue(
  db: Db,
  stringId: number,
  visitId: number | null,
  now = new Date(),
  /** The string as the caller has just written it (a visit), with its site's clientId: not read again. */
  known?: KnownString,
  /** Its active items as the caller read them in this transaction (activeItemsColumn): not read again. */
  knownItems?: ActiveItem[],
) {
  const s =
    known ??
    (await db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .where('s.id', stringId)
      .first(
        's.id',
        's.assetTag',
        's.name',
        's.status',
        's.lampsOut',
        's.replaceRule',
        's.riskNote',
        's.siteId',
        's.archivedAt',
        's.seasonState',
        'si.clientId',
      ))
  if (!s) return
  const active = knownItems ?? (await activeStringItems(db, [stringId], !!visitId))
  await applyStringPlans(db, [planStringItems(s, active, visitId)], visitId, now)
}

/**
 * Every string whose state needs an item has one (the scheduled refresh): only the strings out of step
 * with their items, or with `full` every live string whose state needs one.
 */
export async function syncStateItems(db: Db, now = new Date(), o: { full?: boolean } = {}) {
  const needing = Object.keys(stringStatusKind) as StringStatus[]
  const ids: number[] = o.full
    ? await db('strings').whereIn('status', needing).whereNull('archivedAt').pluck('id')
    : await stringsOutOfStep(db)
  await syncStringItems(db, ids, now)
  return ids.length
}

/** One string's forecast, as the forecast job reports it. */
export interface StringForecastRisk {
  id: number
  assetTag: string
  status: string
  siteId: number
  clientId: number
  pDark72: number
  burnHoursPerDay: number
}

/** Opens a forecast item for each lit or watched string likely to go dark within 72 burning hours. */
export async function syncForecastItems(db: Db, risks: StringForecastRisk[], now = new Date()) {
  // Dark, made-safe and replace-now strings are in the queue already under their own kind.
  const due = risks.filter(
    (r) => r.pDark72 >= FORECAST_DARK_P72 && (r.status === 'lit' || r.status === 'watch'),
  )
  const items: OpenItem[] = due.map((r) => {
    const nights = Math.round(72 / r.burnHoursPerDay)
    return {
      kind: 'forecast_dark',
      subject: `string:${r.id}`,
      severity: 'standard',
      stringId: r.id,
      siteId: r.siteId,
      clientId: r.clientId,
      summary: `${r.assetTag} may go dark within about ${nights} nights (${Math.round(r.pDark72 * 100)} % chance)`,
    }
  })
  await openItems(db, items, now)
}
