import type { ForecastRequest, ForecastResponse } from '../schemas/engine'
import { DEFAULT_LIFE_EXPONENT, DEFAULT_SEED, DEFAULT_TRIALS, MAX_TRIALS } from './defaults'
import { runOneClass } from './forecast-fast'
import { forecastSetup } from './forecast-setup'
import { summarise, TrialLog } from './forecast-summary'
import { runTrials } from './forecast-trials'
import { randomState } from './random'

const MAX_REPORTED_FAILURES = 10

/**
 * Monte Carlo forecast of the failure cascade from now, in burning hours (model in
 * forecast-trials.ts). Each class's lamps start from their exposure (`ageHours`, else the request's
 * `lampAgeHours`): hours at rated voltage, not raw burning hours (see `addExposure`). With several
 * chains (`branches`) the string counts as dark when its first chain goes out: part of the display
 * is out and needs a visit. Chains out already are left out (forecast-setup.ts); failures are
 * counted over the chains still lit.
 */
export function forecast(input: ForecastRequest): ForecastResponse {
  const trials = Math.min(MAX_TRIALS, Math.max(1, Math.floor(input.trials ?? DEFAULT_TRIALS)))
  const setup = forecastSetup(input)
  const reported = Math.min(MAX_REPORTED_FAILURES, setup.litNow)
  const log = new TrialLog(trials, reported, setup.classes, setup.darkNow)
  if (!setup.darkNow) {
    const st = randomState(input.seed ?? DEFAULT_SEED)
    const lit: number[] = []
    for (let g = 0; g < setup.inCircuit.length; g++) if (setup.inCircuit[g] > 0) lit.push(g)
    if (setup.series && lit.length === 1 && setup.rateTable) runOneClass(setup, lit[0], log, st, reported)
    else runTrials(setup, log, st, reported)
  }
  return summarise(input, log)
}

/**
 * Exposure after `burningHours` more hours at the ratios in force (cumulative exposure, W. Nelson,
 * IEEE Trans. Reliability, 1980): each class gains h × r^d rated-voltage hours. A class with ratio 0
 * (out of circuit, or the string dark) gains nothing; pass exponent 0 for an LED class (driver-
 * regulated: it ages by plain hours, h × 1).
 */
export function addExposure(
  exposure: readonly number[],
  burningHours: number,
  ratios: readonly number[],
  lifeExponents: readonly number[],
): number[] {
  const h = Math.max(0, burningHours)
  return exposure.map((e, i) => {
    const r = ratios[i] ?? 0
    return r > 0 ? e + h * r ** (lifeExponents[i] ?? DEFAULT_LIFE_EXPONENT) : e
  })
}
