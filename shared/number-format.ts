// Every number a person reads, from one place, so a page never mixes "10010" with "1,960" or £42.61
// with £1,960: grouping marks in the app's locale, money always to the penny, and a count always with
// its noun in the right number ("1 fuse lamp", "2 fuse lamps"). The client passes its APP_LOCALE;
// e-mails and PDFs on the server pass the same setting.
import { DEFAULT_LOCALE } from './local-time'

const cache = new Map<string, Intl.NumberFormat>()
function numberFormat(locale: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `${locale}|${JSON.stringify(options)}`
  let f = cache.get(key)
  if (!f) cache.set(key, (f = new Intl.NumberFormat(locale, options)))
  return f
}

/** A number with grouping marks and at most `digits` decimals: 10010 → "10,010", 2.345 (1) → "2.3". */
export function formatNumber(n: number, digits = 0, locale = DEFAULT_LOCALE): string {
  return numberFormat(locale, { maximumFractionDigits: digits }).format(n)
}

/** Exactly `digits` decimals, for columns that line up: 11.9 (2) → "11.90". */
export function formatFixed(n: number, digits: number, locale = DEFAULT_LOCALE): string {
  return numberFormat(locale, { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(n)
}

/** The one money rule: pounds and pence always, 1960 → "£1,960.00", 42.613 → "£42.61". */
export const CURRENCY = 'GBP'
export function formatMoney(n: number, locale = DEFAULT_LOCALE, currency = CURRENCY): string {
  return numberFormat(locale, {
    style: 'currency',
    currency,
    minimumFractionDigits: 2,
    maximumFractionDigits: 2,
  }).format(n)
}

/** A count with its noun: (1, 'fuse lamp') → "1 fuse lamp", (10010, 'visit') → "10,010 visits". */
export function plural(n: number, one: string, many = `${one}s`, locale = DEFAULT_LOCALE): string {
  return `${formatNumber(n, 0, locale)} ${n === 1 ? one : many}`
}

/** Items joined as a sentence says them: ['a', 'b', 'c'] → "a, b and c". */
export function listOf(items: string[], locale = DEFAULT_LOCALE): string {
  return new Intl.ListFormat(locale, { style: 'long', type: 'conjunction' }).format(items)
}

/** The noun or verb alone, agreeing with a count: (1, 'stays', 'stay') → "stays". */
export function agree(n: number, one: string, many: string): string {
  return n === 1 ? one : many
}
