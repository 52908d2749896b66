import type {
  BreakerCurve,
  CircuitRequest,
  CircuitResponse,
  CircuitString,
  SwitchOnVerdict,
} from '../schemas/engine'
import { CONTINUOUS_LOAD_FRACTION, DEFAULT_BURN_HOURS_PER_DAY, DEFAULT_SEASON_DAYS } from './defaults'
import { energyUse } from './energy'

// Instantaneous (magnetic) trip bands as multiples of rated current, IEC 60898-1.
export const INSTANTANEOUS_BANDS: Record<BreakerCurve, readonly [number, number]> = {
  B: [3, 5],
  C: [5, 10],
  D: [10, 20],
}

// Additional protection needs IΔn ≤ 30 mA (BS 7671 reg 415.1.1).
const ADDITIONAL_PROTECTION_MILLIAMPS = 30
// An RCD must not trip at 0.5 × IΔn (BS EN 61008-1 / 61009-1); standing leakage at or above that
// may trip it.
const RCD_NO_TRIP_FRACTION = 0.5

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

export function assessCircuit(input: CircuitRequest): CircuitResponse {
  const { breakerAmps, curve, strings } = input
  const runningAmps = strings.reduce((s, x) => s + x.runningAmps, 0)
  const peakAmps = strings.reduce((s, x) => s + x.peakAmps, 0)
  const continuousLimitAmps = breakerAmps * (input.continuousLoadFraction ?? CONTINUOUS_LOAD_FRACTION)
  const runningOk = runningAmps <= continuousLimitAmps
  const [lowX, highX] = INSTANTANEOUS_BANDS[curve]
  const band = { lowAmps: lowX * breakerAmps, highAmps: highX * breakerAmps }
  const switchOn = switchOnVerdict(peakAmps, breakerAmps, curve)
  const stagger = switchOn === 'safe' ? 1 : staggerGroups(strings, band.lowAmps)
  const reasons = [
    runningOk
      ? `Running load ${amps(runningAmps)} is within ${amps(continuousLimitAmps)}, the continuous limit of the ${breakerAmps} A breaker.`
      : `Running load ${amps(runningAmps)} is over ${amps(continuousLimitAmps)}, the continuous limit of the ${breakerAmps} A breaker: move strings to another circuit.`,
  ]
  const bandText = `the type ${curve} instant-trip band (${lowX}–${highX} × rated, ${amps(band.lowAmps)}–${amps(band.highAmps)})`
  if (switchOn === 'safe') reasons.push(`Switch-on surge about ${amps(peakAmps)} stays below ${bandText}.`)
  else {
    const verb = switchOn === 'may trip' ? 'falls inside' : 'is above'
    const advice =
      stagger === null
        ? 'one string alone reaches the band: use a breaker with a higher curve or rating, or split the string.'
        : `switch in ${stagger} staggered groups, each once the previous one is lit.`
    reasons.push(`Switch-on surge about ${amps(peakAmps)} ${verb} ${bandText}: ${advice}`)
  }

  let rcd: CircuitResponse['rcd'] = null
  if (input.rcdMilliamps !== undefined) {
    const leakageMilliamps = strings.reduce((s, x) => s + (x.leakageMilliamps ?? 0), 0)
    const additionalProtection = input.rcdMilliamps <= ADDITIONAL_PROTECTION_MILLIAMPS
    const risk = leakageMilliamps >= RCD_NO_TRIP_FRACTION * input.rcdMilliamps ? 'may trip' : 'ok'
    rcd = { leakageMilliamps, additionalProtection, risk }
    if (!additionalProtection)
      reasons.push(
        `A ${input.rcdMilliamps} mA RCD does not give additional protection: that needs 30 mA or less.`,
      )
    if (risk === 'may trip')
      reasons.push(`Standing leakage ${leakageMilliamps} mA is half the RCD's rating or more: it may trip.`)
  }

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
    peakAmps,
    instantaneousBand: band,
    switchOn,
    staggerGroups: stagger,
    rcd,
    energy,
    reasons,
  }
}
