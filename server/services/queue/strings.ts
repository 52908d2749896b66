// A string's queue items follow its state: dark and replace-now strings have an item of that kind,
// a visit that leaves the string lit, on watch or made safe closes its items (public reports on it
// included), and lit strings likely to go dark soon get a forecast item.
import { stringStatusKind, type QueueKind } from '../../../shared/schemas/queue'
import type { StringStatus } from '../../../shared/schemas/string-states'
import { closeItems, openItem, ACTIVE } from './items'
import type { Db } from '../../db'

/** Forecast risk that opens an item: the string may go dark within 72 burning hours. */
export const FORECAST_DARK_P72 = 0.25

const STATE_KINDS = Object.values(stringStatusKind) as QueueKind[]

async function activeItems(db: Db, stringId: number, kinds: QueueKind[]): Promise<number[]> {
  const rows = await db('queueItems')
    .where({ stringId })
    .whereIn('kind', kinds)
    .whereIn('state', ACTIVE)
    .select('id')
  return rows.map((r) => r.id as number)
}

/**
 * Keeps a string's queue items in step with its state: opens what it needs and closes what no longer
 * applies. Only a visit closes the public reports on a string (its crew saw it); a changed threshold
 * does not answer a reporter.
 */
export async function syncStringQueue(db: Db, stringId: number, visitId: number | null, now = new Date()) {
  const s = await db('strings as s')
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
      'si.clientId',
    )
  if (!s) return
  // An archived string is no longer ours to look after: its state items close, reports stay.
  if (s.archivedAt) {
    const reason = 'String archived'
    return void (await closeItems(db, await activeItems(db, stringId, [...STATE_KINDS, 'forecast_dark']), {
      now,
      reason,
    }))
  }
  const kind: QueueKind | undefined = stringStatusKind[s.status as keyof typeof stringStatusKind]
  // A string dark or to be replaced now has that item; its "may go dark" forecast item gives way to it.
  const settled = kind
    ? [...STATE_KINDS.filter((k) => k !== kind), 'forecast_dark' as const]
    : [...STATE_KINDS, 'forecast_dark' as const, ...(visitId ? ['public_report' as const] : [])]
  await closeItems(db, await activeItems(db, stringId, settled), { now, visitId })
  if (!kind) return
  // The summary says which rule fired: the lamps' voltage ratio, or the forecast's risk.
  const summary =
    kind === 'dark'
      ? `${s.assetTag} ${s.name} is dark`
      : s.replaceRule === 'risk' && s.riskNote
        ? `${s.assetTag} ${s.name}: replace now, ${s.riskNote}`
        : `${s.assetTag} ${s.name}: ${s.lampsOut} lamps out, replace now`
  await openItem(
    db,
    {
      kind,
      stringId,
      siteId: s.siteId,
      clientId: s.clientId,
      subject: `string:${stringId}`,
      severity: 'standard',
      summary,
    },
    now,
  )
}

/** Every string whose state needs an item has one (the scheduled refresh). */
export async function syncStateItems(db: Db, now = new Date()) {
  const needing = Object.keys(stringStatusKind) as StringStatus[]
  for (const s of await db('strings').whereIn('status', needing).whereNull('archivedAt').select('id'))
    await syncStringQueue(db, s.id, null, now)
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
  for (const r of risks) {
    // Dark, made-safe and replace-now strings are in the queue already under their own kind.
    if (r.pDark72 < FORECAST_DARK_P72 || (r.status !== 'lit' && r.status !== 'watch')) continue
    const nights = Math.round(72 / r.burnHoursPerDay)
    const summary = `${r.assetTag} may go dark within about ${nights} nights (${Math.round(r.pDark72 * 100)} % chance)`
    await openItem(
      db,
      {
        kind: 'forecast_dark',
        subject: `string:${r.id}`,
        severity: 'standard',
        stringId: r.id,
        siteId: r.siteId,
        clientId: r.clientId,
        summary,
      },
      now,
    )
  }
}
