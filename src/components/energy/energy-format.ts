import type { EnergyClient, EnergyLine } from '../../api/energy'
import { appTimeZone, formatDate, formatFixed, formatMoney, formatNumber } from '../../dates'
import { localClock } from '../../../shared/local-time'

/** One decimal under 100, whole above, with grouping marks: 0.7, 9.6, 11.9, 1,562. */
export function amount(n: number): string {
  return formatFixed(n, Math.abs(n) >= 100 ? 0 : 1)
}
export const watts = (w: number) => formatNumber(w)
export const kw = (w: number) => amount(w / 1000)
/** Money at the app's one precision, pounds and pence: £42.61, £1,960.00. */
export function pounds(n: number | null): string {
  return n === null ? '—' : formatMoney(n)
}
/** A unit price in pence, as tariffs are quoted: 24.5p per kWh. */
export const tariff = (perKwh: number) => `${formatNumber(perKwh * 100, 2)}p per kWh`
export const hours = (h: number) => `${formatNumber(h, 1)} h`

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
