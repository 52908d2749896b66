import { z } from 'zod'
import { roleSchema } from './common'

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
  password: z.string().min(10, 'Use at least 10 characters.').max(200),
})

export const userRow = publicUser.extend({
  active: z.boolean(),
  invitedAt: z.string().nullable(),
  lastSignInAt: z.string().nullable(),
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

/** A new password for the signed-in user: at least 12 characters, like the first admin's. */
export const NEW_PASSWORD_MIN = 12
export const changePasswordBody = z.object({
  currentPassword: z.string().min(1).max(200),
  newPassword: z.string().min(NEW_PASSWORD_MIN, `Use at least ${NEW_PASSWORD_MIN} characters.`).max(200),
})
