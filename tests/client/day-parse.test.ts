// A day typed into a date field: the app's one written form ("3 Dec 2026", English month names and
// abbreviations as in the Unicode CLDR en-GB calendar) or ISO 8601 (YYYY-MM-DD) in, ISO 8601 out.
import { describe, expect, it } from 'vitest'
import { parseDay } from '../../src/dates'

describe('a typed day', () => {
  it('reads the app’s own form and ISO 8601', () => {
    expect(parseDay('3 Dec 2026')).toBe('2026-12-03')
    expect(parseDay('3 December 2026')).toBe('2026-12-03')
    expect(parseDay(' 14 sep 2027 ')).toBe('2027-09-14')
    expect(parseDay('2026-12-03')).toBe('2026-12-03')
  })
  it('refuses days that do not exist and half-typed text', () => {
    // 2027 is not a leap year (Gregorian rule: divisible by 4, not by 100 unless by 400).
    expect(parseDay('29 Feb 2027')).toBeNull()
    expect(parseDay('29 Feb 2028')).toBe('2028-02-29')
    expect(parseDay('2026-13-01')).toBeNull()
    expect(parseDay('2026-12-1')).toBeNull()
    expect(parseDay('3 Dex 2026')).toBeNull()
    expect(parseDay('3 Dec 20')).toBeNull()
    expect(parseDay('12/03/2026')).toBeNull()
  })
})
