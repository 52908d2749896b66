// Words and pictures for in-app notices: one icon and one short label per kind.
import type { NoticeKind } from '../../../shared/schemas/notices'
import { iconCertificates, iconRejected, iconReport, iconRun, iconStock } from '../../icons'

export const NOTICE_KIND: Record<NoticeKind, { label: string; icon: string }> = {
  isolation_rejected: { label: 'Isolation rejected', icon: iconRejected },
  run_changed: { label: 'Run changed', icon: iconRun },
  certificate_expiring: { label: 'Certificate expiring', icon: iconCertificates },
  report_assigned: { label: 'Public report on your run', icon: iconReport },
  low_stock: { label: 'Low stock', icon: iconStock },
}

/** The bell's accessible name: what it is and how many are unread. */
export function bellLabel(unread: number): string {
  if (unread === 0) return 'Notices, none unread'
  return `Notices, ${unread} unread`
}

/** The badge's text: the count, capped so it fits on a phone. */
export function badgeText(unread: number): string {
  return unread > 99 ? '99+' : String(unread)
}
