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
  })
  .refine((r) => r.tag || r.street || (r.lat !== undefined && r.lng !== undefined), {
    message: 'Give the number on the lights, the street, or your location.',
    path: ['street'],
  })

export const reportStates = ['received', 'in_hand', 'fixed', 'not_ours', 'duplicate'] as const
export type ReportState = (typeof reportStates)[number]
/** A report in one of these states has work waiting: the queue keeps an item open for it. */
export const reportOpenStates = ['received', 'in_hand'] as const satisfies readonly ReportState[]
/** Where a report goes when its queue item closes. */
export const reportClosedStates = ['fixed', 'not_ours', 'duplicate'] as const satisfies readonly ReportState[]
export type ReportClosedState = (typeof reportClosedStates)[number]
export const reportStateLabel: Record<ReportState, string> = {
  received: 'Received',
  in_hand: 'A crew has it in hand',
  fixed: 'Fixed',
  not_ours: 'Not ours to fix: passed on',
  duplicate: 'Already reported',
}
export const reportStatus = z.object({
  ref: z.string(),
  state: z.enum(reportStates),
  stateLabel: z.string(),
  street: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  publicNote: z.string().nullable(),
})
export const refParam = z.object({
  ref: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^LW-[0-9A-Z]{5}$/, 'A reference looks like LW-7K3QD.'),
})
export const streetList = z.object({ items: z.array(z.object({ name: z.string(), client: z.string() })) })
