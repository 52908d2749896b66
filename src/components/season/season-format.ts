// Words and marks for the season: each state with its own icon beside its word (never colour alone),
// the electrical caution where tests are taken, and the readings form turned into the API's body.
import type { TestReadings } from '../../../shared/schemas/season'
import { seasonStateLabel, type SeasonState } from '../../../shared/vocab/season'
import { iconDepot, iconDone, iconDown, iconSeason, iconWarning } from '../../icons'

export const seasonIcon: Record<SeasonState, string> = {
  in_store: iconDepot,
  installed: iconDown,
  in_service: iconSeason,
  taken_down: iconDone,
  needs_repair: iconWarning,
}

export const seasonWord = (s: SeasonState) => seasonStateLabel[s]

/** Where readings are taken on a live installation (trade-reference §6 and §9). */
export const TEST_CAUTION =
  'Caution: test only with the string isolated and locked off, on instruments proved before and after (HSE GS38). These readings are decision support, not a certificate: follow local codes (BS 7671, NEC) and leave the work to competent, licensed people.'
export const TAKE_DOWN_CAUTION =
  'Caution: isolate and lock off the supply before disconnecting, and prove it dead; timers and photocells can switch a string back on. Follow local codes and licensed practice.'

export interface ReadingsDraft {
  testVolts: string
  megohms: string
  ratedMa: string
  tripMsAt1x: string
  tripMsAt5x: string
}

export const emptyReadings = (): ReadingsDraft => ({
  testVolts: '500',
  megohms: '',
  ratedMa: '30',
  tripMsAt1x: '',
  tripMsAt5x: '',
})

const num = (s: string) => {
  const n = Number(s.replace(',', '.'))
  return s.trim() === '' || !Number.isFinite(n) ? undefined : n
}

/** The typed readings as the API takes them; blanks are left out (the rule then asks for them). */
export function toReadings(d: ReadingsDraft, circuitVolts?: number): TestReadings {
  const out: TestReadings = {}
  for (const k of Object.keys(d) as (keyof ReadingsDraft)[]) {
    const v = num(d[k])
    if (v !== undefined) out[k] = v
  }
  if (circuitVolts !== undefined) out.circuitVolts = circuitVolts
  return out
}

export const resultWord = { pass: 'Pass', advisory: 'Pass with warnings', fail: 'Fail' } as const
