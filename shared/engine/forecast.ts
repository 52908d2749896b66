import type { ForecastRequest, ForecastResponse } from '../schemas/engine'
import {
  DEFAULT_LIFE_EXPONENT,
  DEFAULT_SEED,
  DEFAULT_SHUNT_FAIL_PROBABILITY,
  DEFAULT_TRIALS,
  DEFAULT_WEIBULL_SHAPE,
  HORIZON_HOURS,
  MAX_TRIALS,
} from './defaults'
import { createRandom, maxOfUnitExponentials, unitExponential } from './random'
import { summarise } from './forecast-summary'
import { stringCondition } from './string-condition'

const MAX_REPORTED_FAILURES = 10

// Monte Carlo forecast of the failure cascade from now, in burning hours.
//
// Cumulative-exposure model (W. Nelson, IEEE Trans. Reliability, 1980): a lamp run at ratio r
// accumulates "rated-voltage hours" at rate r^d (life ∝ r^−d) and fails when its exposure reaches a
// threshold E drawn once from the rated-voltage life law, Weibull with shape β and median = rated
// life. Lamps of one class share one stress, so only the order of their thresholds matters: we draw
// them already sorted, lazily, by the Rényi representation of exponential order statistics applied to
// (E/η)^β, which is unit exponential. Conditioning on age a just adds (a/η)^β.
export function forecast(input: ForecastRequest): ForecastResponse {
  const wiring = input.wiring ?? 'series'
  const beta = input.weibullShape ?? DEFAULT_WEIBULL_SHAPE
  const d = input.lifeExponent ?? DEFAULT_LIFE_EXPONENT
  const pOpen = input.shuntFailProbability ?? DEFAULT_SHUNT_FAIL_PROBABILITY
  const trials = Math.min(MAX_TRIALS, Math.max(1, Math.floor(input.trials ?? DEFAULT_TRIALS)))
  const random = createRandom(input.seed ?? DEFAULT_SEED)
  const lamps = input.lamps
  const condition = stringCondition(input.supplyVolts, lamps, wiring)
  const litNow = condition.dark ? 0 : condition.inCircuit.reduce((a, b) => a + b, 0)
  const reported = Math.min(MAX_REPORTED_FAILURES, litNow)

  const C = lamps.length
  const eta = new Float64Array(C)
  const ageTerm = new Float64Array(C)
  const age = new Float64Array(C)
  const rate = new Float64Array(C)
  for (let c = 0; c < C; c++) {
    // Rated life is the median (LRC NLPIP glossary): η = L / (ln 2)^(1/β).
    eta[c] = (lamps[c].ratedLifeHours ?? input.ratedLifeHours) / Math.LN2 ** (1 / beta)
    age[c] = lamps[c].ageHours ?? input.lampAgeHours ?? 0
    ageTerm[c] = (age[c] / eta[c]) ** beta
    // Parallel lamps keep the full supply whatever fails; series rates are reset per trial below.
    rate[c] = condition.ratios[c] > 0 ? condition.ratios[c] ** d : 0
  }

  const series = wiring === 'series'
  const supply = input.supplyVolts
  const ratedVolts = Float64Array.from(lamps, (c) => c.ratedVolts)
  const opensOnFailure = Uint8Array.from(lamps, (c) => (c.shunted === false ? 1 : 0))
  // Thresholds use exp(log(u)/β) rather than u ** (1/β): the same value at about half the cost in V8.
  const invBeta = 1 / beta
  // Module imports can compile to getters under some loaders: keep hot-loop names local.
  const horizon = HORIZON_HOURS
  const exponential = unitExponential
  const largestExponential = maxOfUnitExponentials
  const logKeep = Math.log(1 - pOpen)
  const left = new Int32Array(C)
  const unitSum = new Float64Array(C)
  const nextAt = new Float64Array(C)
  const exposed = new Float64Array(C)
  const meanK = new Float64Array(reported)
  const m2 = new Float64Array(reported)
  const reached = new Int32Array(reported)
  const darkAt = new Float64Array(trials).fill(condition.dark ? 0 : Infinity)
  // With one rating in circuit the series stress depends only on how many lamps remain: tabulate it
  // once instead of a power per failure.
  const firstLit = Math.max(
    0,
    condition.inCircuit.findIndex((n) => n > 0),
  )
  const firstRating = lamps[firstLit].ratedVolts
  const oneRating = lamps.every((c, i) => condition.inCircuit[i] === 0 || c.ratedVolts === firstRating)
  const rateByRemaining = Float64Array.from({ length: litNow + 1 }, (_, n) =>
    n > 0 ? (supply / (n * firstRating)) ** d : 0,
  )
  const drawNext = (c: number) => {
    unitSum[c] += exponential(random) / left[c]
    const u = ageTerm[c] + unitSum[c]
    nextAt[c] = eta[c] * (beta === 1 ? u : Math.exp(Math.log(u) * invBeta)) - age[c]
  }

  // Parallel lamps never interact, so once the reported failures are in, the string goes dark when
  // each class's last lamp fails. By memorylessness the lamps left in a class lie beyond its latest
  // order statistic by independent unit exponentials, whose largest we draw in one go. The class
  // that just failed (`justFailed`) has not drawn its next threshold; the others have (their minimum).
  const lastFailure = (justFailed: number, t: number) => {
    let last = t
    for (let c = 0; c < C; c++) {
      const beyond = c === justFailed ? left[c] : left[c] - 1
      if (left[c] === 0) continue
      const u = ageTerm[c] + unitSum[c] + (beyond > 0 ? largestExponential(random, beyond) : 0)
      const threshold = eta[c] * (beta === 1 ? u : Math.exp(Math.log(u) * invBeta)) - age[c]
      last = Math.max(last, t + (threshold - exposed[c]) / rate[c])
    }
    return last > horizon ? Infinity : last
  }

  for (let trial = 0; trial < trials && !condition.dark; trial++) {
    let ratedSum = 0
    let remaining = litNow
    for (let c = 0; c < C; c++) {
      left[c] = condition.inCircuit[c]
      unitSum[c] = 0
      exposed[c] = 0
      ratedSum += ratedVolts[c] * left[c]
      if (left[c] > 0) drawNext(c)
    }
    let t = 0
    let failures = 0
    // Shunts that close before one opens: geometric, drawn once per trial instead of once per failure.
    let closingShunts = pOpen > 0 ? Math.floor(Math.log(1 - random()) / logKeep) : Infinity
    for (;;) {
      if (series) {
        const f = oneRating ? rateByRemaining[remaining] : (supply / ratedSum) ** d
        for (let c = 0; c < C; c++) rate[c] = f
      }
      let next = -1
      let dt = Infinity
      for (let c = 0; c < C; c++) {
        if (left[c] === 0) continue
        const gap = (nextAt[c] - exposed[c]) / rate[c]
        if (gap < dt) {
          dt = gap
          next = c
        }
      }
      t += dt
      if (t > horizon) break
      for (let c = 0; c < C; c++) exposed[c] += rate[c] * dt
      left[next]--
      remaining--
      if (failures < reported) {
        // Welford's running mean and variance: stable for long times and many trials.
        const n = ++reached[failures]
        const delta = t - meanK[failures]
        meanK[failures] += delta / n
        m2[failures] += delta * (t - meanK[failures])
      }
      failures++
      // A fuse lamp fails open by design, a shunted one when its shunt does not close; in parallel a
      // failure leaves the rest as they were.
      if (remaining === 0 || (series && (opensOnFailure[next] === 1 || closingShunts-- === 0))) {
        darkAt[trial] = t
        break
      }
      if (!series && failures >= reported) {
        darkAt[trial] = lastFailure(next, t)
        break
      }
      ratedSum -= ratedVolts[next]
      if (left[next] > 0) drawNext(next)
    }
  }
  return summarise(input, trials, reached, meanK, m2, darkAt)
}
