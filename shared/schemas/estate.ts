// The contractor's own estate as the API takes it: one create schema per kind, whose fields are the
// data model's columns in camelCase. PATCH takes any of them plus the row's `version`; DELETE archives.
import { z } from 'zod'
import { hhmm } from './common'

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use YYYY-MM-DD.')
const lat = z.number().min(-90).max(90)
const lng = z.number().min(-180).max(180)
const ref = z.string().trim().min(1).max(40)
const name = z.string().trim().min(1).max(160)
const id = z.number().int().positive()

/** An IANA time-zone name the runtime knows, e.g. Europe/London. */
export const timeZone = z.string().refine((tz) => {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: tz })
    return tz.includes('/') || tz === 'UTC'
  } catch {
    return false
  }
}, 'Use an IANA time-zone name such as Europe/London.')

export const clientBody = z.object({
  name,
  kind: z.enum(['council', 'venue', 'business_district']),
  contactName: z.string().trim().max(120).nullable().optional(),
  contactEmail: z.email().max(190).nullable().optional(),
  contractRef: z.string().trim().max(60).nullable().optional(),
  responseEmergencyHours: z.number().int().min(1).max(168),
  responseStandardHours: z.number().int().min(1).max(720),
  /** `fixed`: on at switchOn; `dusk`: on at local sunset plus duskOffsetMinutes. Off at switchOff either way. */
  switchMode: z.enum(['fixed', 'dusk']).default('fixed'),
  switchOn: hhmm,
  duskOffsetMinutes: z.number().int().min(-120).max(120).default(0),
  switchOff: hhmm,
  /** The season (issue 15): install window, switch-on date (seasonStart), switch-off date (seasonEnd), take-down window. */
  installFrom: isoDate.nullable().optional(),
  installTo: isoDate.nullable().optional(),
  seasonStart: isoDate.nullable().optional(),
  seasonEnd: isoDate.nullable().optional(),
  takeDownFrom: isoDate.nullable().optional(),
  takeDownTo: isoDate.nullable().optional(),
  tariffPerKwh: z.number().min(0).max(10),
  timeZone,
  /** Shown on the public fault-report page for danger to life. */
  emergencyPhone: z.string().trim().max(40).nullable().optional(),
})

export const siteBody = z.object({
  clientId: id,
  name,
  kind: z.enum(['street', 'square', 'park', 'venue', 'bridge']),
  importance: z.number().int().min(1).max(5).default(3),
  accessFrom: hhmm.nullable().optional(),
  accessTo: hhmm.nullable().optional(),
  accessNote: z.string().trim().max(255).nullable().optional(),
  lat,
  lng,
})

export const supplyPointBody = z.object({
  siteId: id,
  ref,
  name,
  lat,
  lng,
  controlledBy: z.enum(['timer', 'photocell', 'remote', 'manual']).default('timer'),
})

export const circuitBody = z.object({
  supplyPointId: id,
  ref,
  supplyVolts: z.number().int().min(12).max(440),
  breakerAmps: z.number().positive().max(125),
  breakerCurve: z.enum(['B', 'C', 'D']),
  /** RCD rated residual current in mA (30 for additional protection); null when none. */
  rcdMa: z.number().int().min(10).max(1000).nullable().optional(),
  /** `S`: time-delayed (selective) RCD; `general`: no intentional delay (the default). */
  rcdType: z.enum(['general', 'S']).default('general'),
})

export const structureBody = z.object({
  siteId: id,
  kind: z.enum(['column', 'anchor', 'building_fixing', 'tree', 'gantry']),
  ref,
  lat,
  lng,
  /** What the structural approval allows to be hung, e.g. "One motif up to 25 kg". */
  approvedLoad: z.string().trim().max(160).nullable().optional(),
  approvalRef: z.string().trim().max(60).nullable().optional(),
  approvalExpires: isoDate.nullable().optional(),
})

const lifeHours = z.number().int().min(100).max(200_000)
const lifeExp = z.number().min(8).max(20)
const maybe = <T extends z.ZodType>(t: T) => t.nullable().optional()

export const lampClassBody = z.object({
  label: z.string().trim().min(1).max(60),
  count: z.number().int().min(1).max(10_000),
  ratedVolts: z.number().positive().max(400),
  ratedAmps: z.number().positive().max(20),
  shunted: z.boolean(),
  /** This class's own median life and life exponent (a fuse lamp's); null: the type's. */
  ratedLifeHours: maybe(lifeHours),
  lifeExponent: maybe(lifeExp),
})

