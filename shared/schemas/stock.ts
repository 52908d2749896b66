// Lamp and spares stock: what the depot and each crew's van hold, moves between them, counts
// corrected, what the season used and what to order.
import { z } from 'zod'

const id = z.coerce.number().int().positive()
const qty = z.number().int().min(1, 'At least 1.').max(100_000)

export const stockQuery = z.object({ locationId: id.optional(), crewId: id.optional() })
export type StockQuery = z.infer<typeof stockQuery>

export const locationKind = z.enum(['depot', 'van'])

export const stockLine = z.object({
  locationId: z.number(),
  locationKind,
  /** The van's crew; null for the depot. */
  crewId: z.number().nullable(),
  locationName: z.string(),
  itemId: z.number(),
  itemName: z.string(),
  quantity: z.number(),
  /** At or below this count the place is low on the item (a notice goes to supervisors); null: no level. */
  lowAt: z.number().nullable(),
})
export type StockLine = z.infer<typeof stockLine>
export const stockList = z.object({ items: z.array(stockLine) })

export const transferBody = z
  .object({
    itemId: z.number().int().positive(),
    fromLocationId: z.number().int().positive(),
    toLocationId: z.number().int().positive(),
    quantity: qty,
  })
  .refine((b) => b.fromLocationId !== b.toLocationId, {
    message: 'Choose two different places.',
    path: ['toLocationId'],
  })
export type TransferBody = z.infer<typeof transferBody>
export const transferResult = z.object({ movementId: z.number(), from: stockLine, to: stockLine })

export const adjustmentBody = z.object({
  itemId: z.number().int().positive(),
  locationId: z.number().int().positive(),
  /** The count found on the shelf or in the van: the new quantity, not a difference. */
  quantity: z.number().int().min(0, 'Cannot be negative.').max(100_000),
  reason: z.string().trim().min(3, 'Say why in a few words.').max(255),
})
export type AdjustmentBody = z.infer<typeof adjustmentBody>
export const adjustmentResult = z.object({ movementId: z.number(), change: z.number(), line: stockLine })

export const lowLevelBody = z.object({
  itemId: z.number().int().positive(),
  locationId: z.number().int().positive(),
  lowAt: z.number().int().min(0).max(100_000).nullable(),
})
export type LowLevelBody = z.infer<typeof lowLevelBody>

export const usageQuery = z
  .object({ clientId: id.optional(), from: z.iso.date().optional(), to: z.iso.date().optional() })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'From must not be after to.', path: ['to'] })
export type UsageQuery = z.infer<typeof usageQuery>

export const usageResult = z.object({
  from: z.string().nullable(),
  to: z.string().nullable(),
  /** Lamps and spares fitted, by client and item (lamp class), largest first. */
  rows: z.array(
    z.object({
      clientId: z.number().nullable(),
      clientName: z.string(),
      itemId: z.number(),
      itemName: z.string(),
      quantity: z.number(),
    }),
  ),
})
export type UsageResult = z.infer<typeof usageResult>

export const orderList = z.object({
  from: z.string().nullable(),
  to: z.string().nullable(),
  lines: z.array(
    z.object({
      itemId: z.number(),
      itemName: z.string(),
      used: z.number(),
      needed: z.number(),
      inStock: z.number(),
      order: z.number(),
    }),
  ),
})
export type OrderList = z.infer<typeof orderList>

export const needLine = z.object({
  itemId: z.number(),
  itemName: z.string(),
  need: z.number(),
  have: z.number(),
  short: z.number(),
})

export const loadOutQuery = z.object({ crewId: id.optional(), date: z.iso.date().optional() })
export const loadOut = z.object({
  date: z.string(),
  crew: z.object({ id: z.number(), name: z.string() }),
  locationId: z.number(),
  /** The crew's saved run for the date (published or draft); null when none is planned yet. */
  run: z.object({ id: z.number(), state: z.string(), stops: z.number() }).nullable(),
  /** Forecast use by class (lamps out on the run's strings) against the van, shortfalls first. */
  lines: z.array(needLine),
})
export type LoadOut = z.infer<typeof loadOut>
