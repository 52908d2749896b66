// Safe-isolation steps before work (Electricity at Work Regulations 1989 regs 12–14; HSE HSG85;
// testers to HSE GS38), then the steps that hand the string back, and their words.
// schemas/visits.ts and schemas/isolations.ts build the API's schemas from these.

export const isolateSteps = [
  'identify',
  'isolate',
  'lock_off',
  'prove_tester',
  'test_dead',
  'reprove_tester',
] as const
export const restoreSteps = ['remove_lock', 're_energise', 'functional_check', 'rcd_test'] as const
export const isolationSteps = [...isolateSteps, ...restoreSteps] as const
export type IsolationStep = (typeof isolationSteps)[number]

export const stepLabel: Record<IsolationStep, string> = {
  identify: 'Identify the circuit',
  isolate: 'Isolate',
  lock_off: 'Lock off and post notice',
  prove_tester: 'Prove the tester',
  test_dead: 'Test dead (L–N, L–E, N–E)',
  reprove_tester: 'Re-prove the tester',
  remove_lock: 'Remove lock (the person who fitted it)',
  re_energise: 'Re-energise',
  functional_check: 'Functional check: string lit',
  rcd_test: 'RCD test button',
}
