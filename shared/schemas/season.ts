// The season of a string: its state from the store to the street and back, and the records that move
// it — commissioning (installed and tested before switch-on), marking in service, take-down into a
// store bin, and the pre-season inspection in store. The states and their words are in ../vocab/season.ts.
import { z } from 'zod'
import { readingsSchema, findingSchema } from './certificates'
import { clearancePlaces, conditions, seasonStates } from '../vocab/season'

export const seasonStateSchema = z.enum(seasonStates)

const isoInstant = z.iso.datetime({ offset: true })
const count = z.number().int().min(0).max(10000)

/** The same readings as a commissioning; judged as RCD and insulation certificates are. */
const testReadings = readingsSchema.pick({
  ratedMa: true,
  rcdType: true,
  noTripAtHalf: true,
  tripMsAt1x: true,
  tripMsAt2x: true,
  tripMsAt5x: true,
  leakageMa: true,
  testVolts: true,
  megohms: true,
  circuitVolts: true,
})
export type TestReadings = z.infer<typeof testReadings>

export const commissioningBody = z.object({
  /** Column or anchor the string is hung from; absent: the string's own structure on the register. */
  structureId: z.number().int().positive().nullable().optional(),
  place: z.enum(clearancePlaces),
  mountingHeightM: z.number().positive().max(60),
  readings: testReadings,
  /** Lamps out at the switch-on test. */
  lampsOut: count,
  /** Lamps fitted while putting it up (they come off the crew's van). */
  lampsFitted: count.default(0),
  /** Whether a fuse lamp was fitted while putting it up. */
  fuseFitted: z.boolean().default(false),
  doneAt: isoInstant.optional(),
  notes: z.string().trim().max(1000).optional(),
  lat: z.number().min(-90).max(90).optional(),
  lng: z.number().min(-180).max(180).optional(),
})
export type CommissioningBody = z.infer<typeof commissioningBody>

export const storeInspectionBody = z.object({
  readings: testReadings,
  lampsOut: count,
  doneAt: isoInstant.optional(),
  notes: z.string().trim().max(1000).optional(),
})
export type StoreInspectionBody = z.infer<typeof storeInspectionBody>

export const commissioningResult = z.object({
  id: z.number(),
  /** The visit row that carries the photos: POST /visits/{visitId}/photos. */
  visitId: z.number(),
  kind: z.enum(['commissioning', 'store_inspection']),
  result: z.enum(['pass', 'advisory', 'fail']),
  findings: z.array(findingSchema),
  seasonState: seasonStateSchema,
})
export type CommissioningResult = z.infer<typeof commissioningResult>

export const takeDownBody = z.object({
  lampsOut: count,
  damage: z.string().trim().max(500).optional(),
  cable: z.enum(conditions),
  connectors: z.enum(conditions),
  storeBin: z.string().trim().min(1, 'Say which bin it goes in.').max(40),
  forRepair: z.boolean().default(false),
  doneAt: isoInstant.optional(),
  notes: z.string().trim().max(1000).optional(),
})
export type TakeDownBody = z.infer<typeof takeDownBody>

export const takeDownResult = z.object({
  id: z.number(),
  visitId: z.number(),
  seasonState: seasonStateSchema,
  storeBin: z.string(),
})
export type TakeDownResult = z.infer<typeof takeDownResult>

/** Marking a string in service (after a passed commissioning) or back to installed (switched off). */
export const seasonStateBody = z.object({ state: z.enum(['in_service', 'installed']) })
export const seasonStateResult = z.object({ id: z.number(), seasonState: seasonStateSchema })

export const commissioningRow = z.object({
  id: z.number(),
  kind: z.enum(['commissioning', 'store_inspection']),
  stringId: z.number(),
  assetTag: z.string(),
  stringName: z.string(),
  doneAt: z.string(),
  by: z.string().nullable(),
  structureRef: z.string().nullable(),
  approvalNote: z.string().nullable(),
  place: z.enum(clearancePlaces).nullable(),
  mountingHeightM: z.number().nullable(),
  lampsOut: z.number(),
  result: z.enum(['pass', 'advisory', 'fail']),
  findings: z.array(findingSchema),
  readings: z.record(z.string(), z.unknown()).nullable(),
  visitId: z.number().nullable(),
})
export const commissioningList = z.object({ items: z.array(commissioningRow) })
export const commissioningQuery = z.object({
  stringId: z.coerce.number().int().positive().optional(),
  result: z.enum(['pass', 'advisory', 'fail']).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
})

export const repairRow = z.object({
  stringId: z.number(),
  assetTag: z.string(),
  stringName: z.string(),
  clientName: z.string(),
  storeBin: z.string().nullable(),
  takenDownAt: z.string().nullable(),
  lampsOut: z.number(),
  damage: z.string().nullable(),
  cable: z.enum(conditions).nullable(),
  connectors: z.enum(conditions).nullable(),
})
export const repairList = z.object({ items: z.array(repairRow) })

/** The season at a glance per client (the manager's home). */
export const seasonGlanceRow = z.object({
  clientId: z.number(),
  clientName: z.string(),
  switchOnDate: z.string().nullable(),
  switchOffDate: z.string().nullable(),
  counts: z.record(seasonStateSchema, z.number()),
  total: z.number(),
})
export const seasonGlance = z.object({ clients: z.array(seasonGlanceRow) })
export type SeasonGlanceRow = z.infer<typeof seasonGlanceRow>
