import type { EnergyClient, EnergyLine } from '../../api/energy'
import { appTimeZone, formatDate } from '../../dates'
import { localClock } from '../../../shared/local-time'

const gb = (digits: number) =>
  new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits })
const whole = gb(0)
const one = gb(1)
const two = gb(2)

/** Fewer decimals as numbers grow: 0.74, 11.9, 562. */
export function amount(n: number): string {
  const abs = Math.abs(n)
  return (abs >= 100 ? whole : abs >= 10 ? one : two).format(n)
}
export const watts = (w: number) => whole.format(w)
export const kw = (w: number) => amount(w / 1000)
export function pounds(n: number | null, exact = false): string {
  if (n === null) return '—'
  return `£${(exact || Math.abs(n) < 100 ? two : whole).format(n)}`
}
const price = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 4 })
export const tariff = (perKwh: number) => `£${price.format(perKwh)} per kWh`
export const hours = (h: number) => `${Number.isInteger(h) ? h : one.format(h)} h`

const minutes = (hhmm: string) => {
  const [h, m] = hhmm.split(':').map(Number)
  return h * 60 + m
}

/** Whether the client's lights burn at `now`: inside the season and between switch-on and switch-off. */
export function isLitAt(c: EnergyClient, at: Date = new Date()): boolean {
  const today = formatDate(at, 'isoDate')
  if (!c.seasonStart || !c.seasonEnd || today < c.seasonStart || today >= c.seasonEnd) return false
  // The town's clock, not the phone's.
  const t = minutes(localClock(at, appTimeZone()))
  const on = minutes(c.switchOn)
  const off = minutes(c.switchOff)
  // A schedule may run past midnight (e.g. 16:00–01:00).
  return on <= off ? t >= on && t < off : t >= on || t < off
}

/** Per-site and per-type lines with one shape, heaviest load first. */
export function siteLines(c: EnergyClient): EnergyLine[] {
  return byLoad(c.sites.map((s) => ({ ...s, key: `site-${s.id}` })))
}
export function typeLines(c: EnergyClient): EnergyLine[] {
  return byLoad(
    c.types.map((t) => ({
      ...t,
      key: t.code,
      name: t.code,
      note: `${t.name} · ${technology(t.technology)}`,
    })),
  )
}
const technology = (t: string) => (t === 'led' ? 'LED' : t.charAt(0).toUpperCase() + t.slice(1))
const byLoad = (lines: EnergyLine[]) => [...lines].sort((a, b) => b.watts - a.watts)
