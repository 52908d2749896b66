import { describe, expect, it } from 'vitest'
import {
  addDays,
  daysBetween,
  formatDate,
  formatNumber,
  isFuture,
  isToday,
  setDateSettings,
  toInstant,
} from '../../src/dates'

// Dates show in the app's zone (default Europe/London), whatever the device's. London is on UTC in
// December and on UTC+1 (BST) in July (UK Summer Time Order 2002; timeanddate.com).
// Expected texts are the app's chosen formats (common practice, no source); ISO 8601 for the machine ones.
const at = new Date(Date.UTC(2026, 11, 3, 21, 5, 9))

describe('the client’s dates', () => {
  it('shows each style the same way everywhere', () => {
    expect(formatDate(at, 'date')).toBe('3 Dec 2026')
    expect(formatDate(at, 'dateTime')).toBe('3 Dec 2026, 21:05')
    expect(formatDate(at, 'weekdayTime')).toBe('Thu 3 Dec, 21:05')
    expect(formatDate(at, 'longWeekdayDate')).toBe('Thursday 3 December 2026')
    expect(formatDate(at, 'dayMonthTime')).toBe('3 Dec, 21:05')
    expect(formatDate(at, 'timeSeconds')).toBe('21:05:09')
  })
  it('writes ISO 8601 for the API, inputs, CSV and file names', () => {
    expect(formatDate(at, 'isoDate')).toBe('2026-12-03')
    expect(formatDate(at, 'isoMinute')).toBe('2026-12-03T21:05')
    expect(formatDate(at, 'isoStamp')).toMatch(/^2026-12-03T21:05:09[+-]\d\d:\d\d$/)
    expect(formatDate(at, 'csv')).toBe('2026-12-03 21:05')
    expect(formatDate(at, 'file')).toBe('2026-12-03-2105')
  })
  it('reads the server’s calendar days as that day, not the day before in a western zone', () => {
    expect(formatDate('2026-12-03', 'date')).toBe('3 Dec 2026')
  })
  it('shows the fallback when there is no date', () => {
    expect(formatDate(null, 'date', '—')).toBe('—')
    expect(formatDate(undefined, 'time')).toBe('')
  })
  it('counts calendar days across a month and a year end', () => {
    expect(addDays('2026-12-30', 3)).toBe('2027-01-02')
    expect(daysBetween('2026-02-27', '2026-03-01')).toBe(2)
  })
  it('knows today and the future', () => {
    expect(isToday(new Date())).toBe(true)
    expect(isFuture(new Date(Date.now() + 60_000))).toBe(true)
    expect(isFuture(new Date(Date.now() - 60_000))).toBe(false)
    expect(isFuture('')).toBe(false)
  })

  it('shows instants on the app zone’s clock and reads input times in it', () => {
    expect(formatDate(new Date(Date.UTC(2026, 6, 1, 23, 30)), 'dateTime')).toBe('2 Jul 2026, 00:30')
    expect(toInstant('2026-07-01T16:00')).toBe('2026-07-01T15:00:00.000Z')
    setDateSettings({ timeZone: 'Europe/Paris', locale: 'en-GB' })
    try {
      // Paris is UTC+1 in December (CET).
      expect(formatDate(at, 'time')).toBe('22:05')
      expect(formatDate('2026-12-03', 'date')).toBe('3 Dec 2026')
    } finally {
      setDateSettings({ timeZone: 'Europe/London', locale: 'en-GB' })
    }
  })
  it('writes numbers in the app locale', () => {
    // en-GB: comma thousands separator, point decimal (CLDR en-GB).
    expect(formatNumber(12345.678, 1)).toBe('12,345.7')
    setDateSettings({ timeZone: 'Europe/London', locale: 'de-DE' })
    try {
      // de-DE: point thousands separator, comma decimal (CLDR de).
      expect(formatNumber(12345.678, 1)).toBe('12.345,7')
    } finally {
      setDateSettings({ timeZone: 'Europe/London', locale: 'en-GB' })
    }
  })
})
