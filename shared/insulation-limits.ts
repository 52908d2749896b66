// Insulation resistance minimums by the circuit's nominal voltage (BS 7671:2018 Table 64,
// trade-reference §5). The minimum follows the circuit, not the test voltage: a 230 V circuit tested
// at 250 V (because surge protection cannot be disconnected) still needs 1.0 MΩ (BS 7671 reg 643.3,
// from memory per the trade reference).
import type { Finding, Readings } from './test-limit-types'

export interface InsulationRequirement {
  band: 'selv' | 'low_voltage' | 'above_500'
  label: string
  /** Circuits up to this nominal voltage (V AC) fall in the band. */
  upToVolts: number
  testVolts: number
  minMegohms: number
}

export const INSULATION_BANDS: readonly InsulationRequirement[] = [
  { band: 'selv', label: 'SELV/PELV', upToVolts: 50, testVolts: 250, minMegohms: 0.5 },
  { band: 'low_voltage', label: 'up to 500 V', upToVolts: 500, testVolts: 500, minMegohms: 1.0 },
  { band: 'above_500', label: 'above 500 V', upToVolts: Infinity, testVolts: 1000, minMegohms: 1.0 },
]

/**
 * The row of Table 64 for a circuit's nominal voltage. Unknown voltage counts as a mains circuit up
 * to 500 V: festive lighting on the estate is mains-fed, and the stricter minimum is the safe guess.
 */
export function insulationRequirement(circuitVolts: number | undefined): InsulationRequirement {
  const v = circuitVolts ?? 230
  return INSULATION_BANDS.find((b) => v <= b.upToVolts)!
}

/** The minimum in MΩ for a circuit of this nominal voltage. */
export function insulationMinimumMegohms(circuitVolts: number | undefined): number {
  return insulationRequirement(circuitVolts).minMegohms
}

export function judgeInsulation(r: Readings): Finding[] | null {
  if (r.megohms === undefined) return null
  const need = insulationRequirement(r.circuitVolts)
  const out: Finding[] = []
  if (r.circuitVolts === undefined)
    out.push({
      code: 'circuit_volts_assumed',
      level: 'note',
      text: 'Circuit voltage not given: judged as a mains circuit up to 500 V.',
    })
  const circuit =
    r.circuitVolts === undefined ? 'a circuit up to 500 V' : `a ${r.circuitVolts} V circuit (${need.label})`
  if (r.megohms < need.minMegohms)
    out.push({
      code: 'insulation_low',
      level: 'fail',
      text:
        `${r.megohms} MΩ is below the ${need.minMegohms.toFixed(1)} MΩ minimum for ${circuit} ` +
        `(BS 7671 Table 64${r.testVolts !== undefined && r.testVolts < need.testVolts ? ', whatever the test voltage: reg 643.3' : ''}). ` +
        'Keep it switched off and find the fault before it is used.',
    })
  if (r.testVolts !== undefined && r.testVolts < need.testVolts)
    out.push({
      code: 'insulation_test_volts_low',
      level: 'advisory',
      text:
        `Tested at ${r.testVolts} V DC; Table 64 sets ${need.testVolts} V DC for ${circuit}. A lower test ` +
        'voltage is allowed where surge protection cannot be disconnected (BS 7671 reg 643.3): say so in ' +
        'the notes, and the minimum stays the same.',
    })
  return out
}
