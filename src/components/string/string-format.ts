// Numbers as the string page shows them, in the app's locale; its dates go through src/dates.ts.
import { formatNumber } from '../../dates'

export function hoursText(h: number | null | undefined): string {
  if (h === null || h === undefined || !Number.isFinite(h)) return '—'
  if (h < 10) return `${h.toFixed(1)} h`
  return `${formatNumber(h)} h`
}

export function chanceText(p: number): string {
  if (p === 0) return 'under 0.1 %'
  if (p < 0.01) return `${(p * 100).toFixed(1)} %`
  return `${Math.round(p * 100)} %`
}

/** At most `digits` decimals, trailing zeros dropped: 12 V, 12.78 V, 0.5 A. */
export function num(n: number, digits = 1): string {
  return formatNumber(n, digits)
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`
}

// Certificate kinds as the safety officer records them.
const CERT_KINDS: Record<string, string> = {
  platform_exam: 'Platform thorough examination',
  platform_pre_use: 'Platform pre-use check',
  column_structural: 'Column structural test',
  anchor_test: 'Anchor load test',
  display_inspection: 'Display inspection and test',
  rcd_test: 'RCD test',
  insulation_test: 'Insulation resistance test',
}

export function certKind(kind: string): string {
  return CERT_KINDS[kind] ?? kind.replace(/_/g, ' ').replace(/^./, (c) => c.toUpperCase())
}

export function sentenceCase(s: string): string {
  return s.replace(/_/g, ' ').replace(/^./, (c) => c.toUpperCase())
}