export const stringTypeBody = z.object({
  code: z.string().trim().min(1).max(30),
  name,
  technology: z.enum(['filament', 'led']),
  wiring: z.enum(['series', 'parallel']).default('series'),
  supplyVolts: z.number().int().min(12).max(440),
  ratedLifeHours: lifeHours,
  lifeExponent: lifeExp.default(13),
  weibullShape: z.number().min(0.5).max(8).default(2.8),
  replaceAtRatio: z.number().min(1).max(1.5).default(1.05),
  /** Replace now when the chance of going dark before the next patrol exceeds this; null: 0.20. */
  replaceRisk: maybe(z.number().min(0.01).max(0.99)),
  shuntFailProbability: z.number().min(0).max(0.5).default(0.02),
  lengthM: z.number().positive().max(1000).nullable().optional(),
  notes: z.string().trim().max(500).nullable().optional(),
  /** Parallel chains, each holding every lamp class once. */
  branches: z.number().int().min(1).max(100).default(1),
  /** LED driver: power factor, input range, switch-on surge (from its data sheet). */
  powerFactor: maybe(z.number().min(0.1).max(1)),
  driverMinVolts: maybe(z.number().int().min(1).max(1000)),
  driverMaxVolts: maybe(z.number().int().min(1).max(1000)),
  inrushPeakAmps: maybe(z.number().positive().max(10_000)),
  inrushMs: maybe(z.number().min(0.01).max(10_000)),
  /** Reference measurement of a healthy string: cold ohms, and hot amps at stated volts. */
  referenceColdOhms: maybe(z.number().positive().max(1_000_000)),
  referenceHotAmps: maybe(z.number().positive().max(1000)),
  referenceVolts: maybe(z.number().positive().max(1000)),
  hotColdRatio: maybe(z.number().min(1).max(30)),
  lampClasses: z.array(lampClassBody).min(1).max(50),
})

export const stringBody = z.object({
  assetTag: z.string().trim().min(1).max(40),
  name,
  typeId: id,
  siteId: id,
  circuitId: id.nullable().optional(),
  structureId: id.nullable().optional(),
  geometry: z.enum(['point', 'line']).default('point'),
  lat,
  lng,
  /** [[lng, lat], …] for catenaries and festoons, at least two points. */
  line: z
    .array(z.tuple([lng, lat]))
    .min(2)
    .max(500)
    .nullable()
    .optional(),
  mountingHeightM: z.number().positive().max(60).nullable().optional(),
  installedOn: isoDate.nullable().optional(),
})

export const crewBody = z.object({
  name: z.string().trim().min(1).max(80),
  depotName: z.string().trim().min(1).max(120),
  depotLat: lat,
  depotLng: lng,
  /** Local times in the app's zone; a shift may end after midnight (end before start). */
  shiftStart: hhmm,
  shiftEnd: hhmm,
  platformId: id.nullable().optional(),
  memberIds: z.array(id).max(50).default([]),
})

export const platformBody = z.object({
  name: z.string().trim().min(1).max(120),
  assetTag: z.string().trim().min(1).max(40),
  kind: z.enum(['scissor', 'boom', 'vehicle_mounted', 'tower']),
  workingHeightM: z.number().positive().max(60),
  safeWorkingLoadKg: z.number().int().positive().max(2000),
  maxWindMs: z.number().positive().max(30).default(12.5),
})

/**
 * PATCH: any field of the kind's body, and the version the editor loaded. Defaults are dropped, so a
 * field left out stays as it is rather than going back to its default.
 */
export function patchOf<T extends z.ZodRawShape>(body: z.ZodObject<T>) {
  const shape = Object.fromEntries(
    Object.entries(body.shape).map(([k, f]) => [
      k,
      (f instanceof z.ZodDefault ? (f.unwrap() as z.ZodType) : (f as z.ZodType)).optional(),
    ]),
  ) as unknown as { [K in keyof T]: z.ZodOptional<T[K]> }
  return z.object(shape).extend({ version: z.number().int().min(1) })
}

/** A kind's own defaults as its schema declares them, e.g. a new form's starting values. */
export function schemaDefaults(body: z.ZodObject<z.ZodRawShape>): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const [k, f] of Object.entries(body.shape)) if (f instanceof z.ZodDefault) out[k] = f.parse(undefined)
  return out
}

export const estateKinds = {
  clients: clientBody,
  sites: siteBody,
  'supply-points': supplyPointBody,
  circuits: circuitBody,
  structures: structureBody,
  'string-types': stringTypeBody,
  strings: stringBody,
  crews: crewBody,
  platforms: platformBody,
} as const
export type EstateKind = keyof typeof estateKinds

export const estateListQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  q: z.string().trim().max(100).optional(),
  archived: z.enum(['false', 'true', 'only']).default('false'),
})

/** A stored row of a kind as the API answers it: its fields, id, version and archive date. */
export function rowOf<T extends z.ZodRawShape>(body: z.ZodObject<T>) {
  return body.extend({
    id: z.number(),
    version: z.number(),
    archivedAt: z.string().nullable(),
  })
}

export function pageOf<T extends z.ZodType>(row: T) {
  return z.object({ items: z.array(row), total: z.number() })
}

/** Users who can be put on a crew, for the crew form's member picker. */
export const crewCandidateList = z.object({
  items: z.array(
    z.object({
      id: z.number(),
      name: z.string(),
      role: z.enum(['crew', 'supervisor']),
      crewId: z.number().nullable(),
      crewName: z.string().nullable(),
    }),
  ),
})
