import { describe, expect, it } from 'vitest'
import {
  addDays,
  dueAfter,
  endOfLocalDay,
  forecastInstant,
  formatDay,
  isTimeZone,
  localClock,
  localDay,
  localInstant,
  localToday,
  shiftDate,
  shiftInstants,
} from '../../shared/local-time'
import { burningHoursToDate } from '../../shared/engine/calendar'

const LONDON = 'Europe/London'
const SHIFT = { start: '16:00', end: '00:30' }

// UK clock changes in 2026, from the Summer Time Act 1972 as amended by the Summer Time Order 2002
// (EU Directive 2000/84/EC rule: last Sunday of March and of October at 01:00 GMT); dates checked
// against timeanddate.com's "Time Zone in London, England" page:
// BST starts 2026-03-29 01:00 UTC, BST ends 2026-10-25 01:00 UTC (clocks go back 02:00 BST → 01:00 GMT).
describe('local day and clock in a zone', () => {
  it('is a day ahead of UTC late in the evening east of Greenwich', () => {
    // 2026-12-02 23:30 UTC is 2026-12-03 00:30 in Paris (CET = UTC+1 in winter).
    expect(localDay(new Date('2026-12-02T23:30:00Z'), 'Europe/Paris')).toBe('2026-12-03')
    expect(localToday(LONDON, new Date('2026-12-02T23:30:00Z'))).toBe('2026-12-02')
  })
  it('reads London summer time as UTC+1 and winter time as UTC', () => {
    expect(localClock(new Date('2026-07-01T15:00:00Z'), LONDON)).toBe('16:00')
    expect(localClock(new Date('2026-12-01T15:00:00Z'), LONDON)).toBe('15:00')
  })
  it('turns a local HH:mm on a date into the instant, either side of the October change', () => {
    expect(localInstant('2026-10-24', '16:00', LONDON).toISOString()).toBe('2026-10-24T15:00:00.000Z')
    expect(localInstant('2026-10-25', '16:00', LONDON).toISOString()).toBe('2026-10-25T16:00:00.000Z')
  })
  it('takes the later instant for the repeated hour and skips the missing one', () => {
    // 01:30 on 25 Oct 2026 happens twice (00:30 UTC in BST, 01:30 UTC in GMT): the later.
    expect(localInstant('2026-10-25', '01:30', LONDON).toISOString()).toBe('2026-10-25T01:30:00.000Z')
    // 01:30 on 29 Mar 2026 never happens in London; moved forward an hour to 02:30 BST = 01:30 UTC.
    expect(localInstant('2026-03-29', '01:30', LONDON).toISOString()).toBe('2026-03-29T01:30:00.000Z')
  })
  it('adds calendar days across month, year and clock changes', () => {
    expect(addDays('2026-10-24', 2)).toBe('2026-10-26')
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01')
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28')
  })
  it('knows real zone names only', () => {
    expect(isTimeZone('Europe/London')).toBe(true)
    expect(isTimeZone('Mars/Olympus')).toBe(false)
  })
})

describe('shift date: a shift past midnight is one run', () => {
  it('puts 23:50 and 00:20 of a 16:00–00:30 shift on the same run date', () => {
    const before = localInstant('2026-12-02', '23:50', LONDON)
    const after = localInstant('2026-12-03', '00:20', LONDON)
    expect(shiftDate(before, SHIFT, LONDON)).toBe('2026-12-02')
    expect(shiftDate(after, SHIFT, LONDON)).toBe('2026-12-02')
  })
  it('moves to the new day once the shift has ended', () => {
    expect(shiftDate(localInstant('2026-12-03', '00:40', LONDON), SHIFT, LONDON)).toBe('2026-12-03')
    expect(shiftDate(localInstant('2026-12-03', '10:00', LONDON), SHIFT, LONDON)).toBe('2026-12-03')
  })
  it('uses the local clock, not UTC, in summer time', () => {
    // 00:20 BST on 2 Jul 2026 is 23:20 UTC on 1 Jul: still the 1 Jul run either way.
    expect(shiftDate(new Date('2026-07-01T23:20:00Z'), SHIFT, LONDON)).toBe('2026-07-01')
    // 23:30 UTC on 1 Jul is 00:30 BST on 2 Jul: the shift has ended, so the 2 Jul run.
    expect(shiftDate(new Date('2026-07-01T23:30:00Z'), SHIFT, LONDON)).toBe('2026-07-02')
  })
  it('keeps a day shift on its own day', () => {
    const day = { start: '07:00', end: '15:00' }
    expect(shiftDate(localInstant('2026-12-03', '00:20', LONDON), day, LONDON)).toBe('2026-12-03')
  })
  it('gives the shift on the night of the October change its true length', () => {
    // 24 Oct 16:00 BST (15:00 UTC) to 25 Oct 00:30 BST (24 Oct 23:30 UTC): clocks change later, at 01:00 UTC.
    const s = shiftInstants('2026-10-24', SHIFT, LONDON)
    expect(s.start.toISOString()).toBe('2026-10-24T15:00:00.000Z')
    expect(s.end.toISOString()).toBe('2026-10-24T23:30:00.000Z')
    // 25 Oct 16:00 GMT to 26 Oct 00:30 GMT.
    const n = shiftInstants('2026-10-25', SHIFT, LONDON)
    expect(n.end.toISOString()).toBe('2026-10-26T00:30:00.000Z')
  })
})

describe('due-by clocks across the October change', () => {
  it('lands 36 h after 2026-10-24 12:00 local on 2026-10-25 23:00 local (one extra hour)', () => {
    // 12:00 BST = 11:00 UTC; + 36 h = 2026-10-25 23:00 UTC = 23:00 GMT, not 26 Oct 00:00.
    const due = dueAfter(localInstant('2026-10-24', '12:00', LONDON), 36)
    expect(due.toISOString()).toBe('2026-10-25T23:00:00.000Z')
    expect(localDay(due, LONDON)).toBe('2026-10-25')
    expect(localClock(due, LONDON)).toBe('23:00')
  })
  it('ends a local day at 23:59 local time, in summer and in winter', () => {
    expect(endOfLocalDay('2026-10-24', LONDON).toISOString()).toBe('2026-10-24T22:59:00.000Z')
    expect(endOfLocalDay('2026-10-25', LONDON).toISOString()).toBe('2026-10-25T23:59:00.000Z')
  })
})

describe('forecast dates across the October change', () => {
  it('counts burning nights as calendar days and switches on at the local time each evening', () => {
    // 8 h a night from 2026-10-22: 40 burning hours end in night 5 (index 4) = 2026-10-26.
    // Worked by hand: ceil(40 / 8) − 1 = 4 nights after the start date.
    const day = burningHoursToDate(40, '2026-10-22', 8)
    expect(day).toBe('2026-10-26')
    // Switch-on 16:00 local is 15:00 UTC before the change and 16:00 UTC after it.
    expect(forecastInstant('2026-10-24', '16:00', LONDON).toISOString()).toBe('2026-10-24T15:00:00.000Z')
    expect(forecastInstant(day!, '16:00', LONDON).toISOString()).toBe('2026-10-26T16:00:00.000Z')
  })
})

describe('dates in words', () => {
  it('writes a calendar day in the en-GB locale', () => {
    // CLDR en-GB short weekday/month with day-first order; no 12/02/2026 month-first forms.
    expect(formatDay('2026-12-02', 'en-GB')).toMatch(/^Wed,? 2 Dec 2026$/)
  })
})
