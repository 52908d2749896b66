import type { UserRecord } from '../../api/users'
import { formatDate } from '../../dates'

// One word for an account nobody has signed in to yet, invited or not: "Not signed in yet" ("Not yet"
// in the table's "Last signed in" column); the status beside it says "Invited" when it was.
export const NOT_SIGNED_IN = 'Not signed in yet'

export function lastSeen(user: UserRecord): string {
  if (user.lastSignInAt) return `Last signed in ${formatDate(user.lastSignInAt, 'dateTime')}`
  if (user.invitedAt)
    return `Invited ${formatDate(user.invitedAt, 'dateTime')} · ${NOT_SIGNED_IN.toLowerCase()}`
  return NOT_SIGNED_IN
}

/** Short form for the table's "Last signed in" column. */
export function lastSignIn(user: UserRecord): string {
  return user.lastSignInAt ? formatDate(user.lastSignInAt, 'dateTime') : 'Not yet'
}
