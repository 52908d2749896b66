import type { EnergyClient, EnergyLine, EnergyReport } from '../../api/energy'
import type { CsvRow } from '../common/csv'
import { siteLines, typeLines } from './energy-format'

const HEADER = [
  'Client',
  'Breakdown',
  'Name',
  'Strings',
  'Watts',
  'kWh per night',
  'kWh per season',
  'Cost per night (GBP)',
  'Cost per season (GBP)',
  'Tariff (GBP per kWh)',
  'Switch on',
  'Switch off',
  'Hours per night',
  'Season start',
  'Season end',
  'Season days',
]

// Spreadsheets get the unrounded kWh and pennies to 2 places; rounding is the reader's choice.
const r2 = (n: number | null) => (n === null ? null : Math.round(n * 100) / 100)
const r3 = (n: number) => Math.round(n * 1000) / 1000

function line(c: EnergyClient, kind: string, l: Omit<EnergyLine, 'key'>): CsvRow {
  return [
    c.name,
    kind,
    l.note ? `${l.name} · ${l.note}` : l.name,
    l.strings,
    r2(l.watts),
    r3(l.kwhPerNight),
    r3(l.kwhPerSeason),
    r2(l.costPerNight),
    r2(l.costPerSeason),
    c.tariffPerKwh,
    c.switchOn,
    c.switchOff,
    c.burnHoursPerDay,
    c.seasonStart,
    c.seasonEnd,
    c.seasonDays,
  ]
}

/** Each client's total, then its sites and its string types, heaviest first as on the page. */
export function energyRows(report: EnergyReport): CsvRow[] {
  const rows: CsvRow[] = [HEADER]
  for (const c of [...report.clients].sort((a, b) => b.watts - a.watts)) {
    rows.push(line(c, 'Total', c))
    for (const s of siteLines(c)) rows.push(line(c, 'Site', s))
    for (const t of typeLines(c)) rows.push(line(c, 'String type', t))
  }
  return rows
}
