import {
  isolateSteps,
  isolationSteps,
  stepLabel,
  type IsolationRecord,
  type ReviewDecision,
  type ReviewFilter,
} from '../../api/safety'

export const REVIEW_FILTERS: { value: ReviewFilter; label: string }[] = [
  { value: 'pending', label: 'To review' },
  { value: 'approved', label: 'Approved' },
  { value: 'rejected', label: 'Rejected' },
  { value: 'all', label: 'All' },
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
  /** Minutes since the previous recorded step, to spot long gaps. */
  gapMinutes: number | null
}

/** All ten steps in their safe-isolation order, recorded or not, so a missing one shows as a gap. */
export function stepRows(record: Pick<IsolationRecord, 'steps'>): StepRow[] {
  let previous: number | null = null
  return isolationSteps.map((step) => {
    const done = record.steps.find((s) => s.step === step)
    const at = done ? Date.parse(done.doneAt) : null
    const gapMinutes = at !== null && previous !== null ? Math.round((at - previous) / 60_000) : null
    if (at !== null) previous = at
    return {
      step,
      label: stepLabel[step],
      phase: (isolateSteps as readonly string[]).includes(step) ? 'before' : 'after',
      doneAt: done?.doneAt ?? null,
      value: done?.value ?? null,
      gapMinutes,
    }
  })
}

/** Serious findings first; the server's order is kept within each severity. */
export function sortedFindings(record: Pick<IsolationRecord, 'findings'>): IsolationRecord['findings'] {
  const rank = { serious: 0, minor: 1 }
  return [...record.findings].sort((a, b) => rank[a.severity] - rank[b.severity])
}

export function seriousCount(record: Pick<IsolationRecord, 'findings'>): number {
  return record.findings.filter((f) => f.severity === 'serious').length
}

/** A rejection must say why, so the crew can be briefed; an approval may carry a note. */
export function noteProblem(decision: ReviewDecision, note: string): string | null {
  if (decision === 'rejected' && note.trim().length < 3) return 'Say why it is rejected, for the crew.'
  if (note.trim().length > 500) return 'Keep the note under 500 characters.'
  return null
}
