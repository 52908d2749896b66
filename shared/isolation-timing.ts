// How close together two isolation steps may honestly be stamped. A step stamped sooner than this
// after the one before was most likely ticked off in a batch, not done as the record says.
//
// Every figure here is common practice, no source: the guidance we know (EAWR 1989 regs 12–14,
// HSE HSG85, HSE GS38; from memory) gives the steps and their order but no duration for any. They are set low on purpose, so that a
// careful, quick electrician never trips them; the reasoning is written beside each one.
import type { IsolationStep } from './vocab/visits'

export interface StepGap {
  from: IsolationStep
  to: IsolationStep
  /** The gap in a few words, for a finding's message. */
  name: string
  /** Fewest seconds that can honestly pass between the two stamps. */
  minSeconds: number
  /** Why, in words a safety officer can repeat to the crew. */
  why: string
}

export const STEP_GAPS: readonly StepGap[] = [
  {
    from: 'lock_off',
    to: 'test_dead',
    name: 'lock-off to dead test',
    // Common practice, no source: fit the lock and tag and post the notice (about 10 s), take up and
    // prove the tester (about 5 s), then three probe pairs read one by one (about 10 s): 10 + 5 + 10 = 25 s.
    minSeconds: 25,
    why: 'fitting the lock and notice, proving the tester and testing three pairs takes at least 25 seconds',
  },
  {
    from: 'prove_tester',
    to: 'test_dead',
    name: 'proving the tester to dead test',
    // Common practice, no source: three probe pairs (L–N, L–E, N–E), each placed, held until the
    // display settles and read: about 3 s a pair, so under ~10 s is not three real tests.
    minSeconds: 10,
    why: 'three probe pairs (L–N, L–E, N–E), each held and read, take at least 10 seconds',
  },
  {
    from: 'test_dead',
    to: 'reprove_tester',
    name: 'dead test to re-proving',
    // Common practice, no source: take the probes off the circuit, put them on the proving unit and
    // read the display again: a few seconds at the least.
    minSeconds: 5,
    why: 'moving the probes back to the proving unit and reading it takes at least 5 seconds',
  },
  {
    from: 'reprove_tester',
    to: 'remove_lock',
    name: 're-proving to removing the lock (the work itself)',
    // Common practice, no source: the work happens between these stamps — reach the string, change
    // a lamp or a fuse, come back down to the lock. Even one lamp within arm's reach is a minute.
    minSeconds: 60,
    why: 'the work itself (reach the string, change a lamp or fuse, come back to the lock) takes at least a minute',
  },
]

/**
 * The proving check, the dead test and the re-proving check together (prove_tester → reprove_tester).
 * Common practice, no source: the two minimums above that fall inside it add up to 10 s + 5 s = 15 s.
 * A whole prove–test–re-prove under 15 s means the dead test most likely was not done at all, so it
 * is a serious finding; one short gap inside a longer sequence is only a minor one.
 */
export const TEST_SEQUENCE_MIN_SECONDS = 15
