import {
  REVIEW_NOTE_MAX,
  REVIEW_NOTE_MIN,
  isolateSteps,
  isolationSteps,
  stepLabel,
  type FindingFilter,
  type IsolationRecord,
  type IsolationSort,
  type ReviewDecision,
  type ReviewFilter,
} from '../../api/isolations'
import { STEP_GAPS } from '../../../shared/isolation-timing'
import { formatNumber } from '../../dates'

export const REVIEW_FILTERS: { value: ReviewFilter; label: string }[] = [
  { value: 'pending', label: 'To review' },
  { value: 'approved', label: 'Approved' },
  { value: 'rejected', label: 'Rejected' },
  { value: 'all', label: 'All' },
]

export const FINDING_FILTERS: { value: FindingFilter; label: string }[] = [
  { value: 'all', label: 'All' },
  { value: 'any', label: 'With findings' },
  { value: 'serious', label: 'Serious' },
]

export const SORTS: { value: IsolationSort; label: string }[] = [
  { value: 'severity', label: 'Worst first' },
  { value: 'newest', label: 'Newest first' },
]

export const REVIEW_LABEL: Record<IsolationRecord['review'], string> = {
  pending: 'To review',
  approved: 'Approved',
  rejected: 'Rejected',
}

export const DECISION_LABEL: Record<ReviewDecision, string> = { approved: 'Approve', rejected: 'Reject' }

export const STATE_LABEL: Record<IsolationRecord['state'], string> = {
  open: 'Started',
  isolated: 'Isolated, not yet handed back',
  restored: 'Handed back',
  abandoned: 'Abandoned',
}

export interface StepRow {
  step: (typeof isolationSteps)[number]
  label: string
  /** Before work (the isolation) or after it (handing the string back). */
  phase: 'before' | 'after'
  doneAt: string | null
  value: string | null
  /** Seconds since the previous recorded step, to spot long gaps and hasty ones. */
  gapSeconds: number | null
  /** Why this step was stamped sooner than it can honestly be done (shared/isolation-timing.ts), or null. */
  tooQuick: string | null
}

/** All ten steps in their safe-isolation order, recorded or not, so a missing one shows as a gap. */
export function stepRows(record: Pick<IsolationRecord, 'steps'>): StepRow[] {
  let previous: number | null = null
  const at = (step: string) => {
    const done = record.steps.find((s) => s.step === step)
    return done ? Date.parse(done.doneAt) : null
  }
  return isolationSteps.map((step) => {
    const done = record.steps.find((s) => s.step === step)
    const stamp = at(step)
    const gapSeconds = stamp !== null && previous !== null ? Math.round((stamp - previous) / 1000) : null
    if (stamp !== null) previous = stamp
    const quick = STEP_GAPS.filter((g) => {
      const from = at(g.from)
      return g.to === step && stamp !== null && from !== null && stamp - from < g.minSeconds * 1000
    })
    const tooQuick = quick.length ? quick.map((g) => g.why).join('; ') : null
    return {
      step,
      label: stepLabel[step],
      phase: (isolateSteps as readonly string[]).includes(step) ? 'before' : 'after',
      doneAt: done?.doneAt ?? null,
      value: stepValueText(step, done?.value ?? null),
      gapSeconds,
      tooQuick,
    }
  })
}

/** What a step recorded, with its unit: the RCD test's trip time is typed in milliseconds ("24 ms"). */
export function stepValueText(step: string, value: string | null): string | null {
  if (value === null || value.trim() === '') return null
  // Typed on the phone as "24" or "24 ms": the same words either way.
  const ms = /^\s*(\d+(?:\.\d+)?)\s*(?:ms)?\s*$/i.exec(value)
  if (step === 'rcd_test' && ms) return `tripped in ${formatNumber(Number(ms[1]), 1)} ms`
  return value
}

/** "+4 s", "+12 min", "+1 h 5 min" after the step before. */
export function gapText(seconds: number): string {
  if (seconds < 60) return `+${seconds} s`
  const minutes = Math.round(seconds / 60)
  return minutes < 60 ? `+${minutes} min` : `+${Math.floor(minutes / 60)} h ${minutes % 60} min`
}

/** Serious findings first; the server's order is kept within each severity. */
export function sortedFindings(record: Pick<IsolationRecord, 'findings'>): IsolationRecord['findings'] {
  const rank = { serious: 0, minor: 1 }
  return [...record.findings].sort((a, b) => rank[a.severity] - rank[b.severity])
}

export function seriousCount(record: Pick<IsolationRecord, 'findings'>): number {
  return record.findings.filter((f) => f.severity === 'serious').length
}

/** A rejection must say why, so the crew can be briefed; so must approving a record with a serious
 * finding (the server holds the same rule). Otherwise an approval may carry a note or not. */
export function noteProblem(decision: ReviewDecision, note: string, serious: number): string | null {
  const length = note.trim().length
  if (decision === 'rejected' && length < REVIEW_NOTE_MIN) return 'Say why it is rejected, for the crew.'
  if (decision === 'approved' && serious > 0 && length < REVIEW_NOTE_MIN)
    return 'Say why it can still be approved despite the serious finding.'
  if (length > REVIEW_NOTE_MAX) return `Keep the note under ${REVIEW_NOTE_MAX} characters.`
  return null
}

/** The note's label says whether it is needed, and never asks for a reason while calling it optional. */
export function noteLabel(decision: ReviewDecision, serious: number): string {
  if (decision === 'rejected') return 'Why is it rejected? (required)'
  return serious > 0 ? 'Why can it still be approved? (required)' : 'Note (optional)'
}

/** Under the note: who reads it and, when it is required, why it is. */
export function noteHint(decision: ReviewDecision, serious: number): string {
  if (decision === 'rejected') return 'Required: the crew is briefed from it. Their supervisor sees it too.'
  if (serious > 0) return 'Required: a serious finding is only approved with a reason on record.'
  return 'The crew and their supervisor see this note.'
}
