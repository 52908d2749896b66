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
import { syncStringQueue } from './queue/strings'

export interface RiskWindow {
  /** Burning hours until someone is due to pass. */
  burningHours: number
  /** e.g. "before the next patrol on 4 Dec", "within the 36 h response time". */
  label: string
}

/** The earliest published runs, from `fromDay` on, with a stop for each string not yet done. */
export async function nextPatrolDays(db: Db, stringIds: number[], fromDay: string) {
  const out = new Map<number, string[]>()
  for (let i = 0; i < stringIds.length; i += 1000) {
    const rows = await db('runStops as rs')
      .join('runs as r', 'r.id', 'rs.runId')
      .where('r.state', 'published')
      .where('r.runDate', '>=', fromDay)
      .whereNull('rs.doneAt')
      .whereIn('rs.stringId', stringIds.slice(i, i + 1000))
      .orderBy('r.runDate')
      .select('rs.stringId', 'r.runDate')
    for (const r of rows) out.set(r.stringId, [...(out.get(r.stringId) ?? []), String(r.runDate)])
  }
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
  c: { switchOn: string; zone: string; responseStandardHours: number; burnHoursPerDay: number },
): RiskWindow {
  const today = localDay(now, c.zone)
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
 * string's status afterwards.
 */
export async function applyRiskRule(db: Db, outcomes: RiskOutcome[], now = new Date()) {
  const statusAfter = new Map<number, string>()
  for (const o of outcomes) {
    const fires = o.p !== null && o.threshold !== null && o.p > o.threshold
    if (fires && (o.status === 'lit' || o.status === 'watch')) {
      await db('strings')
        .where({ id: o.id })
        .whereIn('status', ['lit', 'watch'])
        .update({
          status: 'replace',
          replaceNow: true,
          replaceRule: 'risk',
          riskNote: riskNote(o.p!, o.window),
        })
      await syncStringQueue(db, o.id, null, now)
      statusAfter.set(o.id, 'replace')
    } else if (!fires && o.replaceRule === 'risk') {
      const s = await db('strings').where({ id: o.id }).first()
      const { status, replaceNow, result } = stringStatus(await loadType(db, s.typeId), conditionOf(s))
      await db('strings')
        .where({ id: o.id, replaceRule: 'risk' })
        .update({
          status,
          replaceNow,
          replaceRule: replaceNow ? 'ratio' : null,
          riskNote: null,
          maxRatio: result.maxRatio,
        })
      await syncStringQueue(db, o.id, null, now)
      statusAfter.set(o.id, status)
    }
  }
  return statusAfter
}
