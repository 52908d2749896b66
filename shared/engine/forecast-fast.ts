// The forecast's hot loop for the commonest string: one series chain of one lamp class (e.g. 50
// mini-lamps). Same model as forecast-trials.ts, with what can be worked out before the trials
// tabulated: the exposure rate's inverse and 1/n by lamps left, the thresholds' power from
// tables (forecast-power.ts).
import { HORIZON_HOURS } from './defaults'
import type { ForecastSetup } from './forecast-setup'
import { power as powerFn, powerTable } from './forecast-power'
import type { TrialLog } from './forecast-summary'
import { nextExponential, nextUniform, type RandomState } from './random'

export function runOneClass(s: ForecastSetup, c: number, log: TrialLog, st: RandomState, reported: number) {
  const n0 = s.inCircuit[c]
  const table = s.rateTable!
  const base = c * s.tableWidth
  // Hours per rated-voltage hour and 1/n, by lamps left in circuit.
  const hoursPerExposure = new Float64Array(n0 + 1)
  const perLamp = new Float64Array(n0 + 1)
  for (let n = 1; n <= n0; n++) {
    hoursPerExposure[n] = 1 / table[base + n]
    perLamp[n] = 1 / n
  }
  const eta = s.eta[c]
  const age = s.age[c]
  const ageTerm = s.ageTerm[c]
  const unitShape = s.beta === 1
  const table1 = powerTable(1 / s.beta)
  // Module imports can compile to getters under some loaders: keep hot-loop names local.
  const power = powerFn
  const exponential = nextExponential
  const uniform = nextUniform
  const opens = s.opens[c] === 1
  const pOpen = s.pOpen
  const logKeep = Math.log(1 - pOpen)
  const horizon = HORIZON_HOURS
  const trials = log.trials
  for (let trial = 0; trial < trials; trial++) {
    let left = n0
    let u = ageTerm
    let exposure = 0
    let t = 0
    let failures = 0
    let darkAt = Infinity
    // Shunts that close before one opens: geometric, drawn once per trial instead of once per failure.
    let closing = pOpen > 0 ? Math.floor(Math.log(1 - uniform(st)) / logKeep) : Infinity
    for (;;) {
      // Rényi: the next order statistic of (E/η)^β is the last plus a unit exponential / lamps left.
      u += exponential(st) * perLamp[left]
      const next = eta * (unitShape ? u : power(table1, u)) - age
      t += (next - exposure) * hoursPerExposure[left]
      exposure = next
      if (t > horizon) break
      if (failures < reported) log.failure(failures, t)
      failures++
      left--
      if (left === 0 || opens || closing-- === 0) {
        darkAt = t
        break
      }
    }
    log.dark(trial, darkAt, c)
  }
}
