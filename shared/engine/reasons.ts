// Plain-language sentences a crew member can act on; every number says what it was computed from.
import type { LampClassInput } from '../schemas/engine'
import { LAWS_MAX_RATIO, LAWS_MIN_RATIO } from './defaults'
import type { Reason } from './reason-codes'
import type { StringCondition, Wiring } from './string-condition'

export function percent(ratio: number): string {
  // A far-off string (10,000 lamps on one supply) must not read "0 %".
  if (ratio > 0 && ratio < 0.005) return 'under 1 %'
  return `${Math.round(ratio * 100)} %`
}

export function lamps(n: number): string {
  return n === 1 ? '1 lamp' : `${n} lamps`
}

/** The life phrase; null means the lamp laws do not hold (or do not apply) there. */
export function lifePhrase(lifeFactor: number | null): string {
  if (lifeFactor === null) return 'not predictable here'
  if (lifeFactor >= 1.1) return `about ${lifeFactor.toFixed(1)} times normal`
  if (lifeFactor >= 0.9) return 'about normal'
  if (lifeFactor >= 0.45 && lifeFactor < 0.58) return 'about half of normal'
  if (lifeFactor < 0.01) return 'under 1 % of normal'
  return `about ${Math.round(lifeFactor * 100)} % of normal`
}

/** Where the dark chains leave the string: all dark, or how many chains are out. */
export function darkWhere(cond: { dark: boolean; branches: number; branchesDark: number }): string {
  if (cond.dark)
    return cond.branches > 1 ? `all ${cond.branches} chains are dark` : 'the whole string is dark'
  const lit = cond.branches - cond.branchesDark
  const are = cond.branchesDark === 1 ? 'is' : 'are'
  return `${cond.branchesDark} of ${cond.branches} chains ${are} dark; the other ${lit} stay lit`
}

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0)

export interface StressContext {
  wiring: Wiring
  lamps: LampClassInput[]
  condition: StringCondition
  maxRatio: number
  maxAt: number
  /** life factor at the most stressed class; null where the laws do not hold */
  lifeFactorAtMax: number | null
  range: 'low' | 'ok' | 'high'
  replaceAtRatio: number
}

function rating(c: LampClassInput): string {
  return `${+c.ratedVolts.toFixed(2)} V ${+c.ratedAmps.toFixed(3)} A`
}

/** Lamps of different rated current lit in one series chain: the wrong lamp, named by its rating. */
function mixedRating(ctx: StressContext): Reason | null {
  const { lamps: ls, condition: cond } = ctx
  if (ctx.wiring !== 'series') return null
  const litIdx = ls.map((_, i) => i).filter((i) => cond.lit[i] > 0)
  const amps = litIdx.map((i) => ls[i].ratedAmps)
  if (litIdx.length < 2 || Math.max(...amps) <= Math.min(...amps) * 1.02) return null
  const others = litIdx.filter((i) => i !== ctx.maxAt).sort((a, b) => cond.lit[b] - cond.lit[a])
  const main = others[0]
  return {
    code: 'mixed_rating',
    text:
      `Lamps of different rated current share one chain and one current flows through it: the ` +
      `${rating(ls[ctx.maxAt])} lamp runs at ${percent(ctx.maxRatio)} of its rating, the ` +
      `${rating(ls[main])} lamps at ${percent(cond.ratios[main])}. ` +
      (ctx.maxRatio >= ctx.replaceAtRatio - 1e-9 ? 'It will fail early or blow: ' : '') +
      `fit lamps of the string's own rating (${+ls[main].ratedAmps.toFixed(3)} A).`,
  }
}

const CHECK_SUPPLY = 'Check the supply voltage and that the lamp count and rating suit it.'

