// The register at scale: one page of strings, sorted and filtered by the server, and the file
// columns its template, import and export share.
import { z } from 'zod'
import { statusSchema } from './string-states'
import { seasonStateSchema } from './season'

/** Columns the register may sort on: each is a column the Register page shows. */
export const registerSorts = [
  'assetTag',
  'name',
  'status',
  'lampsOut',
  'type',
  'site',
  'client',
  'circuit',
  'structure',
  'installedOn',
  'lastVisitAt',
  'forecastDarkAt',
  'seasonState',
] as const
export type RegisterSort = (typeof registerSorts)[number]

export const registerFilters = z.object({
  q: z.string().trim().max(80).optional(),
  siteId: z.coerce.number().int().positive().optional(),
  typeId: z.coerce.number().int().positive().optional(),
  status: statusSchema.optional(),
  /** The string's season state: in store, installed, in service, taken down, needs repair. */
  season: seasonStateSchema.optional(),
})
export type RegisterFilters = z.infer<typeof registerFilters>

export const registerQuery = registerFilters.extend({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  sort: z.enum(registerSorts).default('assetTag'),
  dir: z.enum(['asc', 'desc']).default('asc'),
})

export const registerRow = z.object({
  id: z.number(),
  assetTag: z.string(),
  name: z.string(),
  status: statusSchema,
  lampsOut: z.number(),
  typeCode: z.string(),
  typeName: z.string(),
  technology: z.string(),
  siteId: z.number(),
  siteName: z.string(),
  clientName: z.string(),
  circuitRef: z.string().nullable(),
  structureRef: z.string().nullable(),
  installedOn: z.string().nullable(),
  lastVisitAt: z.string().nullable(),
  forecastDarkAt: z.string().nullable(),
  seasonState: seasonStateSchema,
  /** The store bin it is kept in while down. */
  storeBin: z.string().nullable(),
  lat: z.number(),
  lng: z.number(),
})

export const registerPage = z.object({
  items: z.array(registerRow),
  /** Strings matching the filters, over all pages. */
  total: z.number(),
  /** The filter menus' choices. */
  sites: z.array(z.object({ id: z.number(), name: z.string() })),
  types: z.array(z.object({ id: z.number(), code: z.string(), name: z.string() })),
})

export const fileFormat = z.enum(['csv', 'xlsx']).default('csv')
export const templateQuery = z.object({ format: fileFormat })
export const exportQuery = registerFilters.extend({
  format: fileFormat,
  sort: z.enum(registerSorts).default('assetTag'),
  dir: z.enum(['asc', 'desc']).default('asc'),
})

/**
 * The columns of the template, the import and the export, in order. A site is named
 * `clientName/siteName` (sites have no code of their own; a site's name is unique per client).
 */
export const fileColumns = [
  'assetTag',
  'name',
  'typeCode',
  'siteName',
  'circuitRef',
  'structureRef',
  'geometry',
  'lat',
  'lng',
  'line',
  'mountingHeightM',
  'installedOn',
] as const
export type FileColumn = (typeof fileColumns)[number]

/** Import limits, checked before any parsing (the file) and right after it (the rows). */
export const IMPORT_MAX_ROWS = 50_000
export const IMPORT_MAX_MB = 20
export const IMPORT_FIELD = 'file'

export const importBody = z.object({
  dryRun: z.enum(['true', 'false']).default('true'),
  mode: z.enum(['upsert', 'strict']).default('upsert'),
})

export const importError = z.object({ field: z.string(), code: z.string(), message: z.string() })
export type ImportError = z.infer<typeof importError>

export const importResult = z.object({
  dryRun: z.boolean(),
  mode: z.enum(['upsert', 'strict']),
  /** Whether anything was saved: false for a dry run, and for a strict import with a bad row. */
  written: z.boolean(),
  created: z.number(),
  updated: z.number(),
  unchanged: z.number(),
  /** Row numbers count the header as row 1, as a spreadsheet shows them. */
  rejected: z.array(z.object({ row: z.number(), errors: z.array(importError) })),
})
export type ImportResult = z.infer<typeof importResult>
