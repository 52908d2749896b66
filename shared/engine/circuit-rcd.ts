// A circuit's RCD: additional protection and standing leakage (trade-reference §5).
import type { CircuitReason, CircuitResponse, CircuitString } from '../schemas/engine'
import { ADDITIONAL_PROTECTION, LEAKAGE_LIMIT_FRACTION, RCD_NO_TRIP_FRACTION } from '../test-limits'

const mA = (n: number) => `${Math.round(n * 10) / 10} mA`

/**
 * Additional protection needs IΔn ≤ 30 mA and a trip within 40 ms at 5 × IΔn (BS 7671 reg 415.1.1):
 * a time-delayed (S) RCD is allowed 50–150 ms there (BS EN 61008-1), so it never gives it. Standing
 * leakage over 30 % of IΔn is flagged (BS 7671 reg 531.3.2, from memory); at 50 % or more the RCD may
 * trip on it (BS EN 61008-1 no-trip point). Leakage is the measured circuit figure when given, else the
 * strings' own figures summed; with neither it is "not measured", never assumed to be zero.
 */
export function rcdVerdict(
  ratedMa: number,
  rcdType: 'general' | 'S',
  strings: CircuitString[],
  measured: number | undefined,
  reasons: CircuitReason[],
): NonNullable<CircuitResponse['rcd']> {
  const known = strings.filter((s) => s.leakageMilliamps !== undefined)
  const leakage = measured ?? (known.length ? known.reduce((s, x) => s + (x.leakageMilliamps ?? 0), 0) : null)
  const limit = LEAKAGE_LIMIT_FRACTION * ratedMa
  const additionalProtection = ratedMa <= ADDITIONAL_PROTECTION.maxMilliamps && rcdType === 'general'
  if (!additionalProtection)
    reasons.push({
      code: 'rcd_no_additional_protection',
      text:
        `A ${ratedMa} mA ${rcdType === 'S' ? 'time-delayed (S) ' : ''}RCD does not give additional protection: ` +
        `that needs ${ADDITIONAL_PROTECTION.maxMilliamps} mA or less and a trip within ` +
        `${ADDITIONAL_PROTECTION.maxMsAt5x} ms at 5 × IΔn (BS 7671 reg 415.1.1). Make sure a 30 mA ` +
        'general-type RCD protects these strings.',
    })
  let risk: NonNullable<CircuitResponse['rcd']>['risk'] = 'ok'
  if (leakage === null) {
    risk = 'not measured'
    reasons.push({
      code: 'leakage_not_measured',
      text: `Standing leakage not measured: record it with the RCD test (it should stay at or below ${mA(limit)}).`,
    })
  } else if (leakage >= RCD_NO_TRIP_FRACTION * ratedMa) {
    risk = 'may trip'
    reasons.push({
      code: 'leakage_may_trip',
      text:
        `Standing leakage ${mA(leakage)} is half the RCD's ${ratedMa} mA rating or more: it may trip on ` +
        'leakage alone. Move strings to another RCD or find the leak.',
    })
  } else if (leakage > limit) {
    risk = 'high'
    reasons.push({
      code: 'leakage_high',
      text:
        `Standing leakage ${mA(leakage)} is over ${mA(limit)}, 30 % of the RCD's ${ratedMa} mA rating ` +
        '(BS 7671 reg 531.3.2): nuisance trips are likely in wet weather. Move strings or find the leak.',
    })
  }
  return { rcdType, leakageMilliamps: leakage, leakageLimitMilliamps: limit, additionalProtection, risk }
}