/** The stress reasons of a lit filament string: laws range, wrong lamp, the share, replace now. */
export function stressReasons(ctx: StressContext): Reason[] {
  const { condition: cond, maxRatio } = ctx
  const reasons: Reason[] = []
  const series = ctx.wiring === 'series'
  const worst = cond.chains.find((c) => !c.dark)!
  const out = series
    ? sum(ctx.lamps.map((c, i) => c.count - worst.inCircuit[i]))
    : sum(
        ctx.lamps.map((c) =>
          Math.min((c.failed ?? 0) + (c.opened ?? 0) + (c.removed ?? 0), c.count * cond.branches),
        ),
      )
  const shortedAnywhere = sum(ctx.lamps.map((c) => (c.shunted === false ? 0 : (c.failed ?? 0)))) > 0
  const mixed = mixedRating(ctx)
  if (ctx.range === 'high') {
    const action = mixed
      ? "Fit a lamp of the string's own rating before switching on again."
      : shortedAnywhere
        ? 'Replace the shorted lamps before switching on again.'
        : CHECK_SUPPLY
    const who =
      ctx.lamps.filter((_, i) => cond.lit[i] > 0).length > 1
        ? `The ${rating(ctx.lamps[ctx.maxAt])} lamp${cond.lit[ctx.maxAt] === 1 ? '' : 's'}`
        : 'The lamps'
    reasons.push({
      code: 'laws_exceeded_high',
      text:
        `${who} would run at ${percent(maxRatio)} of rating, beyond the ${percent(LAWS_MAX_RATIO)} up to which ` +
        `the lamp laws hold: lamps will blow at switch-on or within minutes. ` +
        action,
    })
  }
  if (ctx.range === 'low') {
    const least = Math.min(...cond.minRatios.filter((_, i) => cond.lit[i] > 0))
    reasons.push({
      code: 'laws_exceeded_low',
      text:
        `The lamps get ${percent(least)} of their rated voltage, below the ${percent(LAWS_MIN_RATIO)} down to ` +
        `which the lamp laws hold: little or no light. ${CHECK_SUPPLY}`,
    })
  }
  if (mixed) reasons.push(mixed)

  const life = ctx.lifeFactorAtMax === null ? '' : `; expected life ${lifePhrase(ctx.lifeFactorAtMax)}`
  // Classes at different ratios (a wrong lamp, another rating): the figure is the most stressed one's.
  const litRatios = cond.ratios.filter((_, i) => cond.lit[i] > 0)
  const upTo = Math.min(...litRatios) < maxRatio * 0.99 ? 'up to ' : ''
  const stress = `${upTo}${percent(maxRatio)} of rating${life}`
  const litWorst = series ? sum(worst.inCircuit) : sum(cond.lit)
  const anyOut = ctx.lamps.some((c) => (c.failed ?? 0) + (c.opened ?? 0) + (c.removed ?? 0) > 0)
  if (!anyOut) {
    const text =
      litWorst === 1
        ? `No lamps out: the lamp runs at ${stress}.`
        : `No lamps out: all ${sum(cond.lit)} run at ${stress}.`
    reasons.push({ code: 'no_lamps_out', text })
  } else if (out === 0)
    reasons.push({
      code: 'no_lamps_out',
      text: `The chains still lit have no lamps out: they run at ${stress}.`,
    })
  else if (!series)
    reasons.push({
      code: 'parallel_out',
      text: `${lamps(out)} out; in a parallel string the other ${litWorst} keep their voltage and run at ${stress}.`,
    })
  else {
    const chain = cond.branches > 1 ? ' in the most affected chain: its' : ': the'
    reasons.push({
      code: 'lamps_shorted',
      text: `${lamps(out)} shorted${chain} other ${litWorst} run at ${stress}.`,
    })
  }
  if (ctx.range === 'ok' && !mixed && maxRatio >= ctx.replaceAtRatio - 1e-9) {
    reasons.push(
      out > 0 && series
        ? {
            code: 'replace_ratio',
            text:
              `That is at or above the replace-now limit of ${percent(ctx.replaceAtRatio)}: replace the shorted ` +
              'lamps now, since each one raises the stress on the rest and failures cascade.',
          }
        : {
            code: 'supply_high',
            text:
              `The lamps run at or above the replace-now limit of ${percent(ctx.replaceAtRatio)} with no failures to ` +
              'blame: check the supply voltage and that the lamp count and rating suit it.',
          },
    )
  }
  return reasons
}
