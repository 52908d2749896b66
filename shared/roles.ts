// Roles and where each lands after signing in. Used by the server's guards and the client's router.
export const roles = ['crew', 'supervisor', 'manager', 'safety', 'admin'] as const
export type Role = (typeof roles)[number]

export const roleHome: Record<Role, string> = {
  crew: '/run',
  supervisor: '/queue',
  manager: '/overdue',
  safety: '/isolations',
  admin: '/users',
}

export const roleLabel: Record<Role, string> = {
  crew: 'Crew',
  supervisor: 'Supervisor',
  manager: 'Manager',
  safety: 'Safety officer',
  admin: 'Administrator',
}

// Who may call a route (server/routes/*) or open a page (src/router/routes.ts): every role list is one
// of these names, so a permission reads the same on both sides and is changed in one place.

/** Every signed-in user. */
export const everyone: readonly Role[] = roles
/** Who log field work (visits, isolations, photos) and carry a run: crews and their supervisors. */
export const fieldWorkers: readonly Role[] = ['crew', 'supervisor']
/** Who plan and direct field work: the queue, runs, overdue and energy reports. */
export const planners: readonly Role[] = ['supervisor', 'manager', 'admin']
/** Who read the office records (register, crews, certificates, isolations): everyone but the crews. */
export const office: readonly Role[] = ['supervisor', 'manager', 'safety', 'admin']
/** Who read the work queue: planners, and safety officers (only certificate work, server/routes/queue.ts). */
export const queueReaders: readonly Role[] = ['supervisor', 'manager', 'safety', 'admin']
/** Who sign safety records: certificates and isolation reviews. */
export const safetyOfficers: readonly Role[] = ['safety', 'admin']
/** Who read the audit log (who changed what, when): managers, safety officers and admins. */
export const auditReaders: readonly Role[] = ['manager', 'safety', 'admin']
/** Who see what the client is told: the client report. */
export const managers: readonly Role[] = ['manager', 'admin']
/** Who enter and edit the estate: clients, sites, supply points, circuits, structures, types, strings. */
export const estateEditors: readonly Role[] = ['manager', 'admin']
/** Who manage accounts and settings. */
export const admins: readonly Role[] = ['admin']
/** Who follow the crews' runs on the map and the printed run sheet. */
export const runFollowers: readonly Role[] = ['crew', 'supervisor', 'manager']
/** Who read and move lamp stock: planners everywhere, crews only their own van (server/services/stock-access.ts). */
export const stockUsers: readonly Role[] = ['crew', 'supervisor', 'manager', 'admin']
/** Pages that are one role's own work, e.g. `only.crew` for tonight's run. */
export const only: Record<Role, readonly Role[]> = {
  crew: ['crew'],
  supervisor: ['supervisor'],
  manager: ['manager'],
  safety: ['safety'],
  admin: ['admin'],
}
