// Every live string's id, place and state, kept by each process for the map's zoomed-out grouping
// (map-view.ts). The first read takes every row; later reads, at most POSITIONS_TTL_MS apart, take
// only the rows whose updated_at moved (migrations/20261203002000_strings_changed_at.ts), from a
// little before the newest change already seen, so a write that committed a moment after it was
// stamped is not missed. A write stamped long before its commit (a large import), or by an app server
// whose clock runs seconds behind, could still slip past that margin: a full read every POSITIONS_FULL_MS puts such a row right.
import type { Db } from '../db'
import { URGENCY_ORDER } from '../../shared/vocab/map-view'

/** How old a zoomed-out mark's state may be. */
export const POSITIONS_TTL_MS = 5_000
/** How far before the newest change seen each later read starts. */
const OVERLAP_MS = 5_000
/** How often every row is read again. */
export const POSITIONS_FULL_MS = 60_000

export const urgencyCase = `case s.status ${URGENCY_ORDER.map((st, i) => `when '${st}' then ${i}`).join(' ')} else 0 end`

export interface Positions {
  /** Slots in use; a string archived since the first read keeps its slot with lat NaN. */
  size: number
  ids: Int32Array
  lat: Float64Array
  lng: Float64Array
  u: Uint8Array
}

interface Kept {
  p: Positions
  slot: Map<number, number>
  /** The newest updated_at read so far. */
  newest: Date | null
  fullAt: number
}

function empty(capacity: number): Positions {
  return {
    size: 0,
    ids: new Int32Array(capacity),
    lat: new Float64Array(capacity),
    lng: new Float64Array(capacity),
    u: new Uint8Array(capacity),
  }
}

function grow(p: Positions): Positions {
  const q = empty(Math.max(1024, p.ids.length * 2))
  q.size = p.size
  q.ids.set(p.ids)
  q.lat.set(p.lat)
  q.lng.set(p.lng)
  q.u.set(p.u)
  return q
}

interface Row {
  id: number
  lat: number
  lng: number
  u: number | string
  gone: number
  updatedAt: Date
}

function apply(k: Kept, rows: Row[]): void {
  for (const r of rows) {
    let i = k.slot.get(r.id)
    if (i === undefined) {
      if (r.gone) continue
      if (k.p.size === k.p.ids.length) k.p = grow(k.p)
      i = k.p.size++
      k.slot.set(r.id, i)
      k.p.ids[i] = r.id
    }
    k.p.lat[i] = r.gone ? NaN : r.lat
    k.p.lng[i] = r.lng
    k.p.u[i] = Number(r.u)
    if (!k.newest || r.updatedAt > k.newest) k.newest = r.updatedAt
  }
}

async function read(db: Db, since: Date | null): Promise<Row[]> {
  const q = db('strings as s').select(
    's.id',
    's.lat',
    's.lng',
    db.raw(`${urgencyCase} as u`),
    db.raw('s.archived_at is not null as gone'),
    's.updatedAt',
  )
  // The first read needs the live strings only; later ones also learn which were archived.
  return since ? q.where('s.updatedAt', '>=', since) : q.whereNull('s.archivedAt')
}

let kept: { db: Db; at: number; load: Promise<Kept> } | null = null

/** The positions, read again (in part) when older than POSITIONS_TTL_MS. */
export async function positions(db: Db): Promise<Positions> {
  const now = Date.now()
  if (kept && kept.db === db && now - kept.at < POSITIONS_TTL_MS) return (await kept.load).p
  const before = kept?.db === db ? kept.load : null
  const load = (async (): Promise<Kept> => {
    const last = before ? await before.catch(() => null) : null
    if (!last || now - last.fullAt >= POSITIONS_FULL_MS) {
      const k: Kept = { p: empty(0), slot: new Map(), newest: null, fullAt: now }
      apply(k, await read(db, null))
      return k
    }
    const since = last.newest ? new Date(last.newest.getTime() - OVERLAP_MS) : new Date(0)
    apply(last, await read(db, since))
    return last
  })()
  kept = { db, at: now, load }
  // A failed read is not kept: the next request starts again from a full read.
  load.catch(() => {
    if (kept?.load === load) kept = null
  })
  return (await load).p
}
