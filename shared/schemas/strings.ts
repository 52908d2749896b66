import { z } from 'zod'
import { statusSchema } from './string-states'
import { seasonStateSchema } from './season'
import { circuitResponseSchema } from './engine'

export const bboxQuery = z.object({
  bbox: z
    .string()
    .regex(/^-?\d+(\.\d+)?(,-?\d+(\.\d+)?){3}$/, 'bbox is minLng,minLat,maxLng,maxLat')
    .transform((s) => s.split(',').map(Number) as [number, number, number, number])
    .refine(
      ([a, b, c, d]) => a <= c && b <= d && b >= -90 && d <= 90,
      'bbox corners are out of order or range',
    )
    .optional(),
  q: z.string().trim().max(80).optional(),
  status: statusSchema.optional(),
  limit: z.coerce.number().int().min(1).max(50000).default(25000),
})

export const mapItem = z.object({
  id: z.number(),
  assetTag: z.string(),
  name: z.string(),
  lat: z.number(),
  lng: z.number(),
  status: statusSchema,
  lampsOut: z.number(),
  replaceNow: z.boolean(),
  line: z.array(z.tuple([z.number(), z.number()])).nullable(),
})
export const mapList = z.object({ items: z.array(mapItem), truncated: z.boolean() })
export type MapItem = z.infer<typeof mapItem>

export const tagParam = z.object({ tag: z.string().trim().min(2).max(40) })
export const tagLookup = z.object({ id: z.number(), assetTag: z.string() })

/** A string type: lamp classes, thresholds and life model. */
export const stringTypeSchema = z.object({
  id: z.number(),
  code: z.string(),
  name: z.string(),
  technology: z.enum(['filament', 'led']),
  wiring: z.enum(['series', 'parallel']),
  supplyVolts: z.number(),
  ratedLifeHours: z.number(),
  lifeExponent: z.number(),
  weibullShape: z.number(),
  replaceAtRatio: z.number(),
  /** null: the default chance (shared/engine/defaults.ts DEFAULT_REPLACE_RISK). */
  replaceRisk: z.number().nullable(),
  shuntFailProbability: z.number(),
  branches: z.number(),
  powerFactor: z.number().nullable(),
  driverMinVolts: z.number().nullable(),
  driverMaxVolts: z.number().nullable(),
  inrushPeakAmps: z.number().nullable(),
  inrushMs: z.number().nullable(),
  referenceColdOhms: z.number().nullable(),
  referenceHotAmps: z.number().nullable(),
  referenceVolts: z.number().nullable(),
  hotColdRatio: z.number().nullable(),
  classes: z.array(
    z.object({
      label: z.string(),
      count: z.number(),
      ratedVolts: z.number(),
      ratedAmps: z.number(),
      shunted: z.boolean(),
      /** null: the type's */
      ratedLifeHours: z.number().nullable(),
      lifeExponent: z.number().nullable(),
    }),
  ),
})

/** The string page: record, type, place, circuit, certificates, history and the engine's verdict. */
/**
 * The page's lead forecast: the chance of going dark within 72 burning hours and the likely dark day
 * (the client's local day), from the forecast the queue judges by (`source: 'queue'`) or, when that no
 * longer fits the string, one the page worked out itself (`'page'`). The whole forecast is
 * GET /strings/{id}/forecast.
 */
export const stringOutlook = z.object({
  pDark72: z.number().nullable(),
  darkDate: z.string().nullable(),
  madeAt: z.string(),
  /** Simulated runs behind it (the queue's forecast uses fewer than the page's whole one). */
  trials: z.number(),
  source: z.enum(['queue', 'page']),
})
export type StringOutlook = z.infer<typeof stringOutlook>

/** GET /strings/{id}/forecast: the engine's whole forecast of the string as it is now. */
export const stringForecast = z.object({ forecast: z.unknown() })

export const stringDetail = z.object({
  id: z.number(),
  assetTag: z.string(),
  name: z.string(),
  status: statusSchema,
  lampsOut: z.number(),
  fuseFailed: z.boolean(),
  dark: z.boolean(),
  isolated: z.boolean(),
  replaceNow: z.boolean(),
  lat: z.number(),
  lng: z.number(),
  line: z.array(z.tuple([z.number(), z.number()])).nullable(),
  installedOn: z.string().nullable(),
  /** Where it is in its season (in store, installed, in service, taken down, needs repair) and its bin. */
  seasonState: seasonStateSchema,
  storeBin: z.string().nullable(),
  /** Burning hours on the lamps (the older ones, after a relamp), brought up to now. */
  lampAgeHours: z.number(),
  /**
   * Exposure per lamp class, brought up to now: the rated-voltage hours equivalent to the lamps'
   * burning so far (each hour at ratio r counts r^d hours; d the class's life exponent). The forecast
   * starts from these.
   */
  lampExposure: z.array(z.number()),
  /** When the stored age and exposure were last brought up to date (each change of state). */
  exposureAt: z.string().nullable(),
  /** Which rule set replace now: the lamps' voltage ratio, or the forecast's risk of going dark. */
  replaceRule: z.enum(['ratio', 'risk']).nullable(),
  /** The risk rule's words when it fired, e.g. "forecast: 27 % chance of going dark before the next patrol on 4 Dec". */
  riskNote: z.string().nullable(),
  lastVisitAt: z.string().nullable(),
  type: stringTypeSchema,
  site: z.object({
    id: z.number(),
    name: z.string(),
    clientId: z.number(),
    clientName: z.string(),
    accessNote: z.string().nullable(),
  }),
  schedule: z.object({ switchOn: z.string(), switchOff: z.string(), burnHoursPerDay: z.number() }),
  circuit: z
    .object({
      id: z.number(),
      ref: z.string(),
      breakerAmps: z.number(),
      breakerCurve: z.string(),
      rcdMa: z.number().nullable(),
      supplyPoint: z.string(),
      supplyPointRef: z.string(),
    })
    .nullable(),
  structure: z
    .object({ id: z.number(), kind: z.string(), ref: z.string(), approvedLoad: z.string().nullable() })
    .nullable(),
  certificates: z.array(
    z.object({
      id: z.number(),
      kind: z.string(),
      reference: z.string().nullable(),
      doneOn: z.string(),
      nextDue: z.string().nullable(),
      result: z.string(),
    }),
  ),
  assessment: z.unknown(),
  outlook: stringOutlook,
  visits: z.array(
    z.object({
      id: z.number(),
      visitedAt: z.string(),
      by: z.string(),
      failedFound: z.number(),
      replaced: z.number(),
      fuseReplaced: z.boolean(),
      darkOnArrival: z.boolean(),
      brightLamps: z.number(),
      statusAfter: statusSchema,
      notes: z.string().nullable(),
      isolationId: z.number().nullable(),
      /** A relamp visit, or the visit row of a season record (its photos hang on it). */
      kind: z.enum(['visit', 'commissioning', 'store_inspection', 'take_down']),
      photos: z.array(z.object({ id: z.number(), url: z.string(), thumbUrl: z.string() })),
    }),
  ),
})
export type StringDetail = z.infer<typeof stringDetail>

export const circuitLoadResult = z.object({
  circuitId: z.number(),
  ref: z.string(),
  stringCount: z.number(),
  energised: z.number(),
  seasonDays: z.number().nullable(),
  result: circuitResponseSchema.nullable(),
})
export type CircuitLoad = z.infer<typeof circuitLoadResult>
