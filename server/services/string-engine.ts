// The engine applied to a string as recorded: its condition, assessment and forecast.
import { conditionOf, engineInput, forecastInput } from '../../shared/string-status'
import { forecast } from '../../shared/engine/forecast'
import { assess } from '../../shared/engine/assess'
import type { StringType } from './strings'

export interface StringRecord {
  id: number
  lampsOut: number
  fuseFailed: number | boolean
  dark: number | boolean
  isolated: number | boolean
  lampAgeHours: number
}

/** Assessed at the string's own design supply: a 24 V curtain hangs on a 230 V circuit through its driver. */
export function stringAssessment(type: StringType, s: StringRecord) {
  return assess(engineInput(type, conditionOf(s), type.supplyVolts))
}

/** The engine's forecast request for a string as recorded now; seeded by the string's id so it is stable. */
export function stringForecastRequest(
  type: StringType,
  s: StringRecord,
  burnHoursPerDay: number,
  startDate: string,
  trials = 2000,
) {
  return forecastInput(type, conditionOf(s), {
    lampAgeHours: s.lampAgeHours,
    burnHoursPerDay,
    startDate,
    trials,
    seed: s.id,
  })
}

/** The engine's forecast for a string as recorded now (the string page's, 2,000 trials). */
export function stringForecast(...args: Parameters<typeof stringForecastRequest>) {
  return forecast(stringForecastRequest(...args))
}
