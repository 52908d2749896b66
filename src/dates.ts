// Every date and time the client shows or sends, in one place so each kind of date reads the same on
// every page. Times are the device's own; the server sends instants in UTC and calendar days as
// YYYY-MM-DD, both of which dayjs reads as they are meant.
import dayjs from 'dayjs'

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
  return dayjs(at).format(STYLES[style])
}

/** Today's calendar day on this device (YYYY-MM-DD). */
export function today(): string {
  return formatDate(new Date(), 'isoDate')
}

/** Now, as the device's time with its offset. */
export function localStamp(): string {
  return formatDate(new Date(), 'isoStamp')
}

/** A calendar day `n` days after `day` (YYYY-MM-DD in and out). */
export function addDays(day: string, n: number): string {
  return formatDate(dayjs(day).add(n, 'day').toDate(), 'isoDate')
}

/** Whole days from `from` to `to`, both calendar days. */
export function daysBetween(from: string, to: string): number {
  return dayjs(to).diff(dayjs(from), 'day')
}

/** Tomorrow at the given hour on this device, for datetime-local inputs. */
export function tomorrowAt(hour: number): string {
  return formatDate(dayjs().add(1, 'day').hour(hour).minute(0).toDate(), 'isoMinute')
}

export function isToday(at: DateInput): boolean {
  return dayjs(at).isSame(dayjs(), 'day')
}

/** A readable date-time that is later than now. */
export function isFuture(at: DateInput | null | undefined): boolean {
  return !!at && dayjs(at).isValid() && dayjs(at).isAfter(dayjs())
}

/** A local date-time (as a datetime-local input gives it) as an ISO instant in UTC for the API. */
export function toInstant(at: DateInput): string {
  return dayjs(at).toISOString()
}
