// The rule of a string's state items in one place, for one string (a visit) or thousands (the
// refresh): what to close and what to open, worked out from the string and its active items, then
// written in a few statements for the lot. And which strings are out of step with their items at all,
// found by MariaDB, so a refresh touches only those.
import { stringStatusKind, type QueueKind } from '../../../shared/vocab/queue'
import type { StringStatus } from '../../../shared/vocab/string-states'
import { closeItems, openItems, ACTIVE, type OpenItem } from './items'
import { jsonColumn, type Db } from '../../db'
import { plural } from '../../../shared/number-format'
import { UP_STATES } from './season'

export const STATE_KINDS = Object.values(stringStatusKind) as QueueKind[]
const NEEDING = Object.keys(stringStatusKind) as StringStatus[]
const CHUNK = 1000

/** The columns of a string the rule reads (with its site's client). */
export interface QueuedString {
  id: number
  assetTag: string
  name: string
  status: string
  lampsOut: number
  replaceRule: string | null
  riskNote: string | null
  siteId: number
  archivedAt: Date | null
  /** Where the string is in its season: only one up on the street needs street work. */
  seasonState: string
  clientId: number
}

export interface ActiveItem {
  id: number
  stringId: number
  kind: QueueKind
}

export interface StringPlan {
  /** items to close because the string was archived (reports stay) */
  archived: number[]
  /** items to close because the string is not up: in store, taken down or in for repair (reports stay) */
  down: number[]
  /** items to close because the string's state has moved on */
  close: number[]
  open: OpenItem | null
}

/**
 * A string dark or to be replaced now has that item, and its "may go dark" forecast item gives way to
 * it; one lit, on watch or made safe has none. Only a visit closes the public reports on a string
 * (its crew saw it); a changed threshold does not answer a reporter.
 */
export function planStringItems(s: QueuedString, active: ActiveItem[], visitId: number | null): StringPlan {
  const streetItems = () =>
    active.filter((i) => i.kind === 'forecast_dark' || STATE_KINDS.includes(i.kind)).map((i) => i.id)
  if (s.archivedAt) return { archived: streetItems(), down: [], close: [], open: null }
  if (!(UP_STATES as readonly string[]).includes(s.seasonState))
    return { archived: [], down: streetItems(), close: [], open: null }
  const kind: QueueKind | undefined = stringStatusKind[s.status as keyof typeof stringStatusKind]
  const settled: QueueKind[] = kind
    ? [...STATE_KINDS.filter((k) => k !== kind), 'forecast_dark']
    : [...STATE_KINDS, 'forecast_dark', ...(visitId ? ['public_report' as const] : [])]
  const close = active.filter((i) => settled.includes(i.kind)).map((i) => i.id)
  // An item of its kind open or snoozed already: nothing to open (openItems would find it and skip).
  if (!kind || active.some((i) => i.kind === kind)) return { archived: [], down: [], close, open: null }
  const summary = stringItemSummary(kind, s)
  const open: OpenItem = {
    kind,
    stringId: s.id,
    siteId: s.siteId,
    clientId: s.clientId,
    subject: `string:${s.id}`,
    severity: 'standard',
    summary,
  }
  return { archived: [], down: [], close, open }
}

/**
 * A state item's title from the string as it is now; the queue list builds it again on every read, so
 * the title never says "4 lamps out" beside a string that has 2. It says which rule fired: the lamps'
 * voltage ratio, or the forecast's risk.
 */
export function stringItemSummary(
  kind: QueueKind,
  s: Pick<QueuedString, 'assetTag' | 'name' | 'lampsOut' | 'replaceRule' | 'riskNote'>,
): string {
  if (kind === 'dark') return `${s.assetTag} ${s.name} is dark`
  if (s.replaceRule === 'risk' && s.riskNote) return `${s.assetTag} ${s.name}: replace now, ${s.riskNote}`
  return `${s.assetTag} ${s.name}: ${plural(s.lampsOut, 'lamp')} out, replace now`
}

const activeKinds = (withReports: boolean): QueueKind[] => [
  ...STATE_KINDS,
  'forecast_dark',
  ...(withReports ? ['public_report' as const] : []),
]

