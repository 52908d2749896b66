// Each kind of the estate declared once: its table, body schema, who may write it, what `q` searches,
// which fields name other rows, which must be unique, and how its children are loaded and saved.
import type { z } from 'zod'
import type { Role } from '../../../shared/roles'
import { estateEditors, planners } from '../../../shared/roles'
import { estateKinds, type EstateKind } from '../../../shared/schemas/estate'
import type { Db } from '../../db'
import { syncStringQueue } from '../queue/strings'
import { vanOf } from '../stock-places'
import { refreshSoon } from '../queue/refresh-soon'
import {
  accrueExposure,
  loadLampClasses,
  saveLampClasses,
  loadMemberIds,
  saveMembers,
  restateStrings,
  STRESS_FIELDS,
} from './children'

export interface KindDef {
  kind: EstateKind
  /** Knex table name (camelCase; db.ts makes it snake_case). */
  table: string
  /** The audit log's entity name. */
  entity: string
  label: string
  body: z.ZodObject<z.ZodRawShape>
  write: readonly Role[]
  search: string[]
  /** Fields that name a row of another table: field → table. */
  refs: Record<string, string>
  /** Fields unique across the table (all rows, archived too); `scope` narrows to a parent. */
  unique: { field: string; scope?: string }[]
  /** Body fields kept in other tables, not columns. */
  children?: string[]
  /** JSON columns, stored as text. */
  json?: string[]
  /** Columns the engine keeps up to date, not the editor: left out of the row (the string page has them). */
  derived?: string[]
  loadChildren?: (db: Db, id: number) => Promise<Record<string, unknown>>
  saveChildren?: (trx: Db, id: number, body: Record<string, unknown>, role?: Role) => Promise<void>
  /** Before an update is written (`body` as sent, children included): settle what the old row implies. */
  beforeUpdate?: (trx: Db, id: number, body: Record<string, unknown>) => Promise<void>
  /** After an update: restate what depends on the row; answers extra fields for the response. */
  afterUpdate?: (trx: Db, id: number, changed: Record<string, unknown>) => Promise<Record<string, unknown>>
  /** After archiving: what leaves with the row (queue items, crew memberships). */
  afterArchive?: (trx: Db, id: number) => Promise<void>
}

const def = (kind: EstateKind, d: Omit<KindDef, 'kind' | 'body'>): KindDef => ({
  kind,
  body: estateKinds[kind] as unknown as z.ZodObject<z.ZodRawShape>,
  ...d,
})

export const kindDefs: KindDef[] = [
  def('clients', {
    table: 'clients',
    entity: 'client',
    label: 'Client',
    write: estateEditors,
    search: ['name', 'contractRef', 'contactName'],
    refs: {},
    unique: [{ field: 'name' }],
  }),
  def('sites', {
    table: 'sites',
    entity: 'site',
    label: 'Site',
    write: estateEditors,
    search: ['name', 'accessNote'],
    refs: { clientId: 'clients' },
    unique: [{ field: 'name', scope: 'clientId' }],
  }),
  def('supply-points', {
    table: 'supplyPoints',
    entity: 'supply_point',
    label: 'Supply point',
    write: estateEditors,
    search: ['ref', 'name'],
    refs: { siteId: 'sites' },
    unique: [{ field: 'ref' }],
  }),
  def('circuits', {
    table: 'circuits',
    entity: 'circuit',
    label: 'Circuit',
    write: estateEditors,
    search: ['ref'],
    refs: { supplyPointId: 'supplyPoints' },
    unique: [{ field: 'ref' }],
  }),
  def('structures', {
    table: 'structures',
    entity: 'structure',
    label: 'Structure',
    write: estateEditors,
    search: ['ref', 'approvalRef', 'approvedLoad'],
    refs: { siteId: 'sites' },
    unique: [{ field: 'ref' }],
  }),
  def('string-types', {
    table: 'stringTypes',
    entity: 'string_type',
    label: 'String type',
    write: estateEditors,
    search: ['code', 'name'],
    refs: {},
    unique: [{ field: 'code' }],
    children: ['lampClasses'],
    loadChildren: async (db, id) => ({ lampClasses: await loadLampClasses(db, id) }),
    saveChildren: saveLampClasses,
    // Hours burned so far count at the old ratings: exposure is brought up to date first.
    beforeUpdate: async (trx, id, body) => {
      if (STRESS_FIELDS.some((f) => body[f] !== undefined)) await accrueExposure(trx, { typeId: id })
    },
    // Its strings' stored forecasts are made again soon (the string page reads its lead from them).
    afterUpdate: async (trx, id) => {
      refreshSoon()
      return { restated: await restateStrings(trx, { typeId: id }) }
    },
  }),
  def('strings', {
    table: 'strings',
    entity: 'string',
    label: 'String',
    write: estateEditors,
    search: ['assetTag', 'name'],
    refs: { typeId: 'stringTypes', siteId: 'sites', circuitId: 'circuits', structureId: 'structures' },
    unique: [{ field: 'assetTag' }],
    json: ['line'],
    // Stored as of the last change of state; the string page brings them up to now.
    derived: ['lampAgeHours', 'lampExposure', 'exposureAt', 'replaceRule', 'riskNote'],
    beforeUpdate: async (trx, id, body) => {
      if (body.typeId !== undefined) await accrueExposure(trx, { id })
    },
    afterUpdate: async (trx, id, changed) => {
      refreshSoon()
      return 'typeId' in changed ? { restated: await restateStrings(trx, { id }) } : {}
    },
    afterArchive: async (trx, id) => syncStringQueue(trx, id, null),
  }),
  def('crews', {
    table: 'crews',
    entity: 'crew',
    label: 'Crew',
    write: planners,
    search: ['name', 'depotName'],
    refs: { platformId: 'platforms' },
    unique: [{ field: 'name' }],
    children: ['memberIds'],
    loadChildren: async (db, id) => ({ memberIds: await loadMemberIds(db, id) }),
    // A new crew gets its van's stock place in the same commit (vanOf finds the one it has).
    saveChildren: async (trx, id, body, role) => {
      await saveMembers(trx, id, body, role)
      await vanOf(trx, id)
    },
    afterArchive: async (trx, id) => {
      await trx('users').where({ crewId: id }).update({ crewId: null })
    },
  }),
  def('platforms', {
    table: 'platforms',
    entity: 'platform',
    label: 'Platform',
    write: planners,
    search: ['name', 'assetTag'],
    refs: {},
    unique: [{ field: 'assetTag' }],
  }),
]

export const kindDef = (kind: EstateKind): KindDef => kindDefs.find((k) => k.kind === kind)!
