import { z } from 'zod'

export const reportBody = z
  .object({
    tag: z.string().trim().max(40).optional(),
    street: z.string().trim().max(160).optional(),
    landmark: z.string().trim().max(160).optional(),
    description: z.string().trim().min(5, 'Tell us a little about the fault.').max(2000),
    hazard: z.boolean().default(false),
    lat: z.number().min(-90).max(90).optional(),
    lng: z.number().min(-180).max(180).optional(),
    name: z.string().trim().max(120).optional(),
    email: z.string().trim().toLowerCase().email().max(190).optional(),
    /** Hidden from people (the form hides it); anything in it marks the sender as a robot. */
    website: z.string().max(500).optional(),
    /** When the form was opened (ms since 1970, the phone's clock); a send under 3 s after is a robot's. */
    formStartedAt: z.number().int().nonnegative().optional(),
  })
  .refine((r) => r.tag || r.street || (r.lat !== undefined && r.lng !== undefined), {
    message: 'Give the number on the lights, the street, or your location.',
    path: ['street'],
  })

export const reportStates = ['received', 'in_hand', 'scheduled', 'fixed', 'not_ours', 'duplicate'] as const
export type ReportState = (typeof reportStates)[number]
/** A report in one of these states has work waiting: the queue keeps an item open for it. */
export const reportOpenStates = ['received', 'in_hand', 'scheduled'] as const satisfies readonly ReportState[]
/** Where a report goes when its queue item closes. */
export const reportClosedStates = ['fixed', 'not_ours', 'duplicate'] as const satisfies readonly ReportState[]
export type ReportClosedState = (typeof reportClosedStates)[number]
export const reportStateLabel: Record<ReportState, string> = {
  received: 'Received',
  in_hand: 'A crew has it in hand',
  scheduled: 'On a crew’s list for a night',
  fixed: 'Fixed',
  not_ours: 'Not ours to fix: passed on',
  duplicate: 'Already reported',
}
/** What each state means to the person who sent the report, in one plain sentence. */
export const reportStateMeaning: Record<ReportState, string> = {
  received: 'We have your report. A supervisor will look at it and send a crew.',
  in_hand: 'A supervisor has looked at it and is planning the work.',
  scheduled: 'It is on a crew’s list for a night. Crews work after dark.',
  fixed: 'A crew has been and fixed it. Thank you for telling us.',
  not_ours: 'These lights are not ours to look after. We have passed it on.',
  duplicate: 'Someone told us about this before you. We are working from that report.',
}
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
  ref: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^LW-[0-9A-Z]{5}$/, 'A reference looks like LW-7K3QD.'),
})
export const streetList = z.object({ items: z.array(z.object({ name: z.string(), client: z.string() })) })
