import type { Db } from '../../db'
import type { Lookups } from './check-rows'

/** A site as files name it: sites have no code, and a site's name is unique per client. */
export const siteKey = (clientName: string, siteName: string) => `${clientName}/${siteName}`

/** Every code and ref a register file may name, each to its id (archived ones excluded). */
export async function loadLookups(db: Db): Promise<Lookups> {
  const [types, sites, circuits, structures] = await Promise.all([
    db('stringTypes').whereNull('archivedAt').select('id', 'code'),
    db('sites as si')
      .join('clients as c', 'c.id', 'si.clientId')
      .whereNull('si.archivedAt')
      .select('si.id', 'si.name', 'c.name as clientName'),
    db('circuits').whereNull('archivedAt').select('id', 'ref'),
    db('structures').whereNull('archivedAt').select('id', 'ref'),
  ])
  return {
    types: Object.fromEntries(types.map((t) => [t.code, t.id])),
    sites: Object.fromEntries(sites.map((s) => [siteKey(s.clientName, s.name), s.id])),
    circuits: Object.fromEntries(circuits.map((c) => [c.ref, c.id])),
    structures: Object.fromEntries(structures.map((s) => [s.ref, s.id])),
  }
}
