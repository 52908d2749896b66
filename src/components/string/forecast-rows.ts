import type { ForecastResponse } from '../../../shared/schemas/engine'

export interface ForecastRow {
  /** 1 = the next failure */
  k: number
  hours: number
  date: string | null
  /** share of simulated runs in which this failure came before the string went dark */
  reached: number
}

// Failures that happened in too few runs have no meaningful mean; the engine reports null there.
export function forecastRows(f: ForecastResponse): ForecastRow[] {
  const rows: ForecastRow[] = []
  f.meanHoursToFailure.forEach((hours, i) => {
    if (hours === null) return
    rows.push({ k: i + 1, hours, date: f.dates?.failures[i] ?? null, reached: f.pReached[i] ?? 0 })
  })
  return rows
}