/** The open or snoozed state, forecast (and with a visit, public-report) items of these strings. */
export async function activeStringItems(db: Db, ids: number[], withReports: boolean): Promise<ActiveItem[]> {
  const out: ActiveItem[] = []
  for (let i = 0; i < ids.length; i += CHUNK)
    out.push(
      ...(await db('queueItems')
        .whereIn('stringId', ids.slice(i, i + CHUNK))
        .whereIn('kind', activeKinds(withReports))
        .whereIn('state', ACTIVE)
        .orderBy('id')
        .select('id', 'stringId', 'kind')),
    )
  return out
}

/**
 * activeStringItems of each row of an outer query as a subquery (a JSON list of [id, kind]) on its
 * string id column (`outerId`, e.g. 's.id'), so a caller reads them in the same statement as other
 * things; activeItemsOf turns the column back into the list.
 */
export function activeItemsColumn(db: Db, outerId: string, withReports: boolean) {
  return db('queueItems as q')
    .where('q.stringId', db.ref(outerId))
    .whereIn('q.kind', activeKinds(withReports))
    .whereIn('q.state', ACTIVE)
    .select(db.raw('json_arrayagg(json_array(q.id, q.kind) order by q.id)'))
}

export function activeItemsOf(stringId: number, column: unknown): ActiveItem[] {
  return jsonColumn<[number, QueueKind][]>(column, []).map(([id, kind]) => ({ id, stringId, kind }))
}

/** Applies the plans: a few statements for all of them. */
export async function applyStringPlans(db: Db, plans: StringPlan[], visitId: number | null, now: Date) {
  await closeItems(
    db,
    plans.flatMap((p) => p.archived),
    { now, reason: 'String archived' },
  )
  await closeItems(
    db,
    plans.flatMap((p) => p.down),
    { now, reason: 'String not up this season' },
  )
  await closeItems(
    db,
    plans.flatMap((p) => p.close),
    { now, visitId },
  )
  await openItems(
    db,
    plans.flatMap((p) => (p.open ? [p.open] : [])),
    now,
  )
}

/** Brings many strings' items in step with their states (no visit: public reports stay). */
export async function syncStringItems(db: Db, ids: number[], now = new Date()) {
  for (let i = 0; i < ids.length; i += CHUNK) {
    const chunk = ids.slice(i, i + CHUNK)
    const strings: QueuedString[] = await db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .whereIn('s.id', chunk)
      .select('s.id', 's.assetTag', 's.name', 's.status', 's.lampsOut', 's.replaceRule', 's.riskNote')
      .select('s.siteId', 's.archivedAt', 's.seasonState', 'si.clientId')
    const active = new Map<number, ActiveItem[]>()
    for (const a of await activeStringItems(db, chunk, false))
      active.set(a.stringId, [...(active.get(a.stringId) ?? []), a])
    const plans = strings.map((s) => planStringItems(s, active.get(s.id) ?? [], null))
    await applyStringPlans(db, plans, null, now)
  }
}

const kindOfStatus = `case s.status ${NEEDING.map((st) => `when '${st}' then '${stringStatusKind[st as keyof typeof stringStatusKind]}'`).join(' ')} end`

/**
 * Live strings whose state needs an item they lack, or that hold an item of another state kind or a
 * forecast item that their state item replaces: the strings a refresh must bring in step.
 */
export async function stringsOutOfStep(db: Db): Promise<number[]> {
  const lacking = await db('strings as s')
    .whereIn('s.status', NEEDING)
    .whereNull('s.archivedAt')
    .whereIn('s.seasonState', UP_STATES)
    .whereNotExists((q) =>
      q
        .select(db.raw('1'))
        .from('queue_items as q')
        .whereRaw('q.string_id = s.id')
        .whereIn('q.state', ACTIVE)
        .whereRaw(`q.kind = ${kindOfStatus}`),
    )
    .pluck('s.id')
  // Strings holding a street item they should not: one of another state kind, a forecast item their
  // state item replaces, or any street item while in store, taken down or in for repair.
  const crossed = await db('queueItems as q')
    .join('strings as s', 's.id', 'q.stringId')
    .whereNull('s.archivedAt')
    .whereIn('q.state', ACTIVE)
    .whereIn('q.kind', [...STATE_KINDS, 'forecast_dark'])
    .where((w) =>
      w
        .where((n) => n.whereIn('s.status', NEEDING).whereRaw(`q.kind <> ${kindOfStatus}`))
        .orWhereNotIn('s.seasonState', UP_STATES),
    )
    .distinct('s.id')
    .pluck('s.id')
  return [...new Set([...lacking, ...crossed] as number[])]
}
