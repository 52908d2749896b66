// What a safety officer looks for in an isolation record (safe isolation per Electricity at Work
// Regulations 1989 regs 12–14, HSE HSG85; testers to HSE GS38; RCD test after work — trade-reference §6).
import type { Finding } from '../../shared/schemas/isolations'
import { isolateSteps, restoreSteps, stepLabel, type IsolationStep } from '../../shared/schemas/visits'

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
  const rcd = r.steps.find((s) => s.step === 'rcd_test')
  if (rcd && !rcd.value)
    out.push({ code: 'rcd_no_reading', severity: 'minor', message: 'RCD test recorded without a trip time.' })
  return out
}
