// What a commissioning (and a pre-season inspection in store) is judged by. The insulation and RCD
// readings go through the certificates' own rule (test-limits.ts judgeReadings), so a reading that
// fails a certificate fails a commissioning too; the mounting height is checked against the
// clearances of trade-reference §7. The server stores the result; the phone previews it.
import { judgeReadings, verdict, type Finding, type Readings } from './test-limits'
import type { ClearancePlace } from './vocab/season'

/**
 * Minimum height over the place, in metres: ≥ 5.2 m over a carriageway (some authorities ask 5.8 m),
 * ≥ 3.5 m over a footway — one highway authority's conditions, trade-reference §7.
 */
export const CLEARANCE_MIN_M: Record<ClearancePlace, number> = { carriageway: 5.2, footway: 3.5 }
/** Lights below 3 m should run at safety extra-low voltage, ≤ 25 V (trade-reference §7). */
export const SELV_BELOW_M = 3
export const SELV_MAX_VOLTS = 25

export interface SeasonFinding {
  code: string
  level: Finding['level']
  text: string
}

export interface Judged {
  result: 'pass' | 'advisory' | 'fail'
  findings: SeasonFinding[]
}

// The words say whose figure it is; the figure's source in our notes is trade-reference §7.
const SOURCE = "one highway authority's conditions"

/** A warning when the string hangs lower than the place allows (never a refusal: the crew may re-hang it). */
export function clearanceFindings(
  place: ClearancePlace,
  heightM: number,
  supplyVolts?: number,
): SeasonFinding[] {
  const out: SeasonFinding[] = []
  const min = CLEARANCE_MIN_M[place]
  if (heightM < min)
    out.push({
      code: 'clearance_low',
      level: 'advisory',
      text: `Mounted at ${heightM} m over the ${place}: below the ${min} m minimum (${SOURCE}). Raise it or agree the height with the highway authority.`,
    })
  if (heightM < SELV_BELOW_M && supplyVolts !== undefined && supplyVolts > SELV_MAX_VOLTS)
    out.push({
      code: 'selv_required',
      level: 'advisory',
      text: `Below ${SELV_BELOW_M} m a string should run at safety extra-low voltage (${SELV_MAX_VOLTS} V or less); this one is fed at ${supplyVolts} V (${SOURCE}).`,
    })
  return out
}

/** The insulation and RCD readings judged as certificates are; a commissioning must have both. */
export function readingFindings(r: Readings): SeasonFinding[] {
  const out: SeasonFinding[] = []
  if (r.megohms === undefined)
    out.push({
      code: 'insulation_missing',
      level: 'fail',
      text: 'No insulation reading: test before switch-on.',
    })
  else out.push(...(judgeReadings('insulation_test', r)?.findings ?? []))
  if (r.tripMsAt1x === undefined && r.tripMsAt5x === undefined)
    out.push({ code: 'rcd_missing', level: 'fail', text: 'No RCD trip time: test the RCD before switch-on.' })
  else out.push(...(judgeReadings('rcd_test', r)?.findings ?? []))
  return out
}

export function lampsOutFindings(lampsOut: number): SeasonFinding[] {
  return lampsOut > 0
    ? [
        {
          code: 'lamps_out_at_test',
          level: 'note',
          text: `${lampsOut} lamp${lampsOut === 1 ? '' : 's'} out at the switch-on test: relamp before the season.`,
        },
      ]
    : []
}

/** The result of a commissioning or store inspection from all its findings: any fail fails. */
export function judgeSeasonTest(findings: SeasonFinding[]): Judged {
  const { result } = verdict(findings as Finding[])
  return { result, findings }
}

/** A record that lets a string go in service: passed, or passed with advisories (warnings). */
export const passed = (result: string) => result === 'pass' || result === 'advisory'
