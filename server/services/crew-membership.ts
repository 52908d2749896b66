// Who a field user without a crew should ask to be put on one: the supervisors (admins when there are none).
import type { Db } from '../db'

export async function askFrom(db: Db): Promise<string[]> {
  for (const role of ['supervisor', 'admin']) {
    const rows = await db('users').where({ role, active: true }).orderBy('name').select('name')
    if (rows.length) return rows.map((r) => r.name as string)
  }
  return []
}

/** Who can be put on a crew: active crew members and supervisors, with the crew they are on now. */
export async function crewCandidates(db: Db) {
  const rows = await db('users as u')
    .leftJoin('crews as c', 'c.id', 'u.crewId')
    .where('u.active', true)
    .whereIn('u.role', ['crew', 'supervisor'])
    .orderBy('u.name')
    .select('u.id', 'u.name', 'u.role', 'u.crewId', 'c.name as crewName')
  return { items: rows.map((r) => ({ ...r, crewId: r.crewId ?? null, crewName: r.crewName ?? null })) }
}
