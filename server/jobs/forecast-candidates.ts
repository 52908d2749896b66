// Which strings the forecast refresh looks at: in one statement, those whose stored forecast is
// missing, made from other inputs (its key), too old, or whose curve the queue must re-judge as time
// passes (any chance of dark on it, a risk flag to clear, a patrol coming). The rest keep their
// forecast and cannot have changed their judgement: their curve is zero as far as it is read.
import type { Db } from '../db'
import { burnHoursPerDay } from '../../shared/schedule'
import { config } from '../config'
import { localDay } from '../../shared/local-time'
import { stringRecordColumns, type StringRecord } from '../services/string-engine'
import { forecastKeySql, type KeyedType } from './forecast-key'
import { curveAge, parseCurve, shareDarkBy, MAX_FORECAST_AGE_HOURS, type CurvePoint } from './forecast-curve'
import { riskWindow, type RiskWindow } from '../services/replace-risk'
import { UP_STATES } from '../services/queue/season'

/** Strings the risk rule judges: lit or watched ones, and those it flagged before (to clear them). */
export const judged = (r: { status: string; replaceRule: string | null }) =>
  r.status === 'lit' || r.status === 'watch' || r.replaceRule === 'risk'

// A stored forecast is made again between half and all of MAX_FORECAST_AGE_HOURS after it was made,
// spread by string id in 10-minute steps, so a town forecast at once is not all made again at once.
const SPREAD_STEPS = (MAX_FORECAST_AGE_HOURS * 6) / 2
const PAGE = 2000
const TOO_OLD = `s.forecast_at < date_sub(?, interval (${MAX_FORECAST_AGE_HOURS * 30} + mod(s.id, ?) * 10) minute)`

/** A string as the refresh reads it: its record, its client's clock and its stored forecast. */
export interface CandidateRow extends StringRecord {
  typeId: number
  assetTag: string
  status: string
  replaceRule: string | null
  siteId: number
  clientId: number
  switchOn: string
  switchOff: string
  timeZone: string | null
  responseStandardHours: number
  forecastKey: string | null
  forecastAt: Date | null
  forecastCurve: string | null
  keyNow: string
  tooOld: number | null
}

export interface Candidate {
  row: CandidateRow
  zone: string
  /** the client's today, where the forecast's dates count from */
  today: string
  burn: number
  window: RiskWindow | null
  /** the key of its inputs now */
  key: string
  /** the stored curve when it can still be read, else null (a new forecast is needed) */
  curve: CurvePoint[] | null
  /** burning hours since the stored forecast */
  age: number
}

export async function forecastCandidates(
  db: Db,
  types: Map<number, KeyedType>,
  patrols: Map<number, string[]>,
  now: Date,
  full: boolean,
): Promise<Candidate[]> {
  const key = forecastKeySql(types)
  // A forecast stamped after `now` was made for another clock (a test, a catch-up): made again. DATETIME
  // keeps whole seconds, so a second's grace.
  const ahead = new Date(now.getTime() + 1000)
  const page = (after: number, size: number) => {
    const q = db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .join('clients as c', 'c.id', 'si.clientId')
      .whereNotIn('s.status', ['dark', 'safe'])
      .whereNull('s.archivedAt')
      // A string in store or taken down burns no hours and needs no patrol: no forecast, no item.
      .whereIn('s.seasonState', UP_STATES)
      .select(
        ...stringRecordColumns('s'),
        's.assetTag',
        's.status',
        's.replaceRule',
        's.siteId',
        'si.clientId',
        'c.switchOn',
        'c.switchOff',
        'c.timeZone',
        'c.responseStandardHours',
        's.forecastKey',
        's.forecastAt',
        's.forecastCurve',
        db.raw(`${key.sql} as key_now`, key.bindings),
        db.raw(`${TOO_OLD} as too_old`, [now, SPREAD_STEPS]),
      )
    if (!full)
      q.where((w) =>
        w
          .whereNull('s.forecastKey')
          .orWhereNull('s.forecastAt')
          .orWhereRaw(`s.forecast_key <> ${key.sql}`, key.bindings)
          .orWhere('s.forecastAt', '>', ahead)
          .orWhereRaw(TOO_OLD, [now, SPREAD_STEPS])
          .orWhere('s.forecastWatch', true)
          .orWhere('s.replaceRule', 'risk')
          .orWhereIn('s.id', [...patrols.keys()]),
      )
    return q.where('s.id', '>', after).where('s.id', '<=', after + size) as Promise<CandidateRow[]>
  }
  // Working out a zone's today is slow (tens of microseconds): once per zone, not per string.
  const todays = new Map<string, string>()
  const todayIn = (zone: string) => todays.get(zone) ?? todays.set(zone, localDay(now, zone)).get(zone)!
  const out: Candidate[] = []
  // A page at a time: a town's rows read and worked through in one go would hold the event loop.
  // Pages are ranges of ids (read in key order, no sort), so a gap in the ids costs an empty page.
  // A refresh that is not full reads few rows (those out of step and those watched): one statement.
  const top = Number((await db('strings').max({ top: 'id' }).first())?.top ?? 0)
  const step = full ? PAGE : Math.max(top, 1)
  for (let after = 0; after < top; after += step) out.push(...(await page(after, step)).map(candidate))
  return out

  function candidate(r: CandidateRow): Candidate {
    const zone: string = r.timeZone || config.APP_TIME_ZONE
    const today = todayIn(zone)
    const burn = burnHoursPerDay(r.switchOn, r.switchOff)
    const window = judged(r)
      ? riskWindow(now, patrols.get(r.id), {
          switchOn: r.switchOn,
          zone,
          responseStandardHours: r.responseStandardHours,
          burnHoursPerDay: burn,
          today,
        })
      : null
    const age = curveAge(r.forecastAt, now, burn)
    const fresh =
      !full &&
      r.forecastKey === r.keyNow &&
      r.forecastAt &&
      new Date(r.forecastAt) <= ahead &&
      !Number(r.tooOld)
    let curve = fresh ? parseCurve(r.forecastCurve) : null
    // The curve must reach as far as the queue reads it: the 72 h item and the risk window.
    if (curve && shareDarkBy(curve, age + Math.max(72, window?.burningHours ?? 0)) === null) curve = null
    return { row: r, zone, today, burn, window, key: r.keyNow, curve, age }
  }
}
