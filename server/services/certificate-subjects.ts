// What a certificate is about: its subject's words (platform, structure, string, circuit), where it
// stands (site and client, for the queue and the client's clock), and finding a subject by its tag.
import type { Db } from '../db'
import type { z } from 'zod'
import type { subjectList, subjectQuery } from '../../shared/schemas/certificates'

type SubjectType = z.infer<typeof subjectQuery>['subjectType'] & string
const key = (type: string, id: number) => `${type}:${id}`

/** Subjects by type (`platform`, `structure`, `string`, `circuit`): the ones to look up. */
export type SubjectIds = Map<string, number[]>

/** The subjects of `certs`, by type: to look up only those. */
export function subjectIds(certs: { subjectType: string; subjectId: number }[]): SubjectIds {
  const out: SubjectIds = new Map()
  for (const c of certs) {
    const ids = out.get(c.subjectType) ?? out.set(c.subjectType, []).get(c.subjectType)!
    ids.push(c.subjectId)
  }
  return out
}

/** Rows of one subject type, all of them or (with `only`) those with the listed ids. */
function ofType<T>(
  q: Promise<T[]> & { whereIn: (col: string, ids: number[]) => unknown },
  col: string,
  type: string,
  only?: SubjectIds,
): Promise<T[]> {
  if (!only) return q
  const ids = only.get(type) ?? []
  if (!ids.length) return Promise.resolve([])
  q.whereIn(col, ids)
  return q
}

/**
 * Words for every subject (or, with `only`, for those listed), by `type:id`, e.g. "P-2 Boom lift 16 m"
 * or "COL-014 (column, Market Street)".
 */
export async function subjectLabels(db: Db, only?: SubjectIds): Promise<Map<string, string>> {
  const map = new Map<string, string>()
  for (const p of await ofType(db('platforms').select('id', 'assetTag', 'name'), 'id', 'platform', only))
    map.set(key('platform', p.id), `${p.assetTag} ${p.name}`)
  for (const s of await ofType(
    db('structures as st')
      .join('sites as si', 'si.id', 'st.siteId')
      .select('st.id', 'st.ref', 'st.kind', 'si.name'),
    'st.id',
    'structure',
    only,
  ))
    map.set(key('structure', s.id), `${s.ref} (${s.kind}, ${s.name})`)
  for (const s of await ofType(db('strings').select('id', 'assetTag', 'name'), 'id', 'string', only))
    map.set(key('string', s.id), `${s.assetTag} ${s.name}`)
  for (const c of await ofType(db('circuits').select('id', 'ref'), 'id', 'circuit', only))
    map.set(key('circuit', c.id), `Circuit ${c.ref}`)
  return map
}

/** Where each subject stands (or, with `only`, those listed): structures, strings and circuits belong
 * to a site; platforms to none. */
export async function subjectPlaces(db: Db, only?: SubjectIds) {
  const map = new Map<string, { siteId: number | null; clientId: number | null }>()
  const structures = await ofType(
    db('structures as st')
      .join('sites as si', 'si.id', 'st.siteId')
      .select('st.id', 'si.id as siteId', 'si.clientId'),
    'st.id',
    'structure',
    only,
  )
  for (const s of structures) map.set(key('structure', s.id), { siteId: s.siteId, clientId: s.clientId })
  const strings = await ofType(
    db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .select('s.id', 'si.id as siteId', 'si.clientId'),
    's.id',
    'string',
    only,
  )
  for (const s of strings) map.set(key('string', s.id), { siteId: s.siteId, clientId: s.clientId })
  const circuits = await ofType(
    db('circuits as ci')
      .join('supplyPoints as sp', 'sp.id', 'ci.supplyPointId')
      .join('sites as si', 'si.id', 'sp.siteId')
      .select('ci.id', 'si.id as siteId', 'si.clientId'),
    'ci.id',
    'circuit',
    only,
  )
  for (const c of circuits) map.set(key('circuit', c.id), { siteId: c.siteId, clientId: c.clientId })
  return map
}

const SEARCH_LIMIT = 20

/** Up to 20 subjects whose tag, reference or name contains `q` (platforms, structures, strings, circuits). */
export async function searchSubjects(
  db: Db,
  query: z.infer<typeof subjectQuery>,
): Promise<z.infer<typeof subjectList>['items']> {
  const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`
  const want = (t: SubjectType) => !query.subjectType || query.subjectType === t
  const out: z.infer<typeof subjectList>['items'] = []
  if (want('platform'))
    for (const p of await db('platforms')
      .where((w) => w.where('assetTag', 'like', like).orWhere('name', 'like', like))
      .orderBy('assetTag')
      .limit(SEARCH_LIMIT)
      .select('id', 'assetTag', 'name'))
      out.push({ subjectType: 'platform', subjectId: p.id, label: `${p.assetTag} ${p.name}` })
  if (want('structure'))
    for (const s of await db('structures as st')
      .join('sites as si', 'si.id', 'st.siteId')
      .where((w) => w.where('st.ref', 'like', like).orWhere('si.name', 'like', like))
      .orderBy('st.ref')
      .limit(SEARCH_LIMIT)
      .select('st.id', 'st.ref', 'st.kind', 'si.name'))
      out.push({ subjectType: 'structure', subjectId: s.id, label: `${s.ref} (${s.kind}, ${s.name})` })
  if (want('string'))
    for (const s of await db('strings')
      .where((w) => w.where('assetTag', 'like', like).orWhere('name', 'like', like))
      .orderBy('assetTag')
      .limit(SEARCH_LIMIT)
      .select('id', 'assetTag', 'name'))
      out.push({ subjectType: 'string', subjectId: s.id, label: `${s.assetTag} ${s.name}` })
  if (want('circuit'))
    for (const c of await db('circuits')
      .where('ref', 'like', like)
      .orderBy('ref')
      .limit(SEARCH_LIMIT)
      .select('id', 'ref'))
      out.push({ subjectType: 'circuit', subjectId: c.id, label: `Circuit ${c.ref}` })
  // Exact tags first, then the rest in the order found; at most 20 in all.
  const exact = (l: string) => (l.toLowerCase().startsWith(query.q.toLowerCase()) ? 0 : 1)
  return out.sort((a, b) => exact(a.label) - exact(b.label)).slice(0, SEARCH_LIMIT)
}
