// Every date, time and number the client shows or sends, in one place so each reads the same on every
// page. Times are shown in the app's zone and locale (GET /config: APP_TIME_ZONE, APP_LOCALE), not the
// device's: a crew member's phone set to another zone still sees the town's clock.
import dayjs from 'dayjs'
import utc from 'dayjs/plugin/utc.js'
import timezone from 'dayjs/plugin/timezone.js'
import { DEFAULT_LOCALE, DEFAULT_TIME_ZONE, localDay } from '../shared/local-time'
import * as numbers from '../shared/number-format'

dayjs.extend(utc)
dayjs.extend(timezone)

let zone = DEFAULT_TIME_ZONE
let locale = DEFAULT_LOCALE

/** Set once GET /config has answered. */
export function setDateSettings(s: { timeZone: string; locale: string }): void {
  zone = s.timeZone
  locale = s.locale
}

/**
 * The browser's first date formatter loads its locale and time-zone tables: 30–100 ms of CPU on this
 * machine's Chromium before throttling, which a signed-in screen otherwise pays inside its first draw
 * (the run's title asks for today's date). Run as a task of its own while the screen still waits for
 * its first answer, it is out of the way by the time the answer comes (issue 14).
 */
export function warmDateTables(): void {
  setTimeout(() => localDay(Date.now(), zone), 0)
}

export function appTimeZone(): string {
  return zone
}
export function appLocale(): string {
  return locale
}

const CALENDAR_DAY = /^\d{4}-\d{2}-\d{2}$/
/** An instant in the app's zone; a calendar day (YYYY-MM-DD) stays that day whatever the zone. */
function inZone(at: DateInput) {
  if (typeof at === 'string' && CALENDAR_DAY.test(at)) return dayjs.tz(at, zone)
  return dayjs(at).tz(zone)
}

export type DateInput = string | number | Date

const STYLES = {
  /** 3 Dec 2026 */
  date: 'D MMM YYYY',
  /** 3 Dec 2026, 21:05 */
  dateTime: 'D MMM YYYY, HH:mm',
  /** 3 Dec 2026, 21:05:09 */
  dateTimeSeconds: 'D MMM YYYY, HH:mm:ss',
  /** Thu 3 Dec 2026 */
  weekdayDate: 'ddd D MMM YYYY',
  /** Thu 3 Dec 2026, 21:05 */
  weekdayDateTime: 'ddd D MMM YYYY, HH:mm',
  /** Thu 3 Dec */
  weekday: 'ddd D MMM',
  /** Thu 3 Dec, 21:05 */
  weekdayTime: 'ddd D MMM, HH:mm',
  /** Thursday 3 December */
  longWeekday: 'dddd D MMMM',
  /** Thursday 3 December 2026 */
  longWeekdayDate: 'dddd D MMMM YYYY',
  /** Thursday */
  weekdayName: 'dddd',
  /** 3 Dec */
  dayMonth: 'D MMM',
  /** 3 Dec, 21:05 */
  dayMonthTime: 'D MMM, HH:mm',
  /** 21:05 */
  time: 'HH:mm',
  /** 21:05:09 */
  timeSeconds: 'HH:mm:ss',
  /** 2026-12-03: a calendar day for the API and for date inputs */
  isoDate: 'YYYY-MM-DD',
  /** 2026-12-03T21:05: datetime-local inputs */
  isoMinute: 'YYYY-MM-DDTHH:mm',
  /** 2026-12-03T21:05:09+00:00: device time with its offset, as field records want it */
  isoStamp: 'YYYY-MM-DDTHH:mm:ssZ',
  /** 2026-12-03 21:05: CSV cells a spreadsheet reads as a date */
  csv: 'YYYY-MM-DD HH:mm',
  /** 2026-12-03-2105: inside file names */
  file: 'YYYY-MM-DD-HHmm',
} as const

export type DateStyle = keyof typeof STYLES

