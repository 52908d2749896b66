import type { Role } from '../../shared/roles'

// Demo accounts: invented people, shown on the sign-in page in demo mode only.
export const DEMO_PASSWORD = 'lampwright'

export const demoAccounts: { email: string; role: Role; name: string; crew?: string }[] = [
  { email: 'crew@example.org', role: 'crew', name: 'Tamsin Okafor-Reeve', crew: 'Lantern' },
  { email: 'supervisor@example.org', role: 'supervisor', name: 'Idris Pemberton' },
  { email: 'manager@example.org', role: 'manager', name: 'Margit Sallow' },
  { email: 'safety@example.org', role: 'safety', name: 'Benedek Hartnell' },
  { email: 'admin@example.org', role: 'admin', name: 'Ros Quennell' },
]
