import type { z } from 'zod'
import type { publicUser, sessionResponse } from '../../shared/schemas/auth'
import { http } from './http'

// Roles, their labels and home pages come from the shared table the server's guards also use.
export { roles as ROLES, roleLabel as ROLE_LABELS, type Role } from '../../shared/roles'

export type Id = number
export type SessionUser = z.infer<typeof publicUser>
export type SessionResponse = z.infer<typeof sessionResponse>

export const authApi = {
  me: () => http.get<{ user: SessionUser }>('/auth/me'),
  /** The start-up check: `user: null` when not signed in (200, never 401, so no console error). */
  session: () => http.get<{ user: SessionUser | null }>('/auth/session'),
  signIn: (email: string, password: string) =>
    http.post<SessionResponse>('/auth/sign-in', { email, password }),
  signOut: () => http.post<void>('/auth/sign-out'),
  acceptInvite: (token: string, password: string) =>
    http.post<SessionResponse>('/auth/accept-invite', { token, password }),
  /** Ends every other session of the user; this device gets a fresh one in the answer's cookie. */
  changePassword: (currentPassword: string, newPassword: string) =>
    http.post<SessionResponse>('/auth/password', { currentPassword, newPassword }),
  /** Always answers the same, whether or not the address has an account. */
  forgotPassword: (email: string) => http.post<{ message: string }>('/auth/forgot-password', { email }),
  /** Sets the password from a reset link and signs in on this device; every other session ends. */
  resetPassword: (token: string, password: string) =>
    http.post<SessionResponse>('/auth/reset-password', { token, password }),
}
