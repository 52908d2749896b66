// The readings each kind of test asks for, with the published limit beside each input (the same
// rules as shared/test-limits.ts: RCD trip times BS EN 61008-1 / 61009-1 and BS 7671 reg 415.1.1,
// insulation BS 7671:2018 Table 64 by the circuit's voltage, anchor proof load BS 8539).
import { RCD_LIMITS_MS, insulationRequirement, type RcdType } from '../../../shared/test-limits'
import type { CertificateKind, CertificateReadings } from '../../api/safety'

export type ReadingKey = keyof CertificateReadings

export interface ReadingField {
  key: ReadingKey
  label: string
  unit?: string
  /** The published limit beside the input, so the inspector sees what the reading is judged against. */
  limit?: string
  /** A choice instead of a number. */
  options?: { value: string; label: string }[]
}

export const RCD_TYPE_OPTIONS = [
  { value: 'general', label: 'General (no delay)' },
  { value: 'S', label: 'Time-delayed (type S)' },
]
/** ½ × IΔn: the RCD must hold. Stored as noTripAtHalf true / false; blank = not tested. */
export const HALF_OPTIONS = [
  { value: 'held', label: 'Did not trip (correct)' },
  { value: 'tripped', label: 'Tripped' },
]

const STD = 'BS EN 61008-1'
function window(t: RcdType, at: 'x1' | 'x2' | 'x5'): string {
  const [low, high] = RCD_LIMITS_MS[t][at]
  return t === 'S' ? `${low}–${high} ms for type S — ${STD}` : `≤ ${high} ms — ${STD}`
}

export function readingFields(
  kind: CertificateKind,
  typed: Partial<Record<ReadingKey, string>>,
): ReadingField[] {
  if (kind === 'rcd_test') {
    const t: RcdType = typed.rcdType === 'S' ? 'S' : 'general'
    return [
      {
        key: 'rcdType',
        label: 'RCD type',
        options: RCD_TYPE_OPTIONS,
        limit: 'As recorded for the circuit; change it if the device fitted differs',
      },
      {
        key: 'ratedMa',
        label: 'Rated residual current IΔn',
        unit: 'mA',
        limit: '≤ 30 mA, general type, for additional protection — BS 7671 reg 415.1.1',
      },
      {
        key: 'noTripAtHalf',
        label: 'At ½ × IΔn',
        options: HALF_OPTIONS,
        limit: `must not trip — ${STD}; blank: not tested`,
      },
      { key: 'tripMsAt1x', label: 'Trip time at 1 × IΔn', unit: 'ms', limit: window(t, 'x1') },
      { key: 'tripMsAt2x', label: 'Trip time at 2 × IΔn', unit: 'ms', limit: window(t, 'x2') },
      { key: 'tripMsAt5x', label: 'Trip time at 5 × IΔn', unit: 'ms', limit: window(t, 'x5') },
      {
        key: 'leakageMa',
        label: 'Standing leakage, load on (optional)',
        unit: 'mA',
        limit: '≤ 30 % of IΔn — BS 7671 reg 531.3.2 (from memory)',
      },
    ]
  }
  if (kind === 'insulation_test') {
    const volts = Number(typed.circuitVolts)
    const need = insulationRequirement(Number.isFinite(volts) && volts > 0 ? volts : undefined)
    return [
      { key: 'circuitVolts', label: 'Circuit voltage', unit: 'V AC', limit: 'decides the minimum' },
      {
        key: 'testVolts',
        label: 'Test voltage',
        unit: 'V DC',
        limit: `${need.testVolts} V for this circuit (${need.label}); lower only where surge protection forces it`,
      },
      {
        key: 'megohms',
        label: 'Insulation resistance',
        unit: 'MΩ',
        limit: `≥ ${need.minMegohms.toFixed(1)} MΩ for this circuit (${need.label}) — BS 7671 Table 64`,
      },
    ]
  }
  if (kind === 'anchor_test')
    return [
      {
        key: 'proofLoadKn',
        label: 'Proof load',
        unit: 'kN',
        limit: 'as the client’s conditions set (e.g. 6 kN, BS 8539)',
      },
    ]
  if (kind === 'platform_exam') return [{ key: 'safeWorkingLoadKg', label: 'Safe working load', unit: 'kg' }]
  return []
}

/** Typed text to readings; blanks drop out, anything unreadable is reported instead of sent. */
export function parseReadings(
  kind: CertificateKind,
  typed: Partial<Record<ReadingKey, string>>,
): { readings: CertificateReadings; bad: ReadingKey[] } {
  const readings: CertificateReadings = {}
  const bad: ReadingKey[] = []
  for (const field of readingFields(kind, typed)) {
    const text = (typed[field.key] ?? '').trim().replace(',', '.')
    if (!text) continue
    if (field.key === 'rcdType') readings.rcdType = text === 'S' ? 'S' : 'general'
    else if (field.key === 'noTripAtHalf') readings.noTripAtHalf = text === 'held'
    else {
      const n = Number(text)
      const whole = field.key === 'circuitVolts' ? Number.isInteger(n) : true
      if (Number.isFinite(n) && n >= 0 && whole) (readings[field.key] as number) = n
      else bad.push(field.key)
    }
  }
  return { readings, bad }
}
