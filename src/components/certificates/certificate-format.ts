import { judgeReadings, type Judged } from '../../../shared/test-limits'
import type { CertificateKind, CertificateReadings, CertificateRecord, DueFilter } from '../../api/safety'
import { addDays, daysBetween } from '../../dates'
import { kindsForSubject } from '../../../shared/vocab/certificates'

export type Result = CertificateRecord['result']
export type SubjectType = CertificateRecord['subjectType']
export { parseReadings, readingFields, type ReadingField, type ReadingKey } from './reading-fields'
export type { Judged }

export const RESULT_LABEL: Record<Result, string> = { pass: 'Pass', fail: 'Fail', advisory: 'Advisory' }

export const DUE_FILTERS: { value: DueFilter; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'overdue', label: 'Overdue' },
  { value: 'soon', label: 'Due in 30 days' },
  { value: 'failed', label: 'Failed' },
]

/** Which tests fit which subject: a new test on a row may change kind only within these (shared with the server). */
export const KINDS_FOR_SUBJECT = kindsForSubject

/** Kinds whose readings decide pass or fail on the server; the others take the inspector's result. */
export function judgedByReadings(kind: CertificateKind): boolean {
  return kind === 'rcd_test' || kind === 'insulation_test'
}

/** The same judgement the server makes (shared/test-limits.ts), to preview before saving. */
export function previewResult(kind: CertificateKind, readings: CertificateReadings): Judged | null {
  return judgeReadings(kind, readings)
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

/** One line of the readings that matter, e.g. "30 mA · held at ½× · 22 ms at 1× · 14 ms at 5×". */
export function readingsSummary(readings: CertificateRecord['readings']): string {
  if (!readings) return ''
  const r = readings as Record<string, unknown>
  const half = r.noTripAtHalf === true ? 'held at ½×' : r.noTripAtHalf === false ? 'tripped at ½×' : null
  const parts = [
    r.rcdType === 'S' && 'type S',
    num(r.ratedMa) && `${num(r.ratedMa)} mA`,
    half,
    num(r.tripMsAt1x) && `${num(r.tripMsAt1x)} ms at 1×`,
    num(r.tripMsAt2x) && `${num(r.tripMsAt2x)} ms at 2×`,
    num(r.tripMsAt5x) && `${num(r.tripMsAt5x)} ms at 5×`,
    num(r.leakageMa) && `leakage ${num(r.leakageMa)} mA`,
    num(r.megohms) && `${num(r.megohms)} MΩ${num(r.testVolts) ? ` at ${num(r.testVolts)} V` : ''}`,
    num(r.circuitVolts) && `${num(r.circuitVolts)} V circuit`,
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
