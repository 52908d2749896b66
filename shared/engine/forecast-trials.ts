// The forecast's trials for any string: several lamp classes, several chains, series or parallel.
//
// Cumulative-exposure model (W. Nelson, IEEE Trans. Reliability, 1980): a lamp at ratio r gains
// rated-voltage hours at r^d per burning hour and fails when its exposure reaches a threshold drawn
// once from its class's life law. Lamps of one class in one chain share one stress, so only the order
// of their thresholds matters: they are drawn already sorted, one at a time (Rényi representation of
// exponential order statistics applied to (E/η)^β, which is unit exponential; age a adds (a/η)^β).
// Each (chain, class) group keeps its exposure at the last change of its rate; a failure changes the
// rates of its own chain only (series: S loses the lamp's share, series-share.ts), so a step costs
// the chains plus the classes, not every lamp. A class, not closures, so V8 inlines the steps.
import { HORIZON_HOURS } from './defaults'
import type { ForecastSetup } from './forecast-setup'
import { power as powerOf, powerTable, type PowerTable } from './forecast-power'
import type { TrialLog } from './forecast-summary'
import * as random from './random'

// Some loaders turn imported names into getters: plain module constants keep the hot calls inlinable.
const power = powerOf
const nextExponential = random.nextExponential
const nextMaxExponential = random.nextMaxExponential
const nextUniform = random.nextUniform
const HORIZON = HORIZON_HOURS

export function runTrials(s: ForecastSetup, log: TrialLog, st: random.RandomState, reported: number) {
  new Trials(s, st).run(log, reported)
}

class Trials {
  readonly C: number
  readonly H: number
  readonly shape: PowerTable
  readonly unitShape: boolean
  // per group (chain × classes + class)
  readonly left: Int32Array
  readonly unitSum: Float64Array
  readonly nextAt: Float64Array // exposure at the group's next failure
  readonly expAt: Float64Array // exposure when its rate last changed (tRate)
  readonly tRate: Float64Array
  readonly rate: Float64Array
  // per chain
  readonly chainLeft: Int32Array
  readonly chainS: Float64Array
  readonly chainNextT: Float64Array
  readonly chainNextG: Int32Array
  // (V/S)^d per distinct exponent, for the chain being re-stressed
  readonly factor: Float64Array
  // how the last trial ended: when it went dark (Infinity: not within the horizon) and by which class
  lastAt = Infinity
  lastClass = -1

  constructor(
    readonly s: ForecastSetup,
    readonly st: random.RandomState,
  ) {
    this.C = s.classes
    this.H = s.chains
    const G = this.C * this.H
    this.shape = powerTable(1 / s.beta)
    this.unitShape = s.beta === 1
    ;[this.unitSum, this.nextAt, this.expAt, this.tRate, this.rate] = [0, 0, 0, 0, 0].map(
      () => new Float64Array(G),
    )
    this.left = new Int32Array(G)
    this.factor = new Float64Array(s.exponents.length)
    ;[this.chainS, this.chainNextT] = [new Float64Array(this.H), new Float64Array(this.H)]
    ;[this.chainLeft, this.chainNextG] = [new Int32Array(this.H), new Int32Array(this.H)]
  }

  threshold(c: number, u: number): number {
    const s = this.s
    return s.eta[c] * (this.unitShape ? u : power(this.shape, u)) - s.age[c]
  }

  drawNext(g: number, c: number) {
    const s = this.s
    const sum = (this.unitSum[g] += nextExponential(this.st) / this.left[g])
    const u = s.ageTerm[c] + sum
    this.nextAt[g] = s.eta[c] * (this.unitShape ? u : power(this.shape, u)) - s.age[c]
  }

  /** Chain h's rates from time t on, its groups' next failure times and the earliest of them. */
  restress(h: number, t: number) {
    const { s, C, left, expAt, tRate, rate, nextAt, factor } = this
    const table = s.rateTable
    if (s.series && table === null) {
      const vs = s.supply / this.chainS[h]
      for (let k = 0; k < factor.length; k++) factor[k] = vs ** s.exponents[k]
    }
    let best = Infinity
    let bestG = -1
    for (let c = 0, g = h * C; c < C; c++, g++) {
      if (left[g] === 0) continue
      const r = !s.series
        ? s.parallelRate[c]
        : table !== null
          ? table[c * s.tableWidth + this.chainLeft[h]]
          : s.led[c] === 1
            ? 1
            : factor[s.exponentOf[c]] * s.rateScale[c]
      expAt[g] += rate[g] * (t - tRate[g])
      tRate[g] = t
      rate[g] = r
      const tn = t + (nextAt[g] - expAt[g]) / r
      if (tn < best) {
        best = tn
        bestG = g
      }
    }
    this.chainNextT[h] = best
    this.chainNextG[h] = bestG
  }

