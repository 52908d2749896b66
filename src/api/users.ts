import type { z } from 'zod'
import type { inviteBody, userPatch, userRow } from '../../shared/schemas/auth'
import type { Id } from './auth'
import { http } from './http'

export type UserRecord = z.infer<typeof userRow>
export type InviteInput = z.input<typeof inviteBody>
export type UserPatch = z.input<typeof userPatch>

export const usersApi = {
  list: () => http.get<{ items: UserRecord[] }>('/users'),
  invite: (input: InviteInput) => http.post<{ user: UserRecord }>('/users', input),
  update: (id: Id, patch: UserPatch) => http.patch<{ user: UserRecord }>(`/users/${id}`, patch),
  /** A new invitation link by mail; the old one stops working. */
  resendInvite: (id: Id) => http.post<{ user: UserRecord }>(`/users/${id}/invite`),
}
