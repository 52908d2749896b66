import { z } from 'zod'
import { queueItem } from './queue'

export const overdueReport = z.object({
  generatedAt: z.string(),
  dueSoonHours: z.number(),
  clients: z.array(
    z.object({
      id: z.number(),
      name: z.string(),
      contractRef: z.string().nullable(),
      emergencyHours: z.number(),
      standardHours: z.number(),
      open: z.number(),
      overdue: z.number(),
      dueSoon: z.number(),
      items: z.array(queueItem),
    }),
  ),
})
