// Replace now by risk (issue 11 part 5): a string is also flagged when the forecast's chance of it going
// dark before anyone is due to pass exceeds its type's setting (default 20 %, our judgement). "Due to
// pass" is its next planned patrol (the earliest published run, from the client's today, with a stop
// for it not yet done) or else the client's standard response time.
import type { Db } from '../db'
import { DEFAULT_REPLACE_RISK } from '../../shared/engine/defaults'
import { forecastInstant, localDay } from '../../shared/local-time'
import { isoDay } from '../../shared/iso-time'
import { conditionOf, stringStatus } from '../../shared/string-status'
import { loadType } from './strings'
import { syncStringItems } from './queue/string-items'
import { updateById } from './update-by-id'

export interface RiskWindow {
  /** Burning hours until someone is due to pass. */
  burningHours: number
  /** e.g. "before the next patrol on 4 Dec", "within the 36 h response time". */
  label: string
}

/**
 * The earliest published runs, from `fromDay` on, with a stop for each string not yet done: for the
 * strings given, or (null) for every string with such a stop.
 */
export async function nextPatrolDays(db: Db, stringIds: number[] | null, fromDay: string) {
  const out = new Map<number, string[]>()
  const query = (ids: number[] | null) => {
    const q = db('runStops as rs')
      .join('runs as r', 'r.id', 'rs.runId')
      .where('r.state', 'published')
      .where('r.runDate', '>=', fromDay)
      .whereNull('rs.doneAt')
      .whereNotNull('rs.stringId')
      .orderBy('r.runDate')
      .select('rs.stringId', 'r.runDate')
    return ids ? q.whereIn('rs.stringId', ids) : q
  }
  const chunks = stringIds
    ? Array.from({ length: Math.ceil(stringIds.length / 1000) }, (_, i) =>
        stringIds.slice(i * 1000, i * 1000 + 1000),
      )
    : [null]
  for (const ids of chunks)
    for (const r of await query(ids)) out.set(r.stringId, [...(out.get(r.stringId) ?? []), String(r.runDate)])
  return out
}

const dayLabel = (day: string) =>
  new Date(`${day}T12:00:00Z`).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'short',
    timeZone: 'UTC',
  })

/**
 * The time the risk is judged over, in burning hours: wall-clock hours until the next patrol's
 * switch-on (or the response time) × the client's burning hours a night / 24, the same average the
 * exposure uses. A run tonight that has started already leaves no time at risk.
 */
export function riskWindow(
  now: Date,
  patrolDays: string[] | undefined,
  c: {
    switchOn: string
    zone: string
    responseStandardHours: number
    burnHoursPerDay: number
    /** the client's today, when the caller has it (the refresh works it out once per zone) */
    today?: string
  },
): RiskWindow {
  const today = c.today ?? localDay(now, c.zone)
  const day = patrolDays?.find((d) => d >= today)
  const wallHours = day
    ? Math.max(0, (forecastInstant(day, c.switchOn, c.zone).getTime() - now.getTime()) / 3_600_000)
    : c.responseStandardHours
  const burningHours = Math.round(((wallHours * c.burnHoursPerDay) / 24) * 10) / 10
  const label = day
    ? `before the next patrol on ${dayLabel(day)}`
    : `within the ${c.responseStandardHours} h response time`
  return { burningHours, label }
}

/** The first day runs are looked for: yesterday in UTC covers every zone's today. */
export const patrolSearchFrom = (now: Date) => isoDay(now.getTime() - 86_400_000)

export interface RiskOutcome {
  id: number
  /** the string's status and rule before this judgement */
  status: string
  replaceRule: string | null
  /** chance of going dark within the window; null when the forecast did not report it */
  p: number | null
  threshold: number | null
  window: RiskWindow
}

export const riskThreshold = (replaceRisk: number | null | undefined) => replaceRisk ?? DEFAULT_REPLACE_RISK

/** The note the queue and the string page show when the risk rule fires. */
export const riskNote = (p: number, w: RiskWindow) =>
  `forecast: ${Math.round(p * 100)} % chance of going dark ${w.label}`

/**
 * Applies the risk rule: a lit or watched string over its threshold becomes replace now (rule 'risk');
 * one flagged by risk that no longer is goes back to the state its lamps' ratios give. Answers each
 * changed string's status afterwards; their queue items follow in the same few statements.
 */
export async function applyRiskRule(db: Db, outcomes: RiskOutcome[], now = new Date()) {
  const statusAfter = new Map<number, string>()
  const fires = (o: RiskOutcome) => o.p !== null && o.threshold !== null && o.p > o.threshold
  const flagged = outcomes.filter((o) => fires(o) && (o.status === 'lit' || o.status === 'watch'))
  const cleared = outcomes.filter((o) => !fires(o) && o.replaceRule === 'risk')
  await updateById(
    db,
    'strings',
    flagged.map((o) => ({ id: o.id, riskNote: riskNote(o.p!, o.window) })),
    ['riskNote'],
    {
      same: { status: 'replace', replaceNow: true, replaceRule: 'risk' },
      also: "status in ('lit', 'watch')",
    },
  )
  for (const o of flagged) statusAfter.set(o.id, 'replace')
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  const rows: {
    id: number
    status: string
    replaceNow: boolean
    replaceRule: string | null
    maxRatio: number
  }[] = []
  for (let i = 0; i < cleared.length; i += 1000) {
    for (const s of await db('strings').whereIn(
      'id',
      cleared.slice(i, i + 1000).map((o) => o.id),
    )) {
      if (!types.has(s.typeId)) types.set(s.typeId, await loadType(db, s.typeId))
      const { status, replaceNow, result } = stringStatus(types.get(s.typeId)!, conditionOf(s))
      rows.push({
        id: s.id,
        status,
        replaceNow,
        replaceRule: replaceNow ? 'ratio' : null,
        maxRatio: result.maxRatio,
      })
      statusAfter.set(s.id, status)
    }
  }
  await updateById(db, 'strings', rows, ['status', 'replaceNow', 'replaceRule', 'maxRatio'], {
    same: { riskNote: null },
    also: "replace_rule = 'risk'",
  })
  await syncStringItems(db, [...statusAfter.keys()], now)
  return statusAfter
}
