// The forecast's model of one string, worked out once before the trials: each lamp class's life law
// and stress, and the chains with the lamps in circuit now.
import type { ForecastRequest } from '../schemas/engine'
import { DEFAULT_LIFE_EXPONENT, DEFAULT_SHUNT_FAIL_PROBABILITY, DEFAULT_WEIBULL_SHAPE } from './defaults'
import { currentWeights } from './series-share'
import { stringCondition, type StringCondition } from './string-condition'

export interface ForecastSetup {
  series: boolean
  supply: number
  beta: number
  pOpen: number
  /** classes per chain (the request's lamp classes) and chains simulated */
  classes: number
  chains: number
  /** a chain is dark now (or, in parallel, every lamp is out): nothing to simulate */
  darkNow: boolean
  /** lamps in circuit now, all chains together */
  litNow: number
  /** per class: Weibull scale η, age (exposure, rated-voltage hours), (age/η)^β, life exponent */
  eta: Float64Array
  age: Float64Array
  ageTerm: Float64Array
  lifeExponent: Float64Array
  /** per class: 1 when a failure opens its chain (fuse lamp, LED section; series only) */
  opens: Uint8Array
  /** per class: 1 for LED (no voltage acceleration: exposure rate 1) */
  led: Uint8Array
  /** per class: rated volts, I_rated^(1/0.55) (series-share.ts) and V_rated / that (its share of S) */
  ratedVolts: Float64Array
  weight: Float64Array
  share: Float64Array
  /** lamps in circuit now per chain and class, index chain × classes + class */
  inCircuit: Int32Array
  /** exposure rate per class in parallel (constant), or in series when the rate is tabulated */
  parallelRate: Float64Array
  /**
   * Series with one share for every class in circuit (equal V_rated / I_rated^k, e.g. equal ratings):
   * S = n · share, so each class's rate depends only on the n lamps left in its chain; index
   * class × (largest chain + 1) + n. Null when the classes' shares differ (rates solved per failure).
   */
  rateTable: Float64Array | null
  tableWidth: number
  /**
   * Series without a table: rate_c = (V/S)^d_c · w_c^−d_c, one power per distinct exponent per
   * failure. `exponents` lists the distinct d, `exponentOf[c]` points into it, `rateScale[c]` = w_c^−d_c.
   */
  exponents: Float64Array
  exponentOf: Int32Array
  rateScale: Float64Array
}

/**
 * Chains as assess sees them (string-condition.ts: `lamps` is one chain; failures are counted over the
 * whole string and fill the first chains — failed, then opened, then removed). A chain already out (a
 * fuse lamp or LED section failed, a shunt open, a lamp removed, every lamp failed) is left out: the
 * forecast follows the chains still lit, and the string counts as dark when the first of them goes
 * out. With no chain lit the string is dark now. In parallel every lamp of every chain sees the full
 * supply: the string is one pool of lamps.
 */
