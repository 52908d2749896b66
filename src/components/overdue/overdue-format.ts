import type { OverdueItem } from '../../api/overdue'

function hours(h: number): string {
  const abs = Math.abs(h)
  if (abs >= 48) return `${Math.round(abs / 24)} days`
  const n = abs < 10 ? abs.toFixed(1).replace(/\.0$/, '') : String(Math.round(abs))
  return `${n} h`
}

/** "Overdue by 3.5 h" or "5 h left": said in words, never by colour alone. */
export function lateText(item: Pick<OverdueItem, 'hoursLeft' | 'overdue'>): string {
  return item.overdue ? `Overdue by ${hours(item.hoursLeft)}` : `${hours(item.hoursLeft)} left`
}
