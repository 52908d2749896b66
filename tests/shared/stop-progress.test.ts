import { describe, expect, it } from 'vitest'
import { runCounts, stopState, type StopVisit } from '../../shared/stop-progress'

// Issue 14 (crew screens): a stop reads done, still open or new fault found after a visit. The
// string states a visit leaves are the product brief's (Lit, Watch, Replace now, Dark, Made safe);
// Lit, Watch and Made safe close a string's items (queue rule), so those stops are done.
const v = (o: Partial<StopVisit>): StopVisit => ({
  at: '2026-12-03T20:00:00.000Z',
  statusAfter: 'lit',
  lampsOutAfter: 0,
  failedFound: 0,
  darkOnArrival: false,
  ...o,
})
const facts = { kind: 'replace_now', doneAt: null, itemClosed: false }

describe('stop progress', () => {
  it('is to do before any visit, done once the item closes without one', () => {
    expect(stopState({ ...facts, visits: [] }).state).toBe('todo')
    expect(stopState({ ...facts, itemClosed: true, visits: [] }).state).toBe('done')
  })
  it('is done when the last visit left the string lit, on watch or made safe', () => {
    for (const statusAfter of ['lit', 'watch', 'safe'] as const)
      expect(stopState({ ...facts, visits: [v({ statusAfter })] }).state).toBe('done')
  })
  it('is still open when visited but still to be replaced, a new fault when more was found', () => {
    expect(stopState({ ...facts, visits: [v({ statusAfter: 'replace', lampsOutAfter: 3 })] })).toMatchObject({
      state: 'open',
      lampsOutAfter: 3,
      visits: 1,
    })
    const found = [v({ statusAfter: 'replace', failedFound: 1 }), v({ statusAfter: 'replace' })]
    expect(stopState({ ...facts, visits: found }).state).toBe('new_fault')
    // Found dark on a stop that was not about darkness: a new fault.
    const dark = [v({ statusAfter: 'dark', darkOnArrival: true })]
    expect(stopState({ ...facts, kind: 'forecast_dark', visits: dark }).state).toBe('new_fault')
    expect(stopState({ ...facts, kind: 'dark', visits: dark }).state).toBe('open')
  })
  it('takes an emergency log as done, unless a later visit says otherwise', () => {
    const doneAt = '2026-12-03T19:00:00.000Z'
    expect(stopState({ ...facts, doneAt, visits: [] })).toMatchObject({ state: 'done', at: doneAt })
    expect(stopState({ ...facts, doneAt, visits: [v({ statusAfter: 'replace' })] }).state).toBe('open')
  })
  it('counts stops done and left', () => {
    const done = stopState({ ...facts, visits: [v({})] })
    const open = stopState({ ...facts, visits: [v({ statusAfter: 'replace' })] })
    expect(runCounts([done, open, undefined])).toEqual({ done: 1, left: 2 })
  })
})
