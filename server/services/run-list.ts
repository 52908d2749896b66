import type { Db } from '../db'
import type { CrewRun } from '../../shared/schemas/runs'
import { loadCrews } from './run-items'
import { isoOrNull } from '../../shared/iso-time'
import { reportNotesForItems } from './report-notes'
import { stopProgressOf } from './stop-progress'

/** Saved runs for a date (optionally one crew's), with each stop's string and site. */
export async function listRuns(db: Db, date: string, crewId?: number): Promise<CrewRun[]> {
  const q = db('runs').where({ runDate: date })
  if (crewId) q.where({ crewId })
  const runs = await q.select('*')
  if (!runs.length) return []
  const crews = await loadCrews(
    db,
    runs.map((r) => r.crewId),
  )
  const stops = await db('runStops as rs')
    .leftJoin('queueItems as q', 'q.id', 'rs.queueItemId')
    .leftJoin('strings as s', 's.id', 'rs.stringId')
    .leftJoin('sites as si', 'si.id', 's.siteId')
    .whereIn(
      'rs.runId',
      runs.map((r) => r.id),
    )
    .orderBy(['rs.runId', 'rs.position'])
    .select(
      'rs.*',
      'q.kind',
      'q.summary',
      'q.severity',
      'q.state as itemState',
      's.assetTag',
      's.lat',
      's.lng',
      'si.name as siteName',
      'si.accessFrom',
      'si.accessTo',
      'q.siteId',
    )
  // The reporters' own words on each stop's public-report item (nothing personal).
  const notes = await reportNotesForItems(
    db,
    stops.filter((s) => s.kind === 'public_report').map((s) => s.queueItemId as number),
  )
  // Where each stop stands after the visits logged since its run was published.
  const progress = await stopProgressOf(db, runs, stops)
  const sites = new Map(
    (await db('sites').select('id', 'name', 'lat', 'lng')).map((s) => [s.id as number, s]),
  )
  return runs.map((r) => {
    const crew = crews.find((c) => c.id === r.crewId)!
    return {
      id: r.id,
      crewId: r.crewId,
      crewName: crew.name,
      date,
      state: r.state,
      version: r.version,
      publishedAt: isoOrNull(r.publishedAt),
      depot: { name: crew.depotName, lat: crew.depotLat, lng: crew.depotLng },
      shiftStart: crew.shiftStart,
      shiftEnd: crew.shiftEnd,
      platform: crew.platform ? `${crew.platform.assetTag} ${crew.platform.name}` : null,
      stops: stops
        .filter((s) => s.runId === r.id)
        .map((s) => {
          const site = s.siteId ? sites.get(s.siteId) : undefined
          return {
            itemId: s.queueItemId ?? null,
            kind: s.kind ?? null,
            summary: s.summary ?? 'Stop',
            stringId: s.stringId ?? null,
            assetTag: s.assetTag ?? null,
            siteName: s.siteName ?? site?.name ?? null,
            lat: s.lat ?? site?.lat ?? crew.depotLat,
            lng: s.lng ?? site?.lng ?? crew.depotLng,
            arrive: s.arriveAt,
            start: s.startAt,
            depart: s.departAt,
            travelMinutes: s.travelMinutes ?? 0,
            serviceMinutes: s.serviceMinutes ?? 0,
            pinned: !!s.pinned,
            window: s.accessFrom && s.accessTo ? { from: s.accessFrom, to: s.accessTo } : null,
            doneAt: isoOrNull(s.doneAt),
            emergency: s.severity === 'emergency',
            reports: (s.queueItemId && notes.get(s.queueItemId)) || [],
            progress: progress.get(s.id),
          }
        }),
      returnAt: r.returnAt ?? crew.shiftStart,
      totalTravelMinutes: r.totalTravelMinutes ?? 0,
      totalServiceMinutes: r.totalServiceMinutes ?? 0,
    }
  })
}