/** `at` in one of the styles above; `empty` when there is no date (a dash in tables, say). */
export function formatDate(at: DateInput | null | undefined, style: DateStyle, empty = ''): string {
  if (at === null || at === undefined || at === '') return empty
  const d = inZone(at)
  return d.isValid() ? d.format(STYLES[style]) : empty
}

/** A number in the app's locale (grouping and decimal marks), at most `digits` decimals. */
export function formatNumber(n: number, digits = 0): string {
  return numbers.formatNumber(n, digits, locale)
}
/** Exactly `digits` decimals, for columns that line up. */
export function formatFixed(n: number, digits: number): string {
  return numbers.formatFixed(n, digits, locale)
}
/** Money at the one precision (pounds and pence): £42.61, £1,960.00. */
export function formatMoney(n: number): string {
  return numbers.formatMoney(n, locale)
}
/** A count with its noun: "1 fuse lamp", "10,010 visits". */
export function plural(n: number, one: string, many = `${one}s`): string {
  return numbers.plural(n, one, many, locale)
}
export const agree = numbers.agree

/**
 * A calendar day typed by a person, as the app shows it ("3 Dec 2026", "3 December 2026") or as
 * YYYY-MM-DD, into YYYY-MM-DD; null when it is not a real day.
 */
export function parseDay(text: string): string | null {
  const t = text.trim()
  let y: number, m: number, d: number
  const iso = /^(\d{4})-(\d{2})-(\d{2})$/.exec(t)
  const words = /^(\d{1,2})\s+([^\s\d,.]+)\.?,?\s+(\d{4})$/u.exec(t)
  if (iso) [y, m, d] = [Number(iso[1]), Number(iso[2]), Number(iso[3])]
  else if (words) {
    const name = words[2].toLocaleLowerCase(locale)
    const month = Array.from({ length: 12 }, (_, i) => dayjs().month(i)).findIndex(
      (at) =>
        at.format('MMM').toLocaleLowerCase(locale).replace(/\.$/, '') === name ||
        at.format('MMMM').toLocaleLowerCase(locale) === name,
    )
    if (month < 0) return null
    ;[y, m, d] = [Number(words[3]), month + 1, Number(words[1])]
  } else return null
  const day = `${y}-${String(m).padStart(2, '0')}-${String(d).padStart(2, '0')}`
  return dayjs(day).isValid() && dayjs(day).format(STYLES.isoDate) === day ? day : null
}

/** Today's calendar day in the app's zone (YYYY-MM-DD). */
export function today(): string {
  return localDay(new Date(), zone)
}

/** Now, as the app zone's wall clock with its offset. */
export function localStamp(): string {
  return formatDate(new Date(), 'isoStamp')
}

/** A calendar day `n` days after `day` (YYYY-MM-DD in and out). */
export function addDays(day: string, n: number): string {
  return dayjs(day).add(n, 'day').format(STYLES.isoDate)
}

/** Whole days from `from` to `to`, both calendar days. */
export function daysBetween(from: string, to: string): number {
  return dayjs(to).diff(dayjs(from), 'day')
}

/** Tomorrow at the given hour in the app's zone, for datetime-local inputs. */
export function tomorrowAt(hour: number): string {
  return dayjs
    .tz(`${addDays(today(), 1)}T${String(hour).padStart(2, '0')}:00:00`, zone)
    .format(STYLES.isoMinute)
}

export function isToday(at: DateInput): boolean {
  return formatDate(at, 'isoDate') === today()
}

/** A readable date-time that is later than now. */
export function isFuture(at: DateInput | null | undefined): boolean {
  return !!at && dayjs(at).isValid() && dayjs(at).isAfter(dayjs())
}

/** A wall-clock date-time in the app's zone (as a datetime-local input gives it) as an ISO instant. */
export function toInstant(at: DateInput): string {
  if (typeof at === 'string' && !/(Z|[+-]\d{2}:?\d{2})$/.test(at)) return dayjs.tz(at, zone).toISOString()
  return dayjs(at).toISOString()
}
