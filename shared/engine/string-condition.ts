import type { LampClassInput } from '../schemas/engine'
import { CURRENT_EXPONENT } from './lamp-laws'
import { seriesShare, type SeriesShare } from './series-share'

export type Wiring = 'series' | 'parallel'
/** Why a chain is dark: a fuse lamp failed open, a shunt stayed open, a lamp is missing, all failed. */
export type DarkCause = 'fuse' | 'opened' | 'removed' | 'all_failed'

export interface ChainCondition {
  /** identical chains this entry stands for (intact chains are computed once) */
  weight: number
  dark: boolean
  causes: DarkCause[]
  /** lamps per class in their sockets and not failed */
  inCircuit: number[]
  /** applied / rated voltage per class; 0 in a dark chain and for a class with no lamp in circuit */
  ratios: number[]
  /** the chain's current from the exact series solve (series-share.ts); 0 when dark */
  amps: number
}

export interface StringCondition {
  /** every chain dark (a parallel string: every lamp out) */
  dark: boolean
  /** an unshunted (fuse) lamp has failed open in a series chain */
  fuseFailed: boolean
  /** lamps per class in their sockets and not failed, over every chain (shorted lamps carry no voltage) */
  inCircuit: number[]
  /** lamps per class lit: in circuit in a chain that is not dark */
  lit: number[]
  /** applied / rated voltage per class in the most stressed lit chain; 0 for a dark string */
  ratios: number[]
  /** the least stressed lit chain's ratio per class (the validity check needs both ends) */
  minRatios: number[]
  /** running current of the string: the sum over lit chains (series) or lamps (parallel) */
  amps: number
  branches: number
  branchesDark: number
  /** distinct chains, the most affected first (series only; a parallel string is one entry) */
  chains: ChainCondition[]
}

export function lampsFailed(c: LampClassInput): number {
  return Math.min(c.failed ?? 0, c.count)
}

/** Lamps of a class missing from the circuit over the whole string: failed, opened, removed (clamped). */
function missingOf(c: LampClassInput, capacity: number) {
  const failed = Math.min(c.failed ?? 0, capacity)
  const opened = Math.min(c.opened ?? 0, capacity - failed)
  const removed = Math.min(c.removed ?? 0, capacity - failed - opened)
  return { failed, opened, removed }
}

/**
 * The exact solve when every class has one rated current: r = V / Σ n · V_rated and
 * I = I_rated · r^0.55 (what series-share.ts gives then, without a power per class).
 */
function proportional(supplyVolts: number, lamps: LampClassInput[], inCircuit: number[]): SeriesShare {
  let s = 0
  for (let i = 0; i < lamps.length; i++) s += inCircuit[i] * lamps[i].ratedVolts
  if (!(s > 0)) return { amps: 0, ratios: lamps.map(() => 0) }
  const r = supplyVolts / s
  return { amps: lamps[0].ratedAmps * r ** CURRENT_EXPONENT, ratios: inCircuit.map((n) => (n > 0 ? r : 0)) }
}

/** How many of the slots [from, to) fall in chain j of `size` slots. */
function inChain(from: number, to: number, j: number, size: number): number {
  return Math.max(0, Math.min(to, (j + 1) * size) - Math.max(from, j * size))
}

// Placement rule: `lamps` describes one chain; failures are counted over the whole string and fill
// the first chain(s) in order — failed, then opened, then removed — each class on its own.
export function stringCondition(
  supplyVolts: number,
  lamps: LampClassInput[],
  wiring: Wiring = 'series',
  branches = 1,
): StringCondition {
  const m = Math.max(1, Math.floor(branches))
  const miss = lamps.map((c) => missingOf(c, c.count * m))
  if (wiring === 'parallel') {
    // Every lamp sits across the full supply: a lamp out (however) changes nothing for the rest.
    const inCircuit = lamps.map((c, i) => c.count * m - miss[i].failed - miss[i].opened - miss[i].removed)
    const dark = inCircuit.every((n) => n === 0)
    const ratios = lamps.map((c, i) => (!dark && inCircuit[i] > 0 ? supplyVolts / c.ratedVolts : 0))
    const amps = lamps.reduce((s, c, i) => s + inCircuit[i] * c.ratedAmps * ratios[i] ** CURRENT_EXPONENT, 0)
    const chain = { weight: 1, dark, causes: [], inCircuit, ratios, amps }
    const branchesDark = dark ? m : 0
    const chains = [chain]
    return {
      dark,
      fuseFailed: false,
      inCircuit,
      lit: inCircuit,
      ratios,
      minRatios: ratios,
      amps,
      branches: m,
      branchesDark,
      chains,
    }
  }
  const C = lamps.length
  const oneCurrent = lamps.every((c) => c.ratedAmps === lamps[0].ratedAmps)
  const chains: ChainCondition[] = []
  for (let j = 0; j < m; j++) {
    const inCircuit = new Array<number>(C)
    let fuse = false
    let open = false
    let missing = false
    let any = false
    let total = 0
    for (let i = 0; i < C; i++) {
      const size = lamps[i].count
      const f = miss[i].failed
      const o = miss[i].opened
      const failed = inChain(0, f, j, size)
      const opened = inChain(f, f + o, j, size)
      const removed = inChain(f + o, f + o + miss[i].removed, j, size)
      inCircuit[i] = size - failed - opened - removed
      total += inCircuit[i]
      if (failed > 0 && lamps[i].shunted === false) fuse = true
      if (opened > 0) open = true
      if (removed > 0) missing = true
      if (failed + opened + removed > 0) any = true
    }
    const causes: DarkCause[] = []
    if (fuse) causes.push('fuse')
    if (open) causes.push('opened')
    if (missing) causes.push('removed')
    if (causes.length === 0 && total === 0) causes.push('all_failed')
    const weight = any ? 1 : m - j
    if (causes.length)
      chains.push({ weight, dark: true, causes, inCircuit, ratios: new Array(C).fill(0), amps: 0 })
    else {
      // One current through the chain, solved from each class's own rating (series-share.ts).
      const share = oneCurrent
        ? proportional(supplyVolts, lamps, inCircuit)
        : seriesShare(supplyVolts, lamps, inCircuit)
      chains.push({ weight, dark: false, causes, inCircuit, ratios: share.ratios, amps: share.amps })
    }
    // Failures fill the first chains, so once a chain is intact every later one is the same.
    if (!any) break
  }
  const inCircuit = new Array<number>(C).fill(0)
  const lit = new Array<number>(C).fill(0)
  const ratios = new Array<number>(C).fill(0)
  const minRatios = new Array<number>(C).fill(Infinity)
  let amps = 0
  let branchesDark = 0
  let fuseFailed = false
  for (const c of chains) {
    if (c.causes.includes('fuse')) fuseFailed = true
    if (c.dark) branchesDark += c.weight
    else amps += c.weight * c.amps
    for (let i = 0; i < C; i++) {
      inCircuit[i] += c.weight * c.inCircuit[i]
      if (c.dark || c.inCircuit[i] === 0) continue
      lit[i] += c.weight * c.inCircuit[i]
      if (c.ratios[i] > ratios[i]) ratios[i] = c.ratios[i]
      if (c.ratios[i] < minRatios[i]) minRatios[i] = c.ratios[i]
    }
  }
  for (let i = 0; i < C; i++) if (minRatios[i] === Infinity) minRatios[i] = 0
  // A plain literal: spreading object literals here took V8's slow path (10 × the whole assess).
  const dark = branchesDark === m
  return { dark, fuseFailed, inCircuit, lit, ratios, minRatios, amps, branches: m, branchesDark, chains }
}
