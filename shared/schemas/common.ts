import { z } from 'zod'
import { roles } from '../roles'

export const roleSchema = z.enum(roles)
export const idParam = z.object({ id: z.coerce.number().int().positive() })
export const errorSchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), details: z.unknown().optional() }),
})
export const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use HH:mm (24-hour).')