export function forecastSetup(input: ForecastRequest): ForecastSetup {
  const series = (input.wiring ?? 'series') === 'series'
  const lamps = input.lamps
  const C = lamps.length
  const branches = Math.max(1, Math.floor(input.branches ?? 1))
  const condition = stringCondition(input.supplyVolts, lamps, series ? 'series' : 'parallel', branches)
  const lit = litChains(condition, lamps, series, input.technology)
  const chains = lit.length
  const beta = input.weibullShape ?? DEFAULT_WEIBULL_SHAPE
  const supply = input.supplyVolts
  const s: ForecastSetup = {
    series,
    supply,
    beta,
    pOpen: input.shuntFailProbability ?? DEFAULT_SHUNT_FAIL_PROBABILITY,
    classes: C,
    chains,
    darkNow: chains === 0,
    litNow: 0,
    eta: new Float64Array(C),
    age: new Float64Array(C),
    ageTerm: new Float64Array(C),
    lifeExponent: new Float64Array(C),
    opens: new Uint8Array(C),
    led: new Uint8Array(C),
    ratedVolts: Float64Array.from(lamps, (k) => k.ratedVolts),
    weight: Float64Array.from(currentWeights(lamps)),
    share: new Float64Array(C),
    inCircuit: new Int32Array(Math.max(1, chains) * C),
    parallelRate: new Float64Array(C),
    rateTable: null,
    tableWidth: 0,
    exponents: new Float64Array(0),
    exponentOf: new Int32Array(C),
    rateScale: new Float64Array(C),
  }
  for (let c = 0; c < C; c++) {
    const k = lamps[c]
    const led = (k.technology ?? input.technology ?? 'filament') === 'led'
    s.led[c] = led ? 1 : 0
    // LED light output is driver-regulated: no acceleration from the supply (exponent 0).
    s.lifeExponent[c] = led ? 0 : (k.lifeExponent ?? input.lifeExponent ?? DEFAULT_LIFE_EXPONENT)
    // Rated life is the median (LRC NLPIP glossary; for LED the L70 or stated life taken as the
    // median): η = L / (ln 2)^(1/β).
    s.eta[c] = (k.ratedLifeHours ?? input.ratedLifeHours) / Math.LN2 ** (1 / beta)
    s.age[c] = k.ageHours ?? input.lampAgeHours ?? 0
    s.ageTerm[c] = (s.age[c] / s.eta[c]) ** beta
    s.opens[c] = series && (k.shunted === false || led) ? 1 : 0
    s.share[c] = k.ratedVolts / s.weight[c]
    s.parallelRate[c] = led ? 1 : (supply / k.ratedVolts) ** s.lifeExponent[c]
  }
  lit.forEach((chain, h) => s.inCircuit.set(chain, h * C))
  let widest = 0
  for (let h = 0; h < chains; h++) {
    let n = 0
    for (let c = 0; c < C; c++) n += s.inCircuit[h * C + c]
    widest = Math.max(widest, n)
    s.litNow += n
  }
  if (series && !s.darkNow) tabulate(s, widest)
  const distinct = [...new Set(s.lifeExponent)]
  s.exponents = Float64Array.from(distinct)
  for (let c = 0; c < C; c++) {
    s.exponentOf[c] = distinct.indexOf(s.lifeExponent[c])
    s.rateScale[c] = s.weight[c] ** -s.lifeExponent[c]
  }
  return s
}

// With one share among the classes in circuit, S = n · share and the ratio of class c is
// V / (n · V_rated,c): the proportional share of trade-reference §2, the same for every class of
// one rated current. Tabulated once instead of a power per failure.
function tabulate(s: ForecastSetup, widest: number) {
  const C = s.classes
  let first = -1
  for (let c = 0; c < C; c++) {
    let lit = false
    for (let h = 0; h < s.chains; h++) if (s.inCircuit[h * C + c] > 0) lit = true
    if (!lit) continue
    if (first < 0) first = c
    else if (s.share[c] !== s.share[first]) return
  }
  const width = widest + 1
  const table = new Float64Array(C * width)
  for (let c = 0; c < C; c++) {
    for (let n = 1; n < width; n++)
      table[c * width + n] = s.led[c] ? 1 : (s.supply / (n * s.ratedVolts[c])) ** s.lifeExponent[c]
  }
  s.rateTable = table
  s.tableWidth = width
}

/** Lamps in circuit per class in each chain still lit (series), or the one pool (parallel). */
function litChains(
  condition: StringCondition,
  lamps: ForecastRequest['lamps'],
  series: boolean,
  technology: ForecastRequest['technology'],
): number[][] {
  const out: number[][] = []
  for (const chain of condition.chains) {
    if (chain.dark) continue
    // A failed LED section puts its series chain out like an unshunted lamp (assess counts it apart).
    const isLed = (i: number) => (lamps[i].technology ?? technology) === 'led'
    if (series && lamps.some((k, i) => isLed(i) && chain.inCircuit[i] < k.count)) continue
    for (let w = 0; w < chain.weight; w++) out.push(chain.inCircuit)
  }
  return out
}
