import { z } from 'zod'
import { roleSchema } from './common'
import { NEW_PASSWORD_MIN } from '../vocab/auth'

export const publicUser = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  crewId: z.number().int().nullable().optional(),
})
export type PublicUser = z.infer<typeof publicUser>

export const signInBody = z.object({
  email: z.string().trim().toLowerCase().email().max(190),
  password: z.string().min(1).max(200),
})
export const sessionResponse = z.object({ user: publicUser, token: z.string() })
export const meResponse = z.object({ user: publicUser })
export const acceptInviteBody = z.object({
  token: z.string().min(20).max(200),
  password: z.string().min(NEW_PASSWORD_MIN, `Use at least ${NEW_PASSWORD_MIN} characters.`).max(200),
})

export const userRow = publicUser.extend({
  active: z.boolean(),
  invitedAt: z.string().nullable(),
  lastSignInAt: z.string().nullable(),
  /** Invited and no password set yet: the invitation can be sent again. */
  invitePending: z.boolean(),
})
export const userList = z.object({ items: z.array(userRow) })
export const inviteBody = z.object({
  name: z.string().trim().min(1).max(120),
  email: z.string().trim().toLowerCase().email().max(190),
  role: roleSchema,
  crewId: z.number().int().positive().nullable().optional(),
})
export const userPatch = z
  .object({
    role: roleSchema.optional(),
    active: z.boolean().optional(),
    crewId: z.number().int().positive().nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change.')
export const userResponse = z.object({ user: userRow })

export const changePasswordBody = z.object({
  currentPassword: z.string().min(1).max(200),
  newPassword: z.string().min(NEW_PASSWORD_MIN, `Use at least ${NEW_PASSWORD_MIN} characters.`).max(200),
})

/** Forgot password: the answer is the same whether or not the address has an account. */
export const forgotPasswordBody = z.object({ email: z.string().trim().toLowerCase().email().max(190) })
export const forgotPasswordResponse = z.object({ message: z.string() })
export const FORGOT_PASSWORD_MESSAGE =
  'If that address has an account, a link to choose a new password is on its way. It works for one hour.'
/** The new password is checked by the server (password_too_short, password_too_common), not here. */
export const resetPasswordBody = z.object({
  token: z.string().min(20).max(200),
  password: z.string().max(200),
})
