import { RCD_MAX_MS, insulationMinimumMegohms, judgeReadings } from '../../../shared/test-limits'
import type { CertificateKind, CertificateReadings, CertificateRecord, DueFilter } from '../../api/safety'
import { addDays, daysBetween } from '../../dates'

export type Result = CertificateRecord['result']
export type SubjectType = CertificateRecord['subjectType']
export type ReadingKey = keyof CertificateReadings

export const RESULT_LABEL: Record<Result, string> = { pass: 'Pass', fail: 'Fail', advisory: 'Advisory' }

export const DUE_FILTERS: { value: DueFilter; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'overdue', label: 'Overdue' },
  { value: 'soon', label: 'Due in 30 days' },
  { value: 'failed', label: 'Failed' },
]

/** Which tests fit which subject: a new test on a row may change kind only within these. */
export const KINDS_FOR_SUBJECT: Record<SubjectType, CertificateKind[]> = {
  platform: ['platform_exam', 'platform_pre_use'],
  structure: ['column_structural', 'anchor_test'],
  string: ['display_inspection'],
  circuit: ['rcd_test', 'insulation_test'],
}

export interface ReadingField {
  key: ReadingKey
  label: string
  unit: string
  /** The published limit beside the input, so the inspector sees what the reading is judged against. */
  limit?: string
}

// Limits as in shared/test-limits.ts: RCD trip times BS EN 61008-1 / 61009-1 and BS 7671 reg 415.1.1,
// insulation BS 7671:2018 Table 64; anchor proof load BS 8539 (trade-reference §5, §7).
export const READING_FIELDS: Partial<Record<CertificateKind, ReadingField[]>> = {
  rcd_test: [
    {
      key: 'ratedMa',
      label: 'Rated residual current IΔn',
      unit: 'mA',
      limit: '≤ 30 mA for additional protection — BS 7671 reg 415.1.1',
    },
    {
      key: 'tripMsAt1x',
      label: 'Trip time at 1 × IΔn',
      unit: 'ms',
      limit: `≤ ${RCD_MAX_MS.x1} ms — BS EN 61008-1`,
    },
    {
      key: 'tripMsAt5x',
      label: 'Trip time at 5 × IΔn',
      unit: 'ms',
      limit: `≤ ${RCD_MAX_MS.x5} ms — BS EN 61008-1`,
    },
  ],
  insulation_test: [
    {
      key: 'testVolts',
      label: 'Test voltage',
      unit: 'V DC',
      limit: '500 V for circuits up to 500 V; 250 V for SELV/PELV',
    },
    {
      key: 'megohms',
      label: 'Insulation resistance',
      unit: 'MΩ',
      limit: '≥ 1.0 MΩ at 500 V, ≥ 0.5 MΩ at 250 V — BS 7671 Table 64',
    },
  ],
  anchor_test: [
    {
      key: 'proofLoadKn',
      label: 'Proof load',
      unit: 'kN',
      limit: 'as the client’s conditions set (e.g. 6 kN, BS 8539)',
    },
  ],
  platform_exam: [{ key: 'safeWorkingLoadKg', label: 'Safe working load', unit: 'kg' }],
}

/** Kinds whose readings decide pass or fail on the server; the others take the inspector's result. */
export function judgedByReadings(kind: CertificateKind): boolean {
  return kind === 'rcd_test' || kind === 'insulation_test'
}

/** Typed text to numbers; blanks drop out, anything unreadable is reported instead of sent. */
export function parseReadings(
  kind: CertificateKind,
  typed: Partial<Record<ReadingKey, string>>,
): { readings: CertificateReadings; bad: ReadingKey[] } {
  const readings: CertificateReadings = {}
  const bad: ReadingKey[] = []
  for (const field of READING_FIELDS[kind] ?? []) {
    const text = (typed[field.key] ?? '').trim().replace(',', '.')
    if (!text) continue
    const n = Number(text)
    if (Number.isFinite(n) && n >= 0) readings[field.key] = n
    else bad.push(field.key)
  }
  return { readings, bad }
}

/** The same judgement the server makes (shared/test-limits.ts), to preview before saving. */
export function previewResult(kind: CertificateKind, readings: CertificateReadings) {
  return judgeReadings(kind, readings)
}

export function insulationMinimum(testVolts: number | undefined): number {
  return insulationMinimumMegohms(testVolts ?? 500)
}

export function dueText(daysToDue: number | null): string {
  if (daysToDue === null) return 'No next date set'
  if (daysToDue < 0) return `Overdue by ${-daysToDue} day${daysToDue === -1 ? '' : 's'}`
  if (daysToDue === 0) return 'Due today'
  return `Due in ${daysToDue} day${daysToDue === 1 ? '' : 's'}`
}

export function dueState(daysToDue: number | null): 'overdue' | 'soon' | 'later' | 'none' {
  if (daysToDue === null) return 'none'
  if (daysToDue < 0) return 'overdue'
  return daysToDue <= 30 ? 'soon' : 'later'
}

const num = (n: unknown) => (typeof n === 'number' ? String(n) : null)

/** One line of the readings that matter, e.g. "30 mA · 22 ms at 1× · 14 ms at 5×". */
export function readingsSummary(readings: CertificateRecord['readings']): string {
  if (!readings) return ''
  const r = readings as Record<string, unknown>
  const parts = [
    num(r.ratedMa) && `${num(r.ratedMa)} mA`,
    num(r.tripMsAt1x) && `${num(r.tripMsAt1x)} ms at 1×`,
    num(r.tripMsAt5x) && `${num(r.tripMsAt5x)} ms at 5×`,
    num(r.megohms) && `${num(r.megohms)} MΩ${num(r.testVolts) ? ` at ${num(r.testVolts)} V` : ''}`,
    num(r.proofLoadKn) && `proof load ${num(r.proofLoadKn)} kN`,
    num(r.safeWorkingLoadKg) && `SWL ${num(r.safeWorkingLoadKg)} kg`,
  ]
  return parts.filter(Boolean).join(' · ')
}

/** The next due date at the same interval as the previous certificate, if it had one. */
export function sameIntervalDue(
  previous: Pick<CertificateRecord, 'doneOn' | 'nextDue'>,
  doneOn: string,
): string {
  if (!previous.nextDue) return ''
  const days = daysBetween(previous.doneOn, previous.nextDue)
  return days > 0 ? addDays(doneOn, days) : ''
}
