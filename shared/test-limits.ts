// Pass/fail rules for electrical test readings, from published standards (trade-reference §5).
// Insulation minimums are in insulation-limits.ts; both are judged by judgeReadings() here.
import { judgeInsulation } from './insulation-limits'
import type { Finding, Judged, Readings, RcdType } from './test-limit-types'

export type { Finding, FindingCode, Judged, Readings, RcdType } from './test-limit-types'
export {
  INSULATION_BANDS,
  insulationMinimumMegohms,
  insulationRequirement,
  type InsulationRequirement,
} from './insulation-limits'

/** Trip-time window in ms: [fastest allowed, slowest allowed]. */
export type Window = readonly [number, number]

/**
 * RCD trip-time limits at 1, 2 and 5 × IΔn (BS EN 61008-1 / 61009-1, trade-reference §5). A
 * general-type RCD may trip as fast as it likes; a time-delayed (S) RCD must also not trip too fast,
 * or it stops waiting for the RCD downstream and both trip together (no discrimination).
 */
export const RCD_LIMITS_MS: Record<RcdType, { x1: Window; x2: Window; x5: Window }> = {
  general: { x1: [0, 300], x2: [0, 150], x5: [0, 40] },
  S: { x1: [130, 500], x2: [60, 200], x5: [50, 150] },
}
/** General-type maximums, kept for the readings' hints. */
export const RCD_MAX_MS = { x1: 300, x2: 150, x5: 40 } as const

/** Additional protection: IΔn ≤ 30 mA, and ≤ 40 ms at 5 × IΔn (BS 7671 reg 415.1.1). */
export const ADDITIONAL_PROTECTION = { maxMilliamps: 30, maxMsAt5x: 40 } as const

/**
 * Standing protective-conductor (leakage) current should stay at or below 30 % of IΔn (BS 7671 reg
 * 531.3.2 — from memory, not checked against the text; trade-reference §5). An RCD must not trip at
 * 50 % (BS EN 61008-1), so at half its rating or more it may trip on leakage alone.
 */
export const LEAKAGE_LIMIT_FRACTION = 0.3
export const RCD_NO_TRIP_FRACTION = 0.5

export const RCD_TYPE_LABEL: Record<RcdType, string> = {
  general: 'general type (no delay)',
  S: 'type S (time-delayed)',
}

/** Stored readings from before RCD types were recorded have none: they are judged as general type. */
export const rcdTypeOf = (r: Readings): RcdType => (r.rcdType === 'S' ? 'S' : 'general')

const STD = 'BS EN 61008-1 / 61009-1'

function trip(at: '1' | '2' | '5', ms: number | undefined, t: RcdType, out: Finding[]) {
  if (ms === undefined) return
  const [low, high] = RCD_LIMITS_MS[t][`x${at}`]
  const where = `Trip at ${at} × IΔn took ${ms} ms`
  const limit = t === 'S' ? `${low}–${high} ms for a type S RCD, ${STD}` : `${high} ms or less, ${STD}`
  if (ms > high) out.push({ code: 'rcd_slow', level: 'fail', text: `${where}: too slow (limit ${limit}).` })
  else if (ms < low)
    out.push({
      code: 'rcd_too_fast',
      level: 'fail',
      text:
        `${where}: too fast for a time-delayed RCD (limit ${limit}). It will trip together with the ` +
        'RCD downstream, so a fault puts out more than its own circuit: replace it.',
    })
}

function judgeRcd(r: Readings): Judged | null {
  const timed = [r.tripMsAt1x, r.tripMsAt2x, r.tripMsAt5x].some((x) => x !== undefined)
  if (!timed && r.noTripAtHalf === undefined) return null
  const t = rcdTypeOf(r)
  const out: Finding[] = []
  if (r.noTripAtHalf === false)
    out.push({
      code: 'rcd_tripped_at_half',
      level: 'fail',
      text:
        `It tripped at ½ × IΔn: an RCD must not trip at half its rating (${STD}). Check the standing ` +
        'leakage of the circuit first (it adds to the test current); if it trips with the load off, replace it.',
    })
  trip('1', r.tripMsAt1x, t, out)
  trip('2', r.tripMsAt2x, t, out)
  trip('5', r.tripMsAt5x, t, out)
  // BS 7671 applies the 40 ms at 5 × test to RCDs used for additional protection (reg 415.1.1). A
  // device over 30 mA, or time-delayed, cannot be that protection, though it may pass its own
  // standard: the device is not faulty, the circuit may still need a 30 mA general-type RCD. That is
  // a design question the readings cannot settle (one may be fitted downstream), so it is advisory.
  const big = r.ratedMa !== undefined && r.ratedMa > ADDITIONAL_PROTECTION.maxMilliamps
  if (big || t === 'S')
    out.push({
      code: 'no_additional_protection',
      level: 'advisory',
      text:
        `${big ? `Rated ${r.ratedMa} mA` : 'A time-delayed (S) RCD'}: it does not give additional ` +
        `protection, which needs ${ADDITIONAL_PROTECTION.maxMilliamps} mA or less and a trip within ` +
        `${ADDITIONAL_PROTECTION.maxMsAt5x} ms at 5 × IΔn (BS 7671 reg 415.1.1). Outdoor festive lighting ` +
        'normally needs it: make sure a 30 mA general-type RCD protects this circuit.',
    })
  if (r.leakageMa !== undefined && r.ratedMa !== undefined)
    out.push(...leakageFindings(r.leakageMa, r.ratedMa))
  return verdict(out)
}

/** Standing leakage against the RCD's rating: over 30 % advisory, at half or more it may trip. */
export function leakageFindings(leakageMa: number, ratedMa: number): Finding[] {
  const limit = LEAKAGE_LIMIT_FRACTION * ratedMa
  if (leakageMa <= limit) return []
  const mayTrip = leakageMa >= RCD_NO_TRIP_FRACTION * ratedMa
  return [
    {
      code: 'leakage_high',
      level: 'advisory',
      text:
        `Standing leakage ${leakageMa} mA is over ${round(limit)} mA, 30 % of the ${ratedMa} mA rating ` +
        '(BS 7671 reg 531.3.2, from memory)' +
        (mayTrip
          ? `; at half the rating or more the RCD may trip on leakage alone (${STD}).`
          : ': nuisance trips are likely in wet weather.') +
        ' Move strings to another RCD or find the leak.',
    },
  ]
}

const round = (n: number) => Math.round(n * 10) / 10

/** The result from the findings: any fail fails; advisories without a fail make it advisory. */
export function verdict(findings: Finding[]): Judged {
  const result = findings.some((f) => f.level === 'fail')
    ? 'fail'
    : findings.some((f) => f.level === 'advisory')
      ? 'advisory'
      : 'pass'
  return { result, findings, reasons: findings.map((f) => f.text) }
}

/** Judges the readings of an RCD or insulation test; null when they do not decide the result. */
export function judgeReadings(kind: string, r: Readings): Judged | null {
  if (kind === 'rcd_test') return judgeRcd(r)
  if (kind === 'insulation_test') {
    const findings = judgeInsulation(r)
    return findings && verdict(findings)
  }
  return null
}
