import { z } from 'zod'
import { DESCRIPTION_MIN, REF_PATTERN, hasPlace, reportLimits as max, reportMessages } from '../report-rules'
// The states and their words are in ../vocab/reports.ts (plain, for the public page).
import { reportStates } from '../vocab/reports'

export const reportBody = z
  .object({
    tag: z.string().trim().max(max.tag).optional(),
    street: z.string().trim().max(max.street).optional(),
    landmark: z.string().trim().max(max.landmark).optional(),
    description: z.string().trim().min(DESCRIPTION_MIN, reportMessages.description).max(max.description),
    hazard: z.boolean().default(false),
    lat: z.number().min(-90).max(90).optional(),
    lng: z.number().min(-180).max(180).optional(),
    name: z.string().trim().max(max.name).optional(),
    email: z.string().trim().toLowerCase().email(reportMessages.email).max(max.email).optional(),
    /** Hidden from people (the form hides it); anything in it marks the sender as a robot. */
    website: z.string().max(500).optional(),
    /** When the form was opened (ms since 1970, the phone's clock); a send under 3 s after is a robot's. */
    formStartedAt: z.number().int().nonnegative().optional(),
  })
  .refine(hasPlace, { message: reportMessages.where, path: ['street'] })

/** Nothing personal: no name, e-mail, description or position — only what the reference shows. */
export const reportStatus = z.object({
  ref: z.string(),
  state: z.enum(reportStates),
  stateLabel: z.string(),
  street: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  publicNote: z.string().nullable(),
  history: z.array(
    z.object({
      state: z.enum(reportStates),
      stateLabel: z.string(),
      at: z.string(),
      publicNote: z.string().nullable(),
    }),
  ),
})
/** The answer to a new report: its status, plus a one-time key to send one photo with it. */
export const reportCreated = reportStatus.extend({
  photoKey: z.string().describe('One-time key for POST /reports/{ref}/photo (field photoKey).'),
})
export const eraseEmailBody = z.object({ token: z.string().trim().min(20).max(100) })
export const eraseEmailResult = z.object({ erased: z.boolean() })
export const refParam = z.object({
  ref: z.string().trim().toUpperCase().regex(REF_PATTERN, reportMessages.ref),
})
export const streetList = z.object({ items: z.array(z.object({ name: z.string(), client: z.string() })) })
