import dayjs from 'dayjs'
import type { UserRecord } from '../../api/users'

export function formatWhen(iso: string | null): string {
  return iso ? dayjs(iso).format('D MMM YYYY, HH:mm') : ''
}

export function lastSeen(user: UserRecord): string {
  if (user.lastSignInAt) return `Last signed in ${formatWhen(user.lastSignInAt)}`
  if (user.invitedAt) return `Invited ${formatWhen(user.invitedAt)}, not signed in yet`
  return 'Never signed in'
}

/** Short form for the table's "Last signed in" column. */
export function lastSignIn(user: UserRecord): string {
  if (user.lastSignInAt) return formatWhen(user.lastSignInAt)
  return user.invitedAt ? 'Not yet (invited)' : 'Never'
}
