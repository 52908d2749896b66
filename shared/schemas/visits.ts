import { z } from 'zod'
import { statusSchema } from './string-states'
import { NO_ISOLATION_MESSAGE, NO_ISOLATION_MIN } from '../visit-rules'
import { isolationSteps } from '../vocab/visits'

export const idempotencyKey = z
  .string()
  .trim()
  .min(8)
  .max(64)
  .regex(/^[\w-]+$/, 'Use a UUID.')

export const isolationBody = z.object({
  stringId: z.number().int().positive(),
  circuitId: z.number().int().positive().nullable().optional(),
  lockId: z.string().trim().max(60).optional(),
  testerId: z.string().trim().max(60).optional(),
  steps: z
    .array(
      z.object({
        step: z.enum(isolationSteps),
        doneAt: z.iso.datetime({ offset: true }),
        value: z.string().trim().max(60).optional(),
        note: z.string().trim().max(255).optional(),
      }),
    )
    .max(isolationSteps.length),
})
export type IsolationBody = z.infer<typeof isolationBody>

export const isolationResult = z.object({
  id: z.number(),
  state: z.enum(['open', 'isolated', 'restored', 'abandoned']),
  steps: z.array(z.object({ step: z.enum(isolationSteps), doneAt: z.string() })),
})

const count = z.number().int().min(0, 'Cannot be negative.').max(10000)

export const visitBody = z
  .object({
    stringId: z.number().int().positive(),
    failedFound: count,
    replaced: count,
    fuseReplaced: z.boolean().optional(),
    darkOnArrival: z.boolean().optional(),
    leaveMadeSafe: z.boolean().optional(),
    /** Lamps brighter than their neighbours (coils stuck together after a knock); none when left out. */
    brightLamps: count.optional(),
    readings: z
      .object({
        supplyVolts: z.number().positive().max(1000).optional(),
        amps: z.number().min(0).max(200).optional(),
        coldOhms: z.number().min(0).max(1e7).optional(),
      })
      .optional(),
    notes: z.string().trim().max(2000).optional(),
    isolationId: z.number().int().positive().optional(),
    /** The isolation's own idempotency key, for visits queued offline before the isolation had an id. */
    isolationKey: idempotencyKey.optional(),
    noIsolationReason: z.string().trim().min(NO_ISOLATION_MIN, NO_ISOLATION_MESSAGE).max(255).optional(),
    visitedAt: z.iso.datetime({ offset: true }).optional(),
    lat: z.number().min(-90).max(90).optional(),
    lng: z.number().min(-180).max(180).optional(),
  })
  .refine((v) => !(v.isolationId && v.isolationKey), {
    message: 'Give isolationId or isolationKey, not both.',
    path: ['isolationKey'],
  })
export type VisitBody = z.infer<typeof visitBody>

export const visitResult = z.object({
  id: z.number(),
  brightLamps: z.number(),
  string: z.object({ id: z.number(), lampsOut: z.number(), status: statusSchema, replaceNow: z.boolean() }),
})
