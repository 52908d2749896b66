import { z } from 'zod'

export const clientReportQuery = z.object({
  clientId: z.coerce.number().int().positive(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
})

export const clientReport = z.object({
  client: z.object({
    id: z.number(),
    name: z.string(),
    contractRef: z.string().nullable(),
    emergencyHours: z.number(),
    standardHours: z.number(),
  }),
  from: z.string(),
  to: z.string(),
  strings: z.object({ total: z.number(), byStatus: z.record(z.string(), z.number()) }),
  visits: z.object({
    total: z.number(),
    lampsFound: z.number(),
    lampsReplaced: z.number(),
    fuseLampsReplaced: z.number(),
    relamps: z.number(),
    relampsIsolated: z.number(),
    photos: z.number(),
  }),
  faults: z.object({
    opened: z.number(),
    closed: z.number(),
    closedOnTime: z.number(),
    onTimeShare: z.number().nullable(),
    medianHoursToClose: z.number().nullable(),
    openOverdueNow: z.number(),
  }),
  publicReports: z.object({ received: z.number(), fixed: z.number() }),
  energy: z.object({ nights: z.number(), kwh: z.number(), cost: z.number() }),
})
export type ClientReport = z.infer<typeof clientReport>
