// What the planner needs to know about queue items and crews, loaded from the database.
import type { Db } from '../db'
import type { PlanCrew, PlanItem } from '../../shared/routing/plan-types'
import { listQueue } from './queue/list'
import { badRequest } from '../errors'
import { rankPriority } from '../../shared/schemas/report-work'
import { seasonMinutes, stringsUpBySite } from './season-jobs'

/** Minutes on site per kind of work (common practice, no source; set to our crews' own timings). */
export const SERVICE_MINUTES: Record<string, number> = {
  replace_now: 30,
  dark: 40,
  forecast_dark: 25,
  public_report: 25,
  certificate_due: 30,
  rcd_failed: 45,
  // Season work: hang, connect and commission one string; take-down is per string on its site's one job.
  installation: 45,
  take_down: 20,
}

export interface ItemInfo {
  itemId: number
  kind: string
  summary: string
  stringId: number | null
  assetTag: string | null
  siteName: string | null
  lat: number
  lng: number
  serviceMinutes: number
  window: { from: string; to: string } | null
  needsPlatform: boolean
  priority: number
  emergency: boolean
}

export async function loadItems(db: Db, ids: number[]): Promise<Map<number, ItemInfo>> {
  const picked = await listQueue(db, { state: 'all', ids })
  const missing = ids.filter((id) => !picked.some((p) => p.id === id))
  if (missing.length) throw badRequest('unknown_items', 'Some queue items do not exist.', { missing })
  const noPlace = picked.filter((p) => p.lat == null || p.lng == null)
  if (noPlace.length)
    throw badRequest('items_without_place', 'Some items have no location to plan a run to.', {
      ids: noPlace.map((p) => p.id),
    })
  const stringIds = picked.map((p) => p.string?.id).filter((x): x is number => !!x)
  const geometry = new Map(
    (await db('strings').whereIn('id', stringIds).select('id', 'geometry')).map((s) => [
      s.id as number,
      s.geometry as string,
    ]),
  )
  const up = await stringsUpBySite(
    db,
    picked.filter((p) => p.kind === 'take_down' && p.site).map((p) => p.site!.id),
  )
  return new Map(
    picked.map((p) => [
      p.id,
      {
        itemId: p.id,
        kind: p.kind,
        summary: p.summary,
        stringId: p.string?.id ?? null,
        assetTag: p.string?.assetTag ?? null,
        siteName: p.site?.name ?? null,
        lat: p.lat!,
        lng: p.lng!,
        serviceMinutes: seasonMinutes(p.kind, SERVICE_MINUTES[p.kind] ?? 30, p.site?.id ?? null, up),
        window:
          p.site?.accessFrom && p.site?.accessTo ? { from: p.site.accessFrom, to: p.site.accessTo } : null,
        // Catenaries and festoons hang over the carriageway (≥ 5.2 m): work from a platform.
        needsPlatform: p.string ? geometry.get(p.string.id) === 'line' : false,
        // Emergencies before every routine item in the planner's order (report-work.ts).
        priority: rankPriority(p),
        emergency: p.severity === 'emergency',
      },
    ]),
  )
}

export async function loadCrews(db: Db, ids?: number[]) {
  const q = db('crews as c')
    .leftJoin('platforms as p', 'p.id', 'c.platformId')
    .where('c.active', true)
    .select('c.*', 'p.name as platformName', 'p.assetTag as platformTag', 'p.workingHeightM')
  if (ids) q.whereIn('c.id', ids)
  const crews = await q.orderBy('c.name')
  if (ids && crews.length !== ids.length)
    throw badRequest('unknown_crews', 'Some crews do not exist or are inactive.')
  const members = await db('users')
    .whereIn(
      'crewId',
      crews.map((c) => c.id),
    )
    .where('active', true)
    .select('id', 'name', 'email', 'crewId')
  return crews.map((c) => ({
    id: c.id as number,
    name: c.name as string,
    depotName: c.depotName as string,
    depotLat: c.depotLat as number,
    depotLng: c.depotLng as number,
    shiftStart: c.shiftStart as string,
    shiftEnd: c.shiftEnd as string,
    platform: c.platformId
      ? {
          id: c.platformId as number,
          name: c.platformName as string,
          assetTag: c.platformTag as string,
          workingHeightM: c.workingHeightM as number,
        }
      : null,
    members: members
      .filter((m) => m.crewId === c.id)
      .map((m) => ({ id: m.id as number, name: m.name as string, email: m.email as string })),
  }))
}
export type CrewInfo = Awaited<ReturnType<typeof loadCrews>>[number]

export const toPlanCrew = (c: CrewInfo): PlanCrew => ({
  id: String(c.id),
  name: c.name,
  depot: { lat: c.depotLat, lng: c.depotLng },
  shiftStart: c.shiftStart,
  shiftEnd: c.shiftEnd,
  hasPlatform: !!c.platform,
})

export const toPlanItem = (i: ItemInfo): PlanItem => ({
  id: String(i.itemId),
  lat: i.lat,
  lng: i.lng,
  serviceMinutes: i.serviceMinutes,
  window: i.window ?? undefined,
  needsPlatform: i.needsPlatform,
  priority: i.priority,
})
