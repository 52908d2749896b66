import type { Db } from '../db'

const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : d == null ? null : String(d))

/** The register of every string, with its type, place, circuit and structure, for the manager. */
export async function listRegister(
  db: Db,
  f: { q?: string; siteId?: number; typeId?: number; status?: string },
) {
  const q = db('strings as s')
    .join('stringTypes as t', 't.id', 's.typeId')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .leftJoin('circuits as ci', 'ci.id', 's.circuitId')
    .leftJoin('structures as st', 'st.id', 's.structureId')
    .select(
      's.id',
      's.assetTag',
      's.name',
      's.status',
      's.lampsOut',
      't.code as typeCode',
      't.name as typeName',
      't.technology',
      'si.id as siteId',
      'si.name as siteName',
      'c.name as clientName',
      'ci.ref as circuitRef',
      'st.ref as structureRef',
      's.installedOn',
      's.lastVisitAt',
      's.forecastDarkAt',
      's.lat',
      's.lng',
    )
    .orderBy('s.assetTag')
  if (f.siteId) q.where('s.siteId', f.siteId)
  if (f.typeId) q.where('s.typeId', f.typeId)
  if (f.status) q.where('s.status', f.status)
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`
    q.where((w) =>
      w.where('s.assetTag', 'like', like).orWhere('s.name', 'like', like).orWhere('si.name', 'like', like),
    )
  }
  const rows = await q
  return {
    items: rows.map((r) => ({
      ...r,
      circuitRef: r.circuitRef ?? null,
      structureRef: r.structureRef ?? null,
      installedOn: r.installedOn ?? null,
      lastVisitAt: iso(r.lastVisitAt),
      forecastDarkAt: iso(r.forecastDarkAt),
    })),
    sites: await db('sites').orderBy('name').select('id', 'name'),
    types: await db('stringTypes').orderBy('code').select('id', 'code', 'name'),
  }
}
