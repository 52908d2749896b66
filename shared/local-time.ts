// Local time for a place: "today", shift dates, due-by clocks and forecast dates in an IANA zone.
// The server stores instants in UTC; a crew, a client and a mail reader live by their own wall clock,
// which jumps at daylight-saving changes, so every conversion goes through the zone rules here.
import dayjs from 'dayjs'
import utc from 'dayjs/plugin/utc.js'
import timezone from 'dayjs/plugin/timezone.js'
import { minutesOfDay } from './schedule'

dayjs.extend(utc)
dayjs.extend(timezone)

export const DEFAULT_TIME_ZONE = 'Europe/London'
export const DEFAULT_LOCALE = 'en-GB'

const HOUR = 3_600_000

// One formatter per zone, made once: dayjs's tz() makes a new one on each call (a third of a
// millisecond), and the string page asks for the local day on every read.
const dayFormats = new Map<string, Intl.DateTimeFormat>()

function dayFormat(zone: string): Intl.DateTimeFormat {
  let f = dayFormats.get(zone)
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
    })
    dayFormats.set(zone, f)
  }
  return f
}

/** The calendar day (YYYY-MM-DD) it is in `zone` at `at`. */
export function localDay(at: Date | number, zone: string): string {
  const parts: Record<string, string> = {}
  for (const p of dayFormat(zone).formatToParts(at)) parts[p.type] = p.value
  return `${parts.year}-${parts.month}-${parts.day}`
}

/** The wall-clock time (HH:mm) in `zone` at `at`. */
export function localClock(at: Date | number, zone: string): string {
  return dayjs(at).tz(zone).format('HH:mm')
}

/** Today in `zone`. */
export function localToday(zone: string, now: Date = new Date()): string {
  return localDay(now, zone)
}

/**
 * The instant a wall clock in `zone` shows `hhmm` on `day`. A time that occurs twice (the hour
 * repeated when clocks go back) is the later one; one that never occurs is moved forward by the gap.
 */
export function localInstant(day: string, hhmm: string, zone: string): Date {
  return dayjs.tz(`${day}T${hhmm}:00`, zone).toDate()
}

/** A calendar day `n` days after `day` (calendar arithmetic: no daylight-saving drift). */
export function addDays(day: string, n: number): string {
  const [y, m, d] = day.split('-').map(Number)
  return new Date(Date.UTC(y, m - 1, d + n)).toISOString().slice(0, 10)
}

export interface ShiftWindow {
  /** HH:mm local */
  start: string
  /** HH:mm local; earlier than start when the shift runs past midnight */
  end: string
}

/**
 * The run date a moment belongs to: the day its shift started. With a shift past midnight
 * (16:00–00:30) the small hours belong to the previous day's run, so a crew keeps one run all night.
 */
export function shiftDate(at: Date | number, shift: ShiftWindow, zone: string): string {
  const day = localDay(at, zone)
  const start = minutesOfDay(shift.start)
  const end = minutesOfDay(shift.end)
  if (end >= start) return day
  return minutesOfDay(localClock(at, zone)) < end ? addDays(day, -1) : day
}

/** When a shift on `runDate` starts and ends, as instants (the end on the next day when past midnight). */
export function shiftInstants(runDate: string, shift: ShiftWindow, zone: string): { start: Date; end: Date } {
  const crosses = minutesOfDay(shift.end) < minutesOfDay(shift.start)
  return {
    start: localInstant(runDate, shift.start, zone),
    end: localInstant(crosses ? addDays(runDate, 1) : runDate, shift.end, zone),
  }
}

/**
 * A contract clock: due `hours` elapsed hours after `from`. Elapsed, not wall-clock: across the
 * October change the local due time reads an hour earlier than a naive add would show.
 */
export function dueAfter(from: Date, hours: number): Date {
  return new Date(from.getTime() + hours * HOUR)
}

/** The end of a local calendar day (23:59 in `zone`), as a due-by for things due "on" a date. */
export function endOfLocalDay(day: string, zone: string): Date {
  return localInstant(day, '23:59', zone)
}

/** A forecast calendar date and the instant the lights switch on that evening in `zone`. */
export function forecastInstant(day: string, switchOn: string, zone: string): Date {
  return localInstant(day, switchOn, zone)
}

/** Whether `zone` is an IANA zone name the runtime knows. */
export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: zone })
    return true
  } catch {
    return false
  }
}

/** `Intl` formatting of an instant in a zone and locale (mail texts, the server's own words). */
export function formatInZone(
  at: Date | number,
  zone: string,
  locale: string,
  style: 'date' | 'dateTime' | 'time',
): string {
  const opts: Intl.DateTimeFormatOptions =
    style === 'time'
      ? { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }
      : style === 'date'
        ? { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }
        : {
            weekday: 'short',
            day: 'numeric',
            month: 'short',
            hour: '2-digit',
            minute: '2-digit',
            hourCycle: 'h23',
          }
  return new Intl.DateTimeFormat(locale, { ...opts, timeZone: zone }).format(at)
}

/** A calendar day (YYYY-MM-DD) in words, e.g. "Wed 2 Dec 2026" in en-GB. */
export function formatDay(day: string, locale: string): string {
  return formatInZone(new Date(`${day}T12:00:00Z`), 'UTC', locale, 'date')
}
