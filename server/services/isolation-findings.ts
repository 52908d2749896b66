// What a safety officer looks for in an isolation record (safe isolation per Electricity at Work
// Regulations 1989 regs 12–14, HSE HSG85; testers to HSE GS38; RCD test after work — trade-reference §6).
import type { Finding } from '../../shared/schemas/isolations'
import { isolateSteps, restoreSteps, stepLabel, type IsolationStep } from '../../shared/vocab/visits'
import { STEP_GAPS, TEST_SEQUENCE_MIN_SECONDS } from '../../shared/isolation-timing'

interface Record {
  state: string
  lockId: string | null
  testerId: string | null
  steps: { step: IsolationStep; doneAt: string; value: string | null }[]
}

const at = (r: Record, s: IsolationStep) => {
  const x = r.steps.find((y) => y.step === s)
  return x ? Date.parse(x.doneAt) : null
}

export function isolationFindings(r: Record): Finding[] {
  const out: Finding[] = []
  const missingBefore = isolateSteps.filter((s) => at(r, s) === null)
  if (missingBefore.length) {
    out.push({
      code: 'missing_isolation_steps',
      severity: 'serious',
      message: `Not recorded before work: ${missingBefore.map((s) => stepLabel[s]).join(', ')}.`,
    })
  }
  const missingAfter = restoreSteps.filter((s) => at(r, s) === null)
  if (!missingBefore.length && missingAfter.length && r.state !== 'isolated') {
    out.push({
      code: 'missing_restore_steps',
      severity: 'minor',
      message: `Not recorded after work: ${missingAfter.map((s) => stepLabel[s]).join(', ')}.`,
    })
  }
  if (!r.lockId)
    out.push({
      code: 'no_lock_id',
      severity: 'serious',
      message: 'No lock identifier: a lock-off must use a unique key.',
    })
  if (!r.testerId)
    out.push({ code: 'no_tester_id', severity: 'minor', message: 'No tester identifier recorded.' })
  const prove = at(r, 'prove_tester')
  const dead = at(r, 'test_dead')
  const reprove = at(r, 'reprove_tester')
  // A proving check minutes apart is normal; an hour between proving and testing dead is not.
  if (prove && dead && dead - prove > 60 * 60_000) {
    out.push({
      code: 'slow_prove_test',
      severity: 'minor',
      message: 'More than an hour between proving the tester and testing dead.',
    })
  }
  if (dead && reprove && reprove - dead > 30 * 60_000) {
    out.push({
      code: 'late_reprove',
      severity: 'minor',
      message: 'Tester re-proved more than 30 minutes after the dead test.',
    })
  }
  out.push(...hasteFindings(r))
  const rcd = r.steps.find((s) => s.step === 'rcd_test')
  if (rcd && !rcd.value)
    out.push({ code: 'rcd_no_reading', severity: 'minor', message: 'RCD test recorded without a trip time.' })
  return out
}

const seconds = (ms: number) => Math.round(ms / 1000)

/**
 * Steps stamped closer together than they can honestly be done (thresholds in shared/isolation-timing.ts,
 * common practice). A whole prove–test–re-prove that short is serious: the dead test was most likely
 * not done. Other short gaps are minor: a record ticked off in a batch, to be asked about.
 */
export function hasteFindings(r: Record): Finding[] {
  const out: Finding[] = []
  const prove = at(r, 'prove_tester')
  const reprove = at(r, 'reprove_tester')
  const sequence = prove !== null && reprove !== null ? reprove - prove : null
  const rushed = sequence !== null && sequence < TEST_SEQUENCE_MIN_SECONDS * 1000
  if (rushed) {
    out.push({
      code: 'hasty_test_sequence',
      severity: 'serious',
      message:
        `Tester proved, circuit tested dead and tester re-proved within ${seconds(sequence)} s. ` +
        `Done properly this takes at least ${TEST_SEQUENCE_MIN_SECONDS} s: ask whether the dead test was done.`,
    })
  }
  const short = STEP_GAPS.filter((g) => {
    // Gaps inside a rushed sequence are already said by the serious finding.
    if (rushed && g.from !== 'lock_off' && g.to !== 'remove_lock') return false
    const a = at(r, g.from)
    const b = at(r, g.to)
    return a !== null && b !== null && b - a < g.minSeconds * 1000
  })
  if (short.length) {
    const parts = short.map(
      (g) => `${g.name} ${seconds(at(r, g.to)! - at(r, g.from)!)} s (at least ${g.minSeconds} s)`,
    )
    out.push({
      code: 'hasty_steps',
      severity: 'minor',
      message: `Steps stamped too close together to have been done one by one: ${parts.join('; ')}.`,
    })
  }
  return out
}