  /**
   * Parallel lamps never interact, so once the reported failures are in, the string goes dark when
   * each class's last lamp fails. By memorylessness the lamps left in a class lie beyond its latest
   * order statistic by independent unit exponentials, whose largest is drawn in one go. The group that
   * just failed has not drawn its next threshold; the others have (their minimum). Parallel strings
   * are one pool (one chain), so group = class. Sets `lastAt` and `lastClass`.
   */
  lastFailure(justFailed: number, t: number) {
    let last = t
    let lastClass = justFailed
    for (let c = 0; c < this.C; c++) {
      const left = this.left[c]
      if (left === 0) continue
      const beyond = c === justFailed ? left : left - 1
      const extra = beyond > 0 ? nextMaxExponential(this.st, beyond) : 0
      // Constant rates from time 0: exposure = rate × t.
      const at = this.threshold(c, this.s.ageTerm[c] + this.unitSum[c] + extra) / this.rate[c]
      if (at > last) {
        last = at
        lastClass = c
      }
    }
    this.lastAt = last > HORIZON ? Infinity : last
    this.lastClass = lastClass
  }

  /** Starts a trial: every group full, thresholds drawn, rates set. Returns lamps in circuit. */
  start(): number {
    const { s, C, H, left, unitSum, expAt, tRate, rate } = this
    let total = 0
    for (let h = 0; h < H; h++) {
      let n = 0
      let sum = 0
      for (let c = 0, g = h * C; c < C; c++, g++) {
        left[g] = s.inCircuit[g]
        unitSum[g] = 0
        expAt[g] = 0
        tRate[g] = 0
        rate[g] = 0
        n += left[g]
        sum += left[g] * s.share[c]
        if (left[g] > 0) this.drawNext(g, c)
      }
      this.chainLeft[h] = n
      this.chainS[h] = sum
      total += n
      this.restress(h, 0)
    }
    return total
  }

  run(log: TrialLog, reported: number) {
    const logKeep = Math.log(1 - this.s.pOpen)
    for (let trial = 0; trial < log.trials; trial++) {
      const total = this.start()
      // Shunts that close before one opens: geometric, drawn once per trial instead of per failure.
      const closing = this.s.pOpen > 0 ? Math.floor(Math.log(1 - nextUniform(this.st)) / logKeep) : Infinity
      this.failures(log, reported, total, closing)
      log.dark(trial, this.lastAt, this.lastClass)
    }
  }

  /** One trial's failures until dark or the horizon; sets `lastAt` and `lastClass`. */
  failures(log: TrialLog, reported: number, total: number, closing: number) {
    const { s, C, H, left, chainLeft, chainNextT } = this
    const series = s.series
    const opens = s.opens
    const horizon = HORIZON
    let failures = 0
    this.lastAt = Infinity
    this.lastClass = -1
    for (;;) {
      let h = 0
      for (let i = 1; i < H; i++) if (chainNextT[i] < chainNextT[h]) h = i
      const t = chainNextT[h]
      if (t > horizon) return
      const g = this.chainNextG[h]
      const c = g - h * C
      left[g]--
      chainLeft[h]--
      total--
      if (failures < reported) log.failure(failures, t)
      failures++
      // Series: a fuse lamp or LED section fails open, a shunted lamp when its shunt does not
      // close, and a chain with no lamp left is out. Parallel: dark when the last lamp fails.
      if (series ? chainLeft[h] === 0 || opens[c] === 1 || closing-- === 0 : total === 0) {
        this.lastAt = t
        this.lastClass = c
        return
      }
      if (!series && failures >= reported) return this.lastFailure(g, t)
      this.expAt[g] = this.nextAt[g]
      this.tRate[g] = t
      if (left[g] > 0) this.drawNext(g, c)
      if (series) this.chainS[h] -= s.share[c]
      this.restress(h, t)
    }
  }
}
