import { roleHome, type Role } from '../../shared/roles'
import {
  iconCalculator,
  iconCertificates,
  iconClock,
  iconCrews,
  iconEdit,
  iconEnergy,
  iconEstate,
  iconIsolations,
  iconMap,
  iconOutbox,
  iconOverdue,
  iconPlan,
  iconQueue,
  iconRegister,
  iconReports,
  iconRun,
  iconSettings,
  iconStock,
  iconUsers,
} from '../icons'

export interface NavItem {
  to: string
  label: string
  icon: string
}

// What each role sees in its navigation, in order; the first item is the role's home (kept equal
// to shared/roles.ts `roleHome`, which the server uses too). Access is decided by meta.roles.
export const NAV: Record<Role, NavItem[]> = {
  crew: [
    { to: '/run', label: "Tonight's run", icon: iconRun },
    { to: '/map', label: 'Map', icon: iconMap },
    { to: '/outbox', label: 'Outbox', icon: iconOutbox },
    { to: '/calculator', label: 'Calculator', icon: iconCalculator },
  ],
  supervisor: [
    { to: '/queue', label: 'Queue', icon: iconQueue },
    { to: '/plan', label: 'Plan runs', icon: iconPlan },
    { to: '/map', label: 'Map', icon: iconMap },
    { to: '/crews', label: 'Crews & platforms', icon: iconCrews },
    { to: '/stock', label: 'Stock', icon: iconStock },
    { to: '/estate/crews', label: 'Edit crews', icon: iconEdit },
  ],
  manager: [
    { to: '/overdue', label: 'Overdue', icon: iconOverdue },
    { to: '/register', label: 'Register', icon: iconRegister },
    { to: '/estate/clients', label: 'Estate', icon: iconEstate },
    { to: '/energy', label: 'Energy', icon: iconEnergy },
    { to: '/reports', label: 'Reports', icon: iconReports },
    { to: '/stock', label: 'Stock', icon: iconStock },
    { to: '/audit', label: 'Audit log', icon: iconClock },
  ],
  safety: [
    { to: '/isolations', label: 'Isolations', icon: iconIsolations },
    { to: '/certificates', label: 'Certificates', icon: iconCertificates },
    { to: '/audit', label: 'Audit log', icon: iconClock },
  ],
  admin: [
    { to: '/users', label: 'Users', icon: iconUsers },
    { to: '/settings', label: 'Settings', icon: iconSettings },
    { to: '/stock', label: 'Stock', icon: iconStock },
    { to: '/estate/clients', label: 'Estate', icon: iconEstate },
    { to: '/audit', label: 'Audit log', icon: iconClock },
  ],
}

export function homePath(role: Role): string {
  return roleHome[role] ?? NAV[role][0].to
}

/** Only same-app paths are followed after sign-in, never another origin (open-redirect). */
export function safeNext(next: unknown): string | null {
  // `//host` and `/\host` are read by browsers as another origin.
  if (typeof next !== 'string' || !/^\/(?![/\\])/.test(next)) return null
  if (next.startsWith('/sign-in')) return null
  return next
}
