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

/** Roles that plan and direct field work. */
export const planners: Role[] = ['supervisor', 'manager', 'admin']
/** Roles that log field work. */
export const fieldRoles: Role[] = ['crew', 'supervisor']
