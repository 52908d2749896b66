import { describe, expect, it } from 'vitest'
import { runTitle } from '../../src/pages/run/run-title'

// Issue 14: the run page's title follows the day shown. Weekdays from the Gregorian calendar:
// 3 Dec 2026 is a Thursday, 5 Dec 2026 a Saturday, 31 Dec 2026 a Thursday, 1 Jan 2027 a Friday.
describe('the run page title', () => {
  it('reads tonight for today or the shift under way', () => {
    expect(runTitle(null, '2026-12-03')).toBe("Tonight's run")
    expect(runTitle('2026-12-03', '2026-12-03')).toBe("Tonight's run")
  })
  it('reads tomorrow for the next day, across a year end too', () => {
    expect(runTitle('2026-12-04', '2026-12-03')).toBe("Tomorrow's run")
    expect(runTitle('2027-01-01', '2026-12-31')).toBe("Tomorrow's run")
  })
  it('names the weekday for any other day', () => {
    expect(runTitle('2026-12-05', '2026-12-03')).toBe("Saturday's run")
    expect(runTitle('2026-12-31', '2026-12-03')).toBe("Thursday's run")
    expect(runTitle('2026-12-02', '2026-12-03')).toBe("Wednesday's run")
  })
})
