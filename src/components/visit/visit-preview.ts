// What a visit does to a string's recorded condition, computed on the phone with the same engine the
// server uses (shared/string-status.ts), so the preview holds offline and matches the server's answer.
import { assess, forecast, lifePhrase, percent } from '../../../shared/engine'
import { localDay } from '../../../shared/local-time'
import { appTimeZone } from '../../dates'
import {
  engineInput,
  forecastInput,
  type LifeSpec,
  stringStatus,
  type Condition,
  type StringStatus,
  type TypeSpec,
} from '../../../shared/string-status'

export interface StatePreview {
  status: StringStatus
  lampsOut: number
  /** "120 %" of the lamps' rated voltage, or null when nothing is lit. */
  ofRating: string | null
  /** "about 10 % of normal" */
  life: string | null
  firstReason: string | null
  /** The same at the supply voltage measured on site, when it differs from the nominal. */
  atMeasured: { volts: number; ofRating: string; life: string } | null
}

function hottest(result: ReturnType<typeof assess>) {
  let best: (typeof result.classes)[number] | null = null
  for (const c of result.classes) if (c.lampsInCircuit > 0 && (!best || c.ratio > best.ratio)) best = c
  return best
}

export function previewState(type: TypeSpec, cond: Condition, measuredVolts?: number): StatePreview {
  const { status, result } = stringStatus(type, cond)
  const hot = result.lit ? hottest(result) : null
  let atMeasured: StatePreview['atMeasured'] = null
  if (measuredVolts && result.lit && Math.abs(measuredVolts - type.supplyVolts) >= 1) {
    const m = assess(engineInput(type, cond, measuredVolts))
    const mHot = hottest(m)
    if (mHot)
      atMeasured = { volts: measuredVolts, ofRating: percent(mHot.ratio), life: lifePhrase(mHot.lifeFactor) }
  }
  return {
    status,
    lampsOut: cond.lampsOut,
    ofRating: hot ? percent(hot.ratio) : null,
    life: hot ? lifePhrase(hot.lifeFactor) : null,
    firstReason: result.reasons[0] ?? null,
    atMeasured,
  }
}

export interface ForecastPreview {
  nextFailure: string | null
  dark: string | null
  pDark72: number
}

/** The cascade forecast after the visit, on the phone: fewer trials than the server, same model and seed. */
export function previewForecast(
  d: { id: number; type: LifeSpec; lampAgeHours: number; schedule: { burnHoursPerDay: number } },
  cond: Condition,
  today = new Date(),
): ForecastPreview | null {
  if (cond.isolated || cond.dark) return null
  const fc = forecast(
    forecastInput(d.type, cond, {
      lampAgeHours: d.lampAgeHours,
      burnHoursPerDay: d.schedule.burnHoursPerDay,
      startDate: localDay(today, appTimeZone()),
      trials: 600,
      seed: d.id,
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
