// Plain-language sentences a crew member can act on; every number says what it was computed from.
import type { LampClassInput } from '../schemas/engine'
import { lampsFailed, type StringCondition, type Wiring } from './string-condition'

export function percent(ratio: number): string {
  return `${Math.round(ratio * 100)} %`
}

function lamps(n: number): string {
  return n === 1 ? '1 lamp' : `${n} lamps`
}

export function lifePhrase(lifeFactor: number): string {
  if (lifeFactor >= 1.1) return `about ${lifeFactor.toFixed(1)} times normal`
  if (lifeFactor >= 0.9) return 'about normal'
  if (lifeFactor >= 0.45 && lifeFactor < 0.58) return 'about half of normal'
  if (lifeFactor < 0.01) return 'under 1 % of normal'
  return `about ${Math.round(lifeFactor * 100)} % of normal`
}

export interface ReasonContext {
  wiring: Wiring
  lamps: LampClassInput[]
  condition: StringCondition
  maxRatio: number
  lifeFactorAtMax: number
  replaceAtRatio: number
}

export function assessReasons(ctx: ReasonContext): string[] {
  const { condition, maxRatio } = ctx
  const total = ctx.lamps.reduce((s, c) => s + c.count, 0)
  const out = ctx.lamps.reduce((s, c) => s + lampsFailed(c), 0)
  const lit = condition.inCircuit.reduce((a, b) => a + b, 0)
  if (condition.fuseFailed) {
    const open = ctx.lamps.reduce((s, c) => s + (c.shunted === false ? lampsFailed(c) : 0), 0)
    const verb = open === 1 ? 'has' : 'have'
    return [
      `${lamps(open)} without a shunt (fuse lamp) ${verb} failed open: the whole string is dark. ` +
        'Replace it and every shorted lamp before switching on again.',
    ]
  }
  if (condition.dark) return [`All ${total} lamps have failed: the string is dark.`]

  const stress = `${percent(maxRatio)} of rating; expected life ${lifePhrase(ctx.lifeFactorAtMax)}`
  let first: string
  if (out === 0)
    first =
      lit === 1 ? `No lamps out: the lamp runs at ${stress}.` : `No lamps out: all ${lit} run at ${stress}.`
  else if (ctx.wiring === 'parallel')
    first = `${lamps(out)} out; in a parallel string the other ${lit} keep their voltage and run at ${stress}.`
  else first = `${lamps(out)} shorted: the other ${lit} run at ${stress}.`
  const reasons = [first]
  if (maxRatio >= ctx.replaceAtRatio - 1e-9) {
    reasons.push(
      out > 0 && ctx.wiring === 'series'
        ? `That is at or above the replace-now limit of ${percent(ctx.replaceAtRatio)}: replace the shorted ` +
            'lamps now, since each one raises the stress on the rest and failures cascade.'
        : `The lamps run at or above the replace-now limit of ${percent(ctx.replaceAtRatio)} with no failures to ` +
            'blame: check the supply voltage and that the lamp count and rating suit it.',
    )
  }
  return reasons
}
