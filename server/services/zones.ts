// Whose clock a date follows: a client's own zone (clients.time_zone, where set) or the app's.
// Crews have no zone of their own; they work in the app's zone.
import type { Db } from '../db'
import { config } from '../config'

/** Every client's zone by id; clients without one (or before the column exists) follow `fallback`. */
export async function clientZones(db: Db, fallback = config.APP_TIME_ZONE): Promise<Map<number, string>> {
  const rows: { id: number; timeZone: string | null }[] = await db('clients').select('id', 'timeZone')
  return new Map(rows.map((r) => [r.id, r.timeZone || fallback]))
}

/** One client's zone, or the app's for none. */
export async function clientZone(
  db: Db,
  clientId: number | null | undefined,
  fallback = config.APP_TIME_ZONE,
): Promise<string> {
  if (!clientId) return fallback
  const row: { timeZone: string | null } | undefined = await db('clients')
    .where({ id: clientId })
    .first('timeZone')
  return row?.timeZone || fallback
}
