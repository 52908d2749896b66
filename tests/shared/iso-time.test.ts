import { describe, expect, it } from 'vitest'
import { iso, isoOrNull } from '../../shared/iso-time'

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
})
