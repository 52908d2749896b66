import { describe, expect, it } from 'vitest'
import { iso, isoDay, isoOrNull } from '../../shared/iso-time'

// ISO 8601 / RFC 3339 date-time in UTC with milliseconds, as Date.prototype.toISOString writes it
// (ECMA-262, "Date Time String Format").
describe('DATETIME columns as API text', () => {
  it('writes a Date in UTC', () => {
    expect(iso(new Date(Date.UTC(2026, 11, 3, 21, 5, 9)))).toBe('2026-12-03T21:05:09.000Z')
  })
  it('passes text through and keeps an absent value null', () => {
    expect(isoOrNull('2026-12-03T21:05:09.000Z')).toBe('2026-12-03T21:05:09.000Z')
    expect(isoOrNull(null)).toBeNull()
    expect(isoOrNull(undefined)).toBeNull()
  })
  it('keeps text a never-empty column already holds', () => {
    expect(iso('2026-12-03T21:05:09.000Z')).toBe('2026-12-03T21:05:09.000Z')
  })
})

// Calendar days as RFC 3339 §5.6 "full-date" (YYYY-MM-DD), taken in UTC.
describe('calendar days as API text', () => {
  it('takes the UTC day of an instant, from a Date or epoch milliseconds', () => {
    expect(isoDay(new Date(Date.UTC(2026, 11, 3, 23, 59, 59)))).toBe('2026-12-03')
    expect(isoDay(Date.UTC(2026, 11, 31, 0, 0, 0) + 86_400_000)).toBe('2027-01-01')
  })
})
