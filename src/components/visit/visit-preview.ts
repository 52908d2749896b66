// What a visit does to a string's recorded condition, computed on the phone with the same engine the
// server uses (shared/string-status.ts), so the preview holds offline and matches the server's answer.
import { assess, forecast, lifePhrase, percent } from '../../../shared/engine'
import type { Reason } from '../../../shared/engine/reason-codes'
import { DEFAULT_SEED } from '../../../shared/engine/defaults'
import { assessmentView, isLiveSocket, toReason } from '../string/assessment-view'
import { localDay } from '../../../shared/local-time'
import { appTimeZone } from '../../dates'
import {
  engineInput,
  forecastInput,
  type LifeSpec,
  stringStatus,
  type Condition,
  type TypeSpec,
} from '../../../shared/string-status'
import type { StringStatus } from '../../../shared/vocab/string-states'

export interface StatePreview {
  status: StringStatus
  lampsOut: number
  /** "120 %" of the lamps' rated voltage, or null when nothing is lit. */
  ofRating: string | null
  /** "about 10 % of normal"; null when nothing is lit or the lamp laws do not hold there. */
  life: string | null
  firstReason: Reason | null
  /** A socket can be live (a live-socket reason, or lamps out on a series string): show the caution. */
  caution: boolean
  /** The same at the supply voltage measured on site, when it differs from the nominal. */
  atMeasured: { volts: number; ofRating: string; life: string } | null
}

function hottest(raw: ReturnType<typeof assess>, type: TypeSpec) {
  const view = assessmentView(raw, type.supplyVolts, type.classes)
  let best: (typeof view.classes)[number] | null = null
  for (const c of view.classes) if (c.lampsLit > 0 && (!best || c.ratio > best.ratio)) best = c
  return best
}

const lifeOf = (c: { lifeFactor: number | null }) => (c.lifeFactor === null ? null : lifePhrase(c.lifeFactor))

export function previewState(type: TypeSpec, cond: Condition, measuredVolts?: number): StatePreview {
  const { status, result } = stringStatus(type, cond)
  const reasons = (result.reasons as (string | Reason)[]).map(toReason)
  const hot = result.lit ? hottest(result, type) : null
  let atMeasured: StatePreview['atMeasured'] = null
  if (measuredVolts && result.lit && Math.abs(measuredVolts - type.supplyVolts) >= 1) {
    const m = assess(engineInput(type, cond, measuredVolts))
    const mHot = hottest(m, type)
    if (mHot)
      atMeasured = {
        volts: measuredVolts,
        ofRating: percent(mHot.ratio),
        life: lifeOf(mHot) ?? 'not given: outside the lamp laws',
      }
  }
  return {
    status,
    lampsOut: cond.lampsOut,
    ofRating: hot ? percent(hot.ratio) : null,
    // An LED driver holds its current: the supply does not shorten the LEDs' life (engine: led_in_range).
    life: hot ? (type.technology === 'led' ? 'rated life' : lifeOf(hot)) : null,
    firstReason: reasons[0] ?? null,
    caution:
      reasons.some(isLiveSocket) ||
      (type.wiring === 'series' && (cond.lampsOut > 0 || cond.fuseFailed || cond.dark) && !cond.isolated),
    atMeasured,
  }
}

export interface ForecastPreview {
  nextFailure: string | null
  dark: string | null
  pDark72: number
}

/** The cascade forecast after the visit, on the phone: fewer trials than the server, same model and seed (the engine's one seed). */
export function previewForecast(
  d: {
    type: LifeSpec
    lampAgeHours: number
    /** Rated-voltage hours per lamp class, brought up to now by the server (absent on an older saved page). */
    lampExposure?: number[]
    schedule: { burnHoursPerDay: number }
  },
  cond: Condition,
  today = new Date(),
): ForecastPreview | null {
  if (cond.isolated || cond.dark) return null
  const fc = forecast(
    forecastInput(d.type, cond, {
      lampAgeHours: d.lampAgeHours,
      exposure: d.lampExposure,
      burnHoursPerDay: d.schedule.burnHoursPerDay,
      startDate: localDay(today, appTimeZone()),
      trials: 600,
      seed: DEFAULT_SEED,
    }),
  )
  return {
    nextFailure: fc.dates?.failures[0] ?? null,
    dark: fc.dates?.medianDark ?? null,
    pDark72: fc.pDark.find((p) => p.hours === 72)?.p ?? 0,
  }
}

/** "no lamps out", "1 lamp out", "3 lamps out" */
export function lampsOutText(n: number): string {
  return n === 0 ? 'no lamps out' : n === 1 ? '1 lamp out' : `${n} lamps out`
}
