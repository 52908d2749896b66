import type {
  BreakerCurve,
  CircuitReason,
  CircuitRequest,
  CircuitResponse,
  CircuitString,
  SwitchOnVerdict,
} from '../schemas/engine'
import { CONTINUOUS_LOAD_FRACTION, DEFAULT_BURN_HOURS_PER_DAY, DEFAULT_SEASON_DAYS } from './defaults'
import { energyUse } from './energy'
import { rcdVerdict } from './circuit-rcd'

// Instantaneous (magnetic) trip bands as multiples of rated current, IEC 60898-1.
export const INSTANTANEOUS_BANDS: Record<BreakerCurve, readonly [number, number]> = {
  B: [3, 5],
  C: [5, 10],
  D: [10, 20],
}

// One half-cycle of a 50 Hz supply, ms. The bands are stated for currents lasting at least that long;
// an LED driver's inrush pulse is usually far shorter (its data sheet gives the width).
const HALF_CYCLE_MS = 10

export function switchOnVerdict(peakAmps: number, breakerAmps: number, curve: BreakerCurve): SwitchOnVerdict {
  const [low, high] = INSTANTANEOUS_BANDS[curve]
  if (peakAmps < low * breakerAmps) return 'safe'
  return peakAmps < high * breakerAmps ? 'may trip' : 'will trip'
}

// How many switching groups keep every switch-on below `limitAmps`, each group switching on once
// the earlier ones run (so their running current counts too). Largest surges first, each group
// filled first-fit; null when one string alone reaches the limit.
export function staggerGroups(strings: CircuitString[], limitAmps: number): number | null {
  const waiting = [...strings].sort((a, b) => b.peakAmps - a.peakAmps)
  let running = 0
  let groups = 0
  while (waiting.length > 0) {
    let surge = running
    let added = 0
    for (let i = 0; i < waiting.length;) {
      if (surge + waiting[i].peakAmps < limitAmps) {
        surge += waiting[i].peakAmps
        running += waiting[i].runningAmps
        waiting.splice(i, 1)
        added++
      } else i++
    }
    if (added === 0) return null
    groups++
  }
  return groups
}

const amps = (a: number) => `${a.toFixed(1)} A`

function runningReason(running: number, limit: number, breakerAmps: number): CircuitReason {
  if (running > breakerAmps)
    return {
      code: 'running_over_rating',
      text:
        `Running load ${amps(running)} is over the ${breakerAmps} A rating of the breaker: it will trip on ` +
        'overload once the strings are lit, however they are switched on (IEC 60898-1 thermal release). ' +
        'Move strings to another circuit before switching on.',
    }
  if (running > limit)
    return {
      code: 'running_over_continuous',
      text: `Running load ${amps(running)} is over ${amps(limit)}, the continuous limit (80 %) of the ${breakerAmps} A breaker: move strings to another circuit.`,
    }
  return {
    code: 'running_ok',
    text: `Running load ${amps(running)} is within ${amps(limit)}, the continuous limit of the ${breakerAmps} A breaker.`,
  }
}

export function assessCircuit(input: CircuitRequest): CircuitResponse {
  const { breakerAmps, curve, strings } = input
  const runningAmps = strings.reduce((s, x) => s + x.runningAmps, 0)
  const peakAmps = strings.reduce((s, x) => s + x.peakAmps, 0)
  const continuousLimitAmps = breakerAmps * (input.continuousLoadFraction ?? CONTINUOUS_LOAD_FRACTION)
  const runningOk = runningAmps <= continuousLimitAmps
  const overload = runningAmps > breakerAmps
  const [lowX, highX] = INSTANTANEOUS_BANDS[curve]
  const band = { lowAmps: lowX * breakerAmps, highAmps: highX * breakerAmps }
  const surge = switchOnVerdict(peakAmps, breakerAmps, curve)
  // Over the rating the breaker trips on overload whatever the surge does: staggering cannot help.
  const switchOn: SwitchOnVerdict = overload ? 'will trip' : surge
  const stagger = overload ? null : surge === 'safe' ? 1 : staggerGroups(strings, band.lowAmps)
  const reasons: CircuitReason[] = [runningReason(runningAmps, continuousLimitAmps, breakerAmps)]
  const bandText = `the type ${curve} instant-trip band (${lowX}–${highX} × rated, ${amps(band.lowAmps)}–${amps(band.highAmps)})`
  if (surge === 'safe')
    reasons.push({
      code: 'surge_safe',
      text: `Switch-on surge about ${amps(peakAmps)} stays below ${bandText}.`,
    })
  else {
    const verb = surge === 'may trip' ? 'falls inside' : 'is above'
    const advice = overload
      ? 'and the running load is too much for the breaker in any case.'
      : stagger === null
        ? 'one string alone reaches the band: use a breaker with a higher curve or rating, or split the string.'
        : `switch in ${stagger} staggered groups, each once the previous one is lit.`
    reasons.push({
      code: surge === 'may trip' ? 'surge_in_band' : 'surge_over_band',
      text: `Switch-on surge about ${amps(peakAmps)} ${verb} ${bandText}: ${advice}`,
    })
    const pulse = strings.filter((x) => x.peakMs !== undefined && x.peakMs < HALF_CYCLE_MS)
    if (pulse.length)
      reasons.push({
        code: 'surge_short_pulse',
        text:
          `${pulse.length} LED driver${pulse.length === 1 ? '' : 's'} switch on with a pulse shorter than half a ` +
          `cycle (${Math.max(...pulse.map((x) => x.peakMs!))} ms at most). The peak is compared with the band as ` +
          "if it lasted longer, which errs on the safe side: the breaker maker's table of drivers per breaker decides.",
      })
  }

  const unknown = strings.filter((x) => x.surgeKnown === false).length
  if (unknown)
    reasons.push({
      code: 'surge_unknown',
      text:
        `${unknown} LED string${unknown === 1 ? ' has' : 's have'} no switch-on data: the surge counts only ` +
        "running current, so the real surge is higher. Add the driver's inrush peak and duration to the string type.",
    })

  const rcd =
    input.rcdMilliamps === undefined
      ? null
      : rcdVerdict(input.rcdMilliamps, input.rcdType ?? 'general', strings, input.leakageMilliamps, reasons)

  const watts = strings.reduce((s, x) => s + (x.watts ?? x.runningAmps * input.supplyVolts), 0)
  const energy = energyUse(
    watts,
    input.burnHoursPerDay ?? DEFAULT_BURN_HOURS_PER_DAY,
    input.seasonDays ?? DEFAULT_SEASON_DAYS,
    input.tariffPerKwh,
  )
  return {
    runningAmps,
    continuousLimitAmps,
    runningOk,
    overload,
    peakAmps,
    instantaneousBand: band,
    switchOn,
    staggerGroups: stagger,
    rcd,
    energy,
    reasons,
  }
}
