import type {
  ColdResistanceRequest,
  ColdResistanceResponse,
  EstimateShortedRequest,
  EstimateShortedResponse,
  LampClassInput,
} from '../schemas/engine'
import { DEFAULT_CURRENT_TOLERANCE, DEFAULT_OPERATING_KELVIN, DEFAULT_VOLTS_TOLERANCE } from './defaults'
import { CURRENT_EXPONENT } from './lamp-laws'
import type { Wiring } from './string-condition'
import { resistanceRatio } from './tungsten'

// Shorted lamps from a clamp-meter reading on a series string of equal lamps, by inverting
// I = I_rated · r^0.55 with r = V / (V_rated · (N − k)) (Fink & Beaty via Wikipedia "Lamp rerating"):
// N − k = V / (V_rated · (I / I_rated)^(1/0.55)). The range takes the meter error both ways: more
// current or less voltage reads as more shorted lamps.
export function estimateShorted(input: EstimateShortedRequest): EstimateShortedResponse {
  const { supplyVolts: v, measuredAmps: i, lampCount: n, ratedVolts, ratedAmps } = input
  const ct = input.currentTolerance ?? DEFAULT_CURRENT_TOLERANCE
  const vt = input.voltsTolerance ?? DEFAULT_VOLTS_TOLERANCE
  const shorted = (amps: number, volts: number) =>
    n - volts / (ratedVolts * (amps / ratedAmps) ** (1 / CURRENT_EXPONENT))
  const count = (raw: number) => Math.min(n, Math.max(0, Math.round(raw)))
  const raw = shorted(i, v)
  const estimate = count(raw)
  const low = count(shorted(i * (1 - ct), v * (1 + vt)))
  const high = count(shorted(i * (1 + ct), v * (1 - vt)))
  const tolerance = `±${Math.round(ct * 100)} % current and ±${Math.round(vt * 100)} % volts`
  const explanation =
    raw < -0.5
      ? `${i} A at ${v} V is less than a full string of ${n} draws: check the supply voltage, the lamp ` +
        'rating and for a high-resistance joint.'
      : `${i} A at ${v} V fits ${n - estimate} of ${n} lamps in circuit: about ${estimate} shorted ` +
        `(${low} to ${high} allowing ${tolerance} meter error).`
  return { estimate, low, high, explanation }
}

function lampOhms(c: LampClassInput): number {
  return c.ratedVolts / c.ratedAmps
}

// Resistance of every lamp intact (as built), each lamp contributing `ohms(c)`.
function stringOhms(lamps: LampClassInput[], wiring: Wiring, ohms: (c: LampClassInput) => number): number {
  if (wiring === 'parallel') return 1 / lamps.reduce((s, c) => s + c.count / ohms(c), 0)
  return lamps.reduce((s, c) => s + c.count * ohms(c), 0)
}

// How far above expected a cold reading must be before we call it open: common practice, no source.
const OPEN_FACTOR = 1.5

// Expected cold (switched-off) resistance of a string with every lamp intact, and what a measured
// cold reading says. Hot resistance per lamp is V_rated / I_rated; cold = hot / the tungsten
// resistance ratio at the operating temperature (Forsythe & Worthing 1925, trade-reference §4).
export function coldResistance(input: ColdResistanceRequest): ColdResistanceResponse {
  const wiring = input.wiring ?? 'series'
  const hotColdRatio = resistanceRatio(input.operatingKelvin ?? DEFAULT_OPERATING_KELVIN)
  const hotOhms = stringOhms(input.lamps, wiring, lampOhms)
  const expectedOhms = hotOhms / hotColdRatio
  const base = { hotOhms, expectedOhms, hotColdRatio, shortedEstimate: null }
  const measured = input.measuredOhms
  const expected = `${expectedOhms.toFixed(1)} Ω expected`
  if (measured === undefined) {
    return { ...base, finding: 'not-measured', message: `${expected} cold, with every lamp intact.` }
  }
  if (measured === null || measured > OPEN_FACTOR * expectedOhms) {
    const reading = measured === null ? 'Reads open circuit' : `Reads ${measured} Ω against ${expected}`
    return {
      ...base,
      finding: 'open',
      message:
        `${reading}: an open joint or a lamp failed open. Once a lamp is open its socket can carry ` +
        'the full supply voltage: isolate before relamping.',
    }
  }
  if (wiring === 'parallel') {
    const finding = measured < expectedOhms / OPEN_FACTOR ? 'shorted' : 'ok'
    const message =
      finding === 'ok'
        ? `Reads ${measured} Ω against ${expected}: no fault seen.`
        : `Reads ${measured} Ω against ${expected}: look for a short between the conductors.`
    return { ...base, finding, message }
  }
  // Series: each shorted lamp removes one lamp's cold resistance.
  const lamps = input.lamps.reduce((s, c) => s + c.count, 0)
  const shorted = Math.round((expectedOhms - measured) / (expectedOhms / lamps))
  if (shorted < 1)
    return { ...base, finding: 'ok', message: `Reads ${measured} Ω against ${expected}: no fault seen.` }
  return {
    ...base,
    finding: 'shorted',
    shortedEstimate: Math.min(lamps, shorted),
    message: `Reads ${measured} Ω against ${expected}: about ${Math.min(lamps, shorted)} of ${lamps} lamps shorted.`,
  }
}
