import type { UserRecord } from '../../api/users'
import { formatDate } from '../../dates'

export function lastSeen(user: UserRecord): string {
  if (user.lastSignInAt) return `Last signed in ${formatDate(user.lastSignInAt, 'dateTime')}`
  if (user.invitedAt) return `Invited ${formatDate(user.invitedAt, 'dateTime')}, not signed in yet`
  return 'Never signed in'
}

/** Short form for the table's "Last signed in" column. */
export function lastSignIn(user: UserRecord): string {
  if (user.lastSignInAt) return formatDate(user.lastSignInAt, 'dateTime')
  return user.invitedAt ? 'Not yet (invited)' : 'Never'
}
