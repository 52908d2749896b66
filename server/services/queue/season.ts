// Season work in the queue, from each client's windows:
//   - installation: one item per string still in store once its client's install window has opened,
//     due by the end of the window (or the switch-on date when no end is set);
//   - take-down: one item per site (a whole site comes down in one job for the planner) once the
//     take-down window has opened and the site still has strings up, due by the end of the window.
// An item closes when its string is installed or the site's last string is down. Run in the
// transaction of the record that causes it, and in every refresh.
import type { Db } from '../../db'
import { closeItems, openItems, ACTIVE, type OpenItem } from './items'
import { endOfLocalDay, localDay } from '../../../shared/local-time'
import { config } from '../../config'

export const SEASON_KINDS = ['installation', 'take_down'] as const
/** States of a string that is up on the street. */
export const UP_STATES = ['installed', 'in_service'] as const

interface SiteRow {
  siteId: number
  siteName: string
  clientId: number
  timeZone: string | null
  installFrom: string | null
  installTo: string | null
  takeDownFrom: string | null
  takeDownTo: string | null
  seasonStart: string | null
}

/** Brings installation and take-down items in step, for every site or only `siteIds`. */
export async function syncSeasonItems(db: Db, now = new Date(), siteIds?: number[]) {
  if (siteIds && !siteIds.length) return
  const sq = db('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .whereNull('si.archivedAt')
    .select(
      'si.id as siteId',
      'si.name as siteName',
      'c.id as clientId',
      'c.timeZone',
      'c.installFrom',
      'c.installTo',
      'c.takeDownFrom',
      'c.takeDownTo',
      'c.seasonStart',
    )
  if (siteIds) sq.whereIn('si.id', siteIds)
  const sites: SiteRow[] = await sq
  const open = new Map(sites.map((s) => [s.siteId, s]))
  // Strings in store one by one (each may need its installation); those up only counted per site.
  const strings = await db('strings')
    .whereNull('archivedAt')
    .where('seasonState', 'in_store')
    .modify((q) => {
      if (siteIds) q.whereIn('siteId', siteIds)
    })
    .select('id', 'assetTag', 'name', 'siteId', 'seasonState')
  const upRows: { siteId: number; n: unknown }[] = await db('strings')
    .whereNull('archivedAt')
    .whereIn('seasonState', [...UP_STATES])
    .modify((q) => {
      if (siteIds) q.whereIn('siteId', siteIds)
    })
    .groupBy('siteId')
    .select('siteId')
    .count({ n: '*' })
  const wanted = new Set<string>()
  const upBySite = new Map(upRows.filter((r) => open.has(r.siteId)).map((r) => [r.siteId, Number(r.n)]))
  const items: OpenItem[] = []
  // Working out a zone's today is slow (tens of microseconds): once per zone, not per string.
  const todays = new Map<string, string>()
  const todayIn = (zone: string) => todays.get(zone) ?? todays.set(zone, localDay(now, zone)).get(zone)!
  for (const s of strings) {
    const site = open.get(s.siteId)
    if (!site) continue
    const zone = site.timeZone || config.APP_TIME_ZONE
    const today = todayIn(zone)
    if (!site.installFrom || today < site.installFrom) continue
    const subject = `string:${s.id}`
    wanted.add(`installation:${subject}`)
    const by = site.installTo ?? site.seasonStart
    items.push({
      kind: 'installation',
      subject,
      severity: 'standard',
      stringId: s.id,
      siteId: s.siteId,
      clientId: site.clientId,
      dueBy: by ? endOfLocalDay(by, zone) : undefined,
      summary: `Install and commission ${s.assetTag} ${s.name}`,
    })
  }
  for (const [siteId, up] of upBySite) {
    const site = open.get(siteId)!
    const zone = site.timeZone || config.APP_TIME_ZONE
    if (!site.takeDownFrom || todayIn(zone) < site.takeDownFrom) continue
    const subject = `site:${siteId}`
    wanted.add(`take_down:${subject}`)
    items.push({
      kind: 'take_down',
      subject,
      severity: 'standard',
      siteId,
      clientId: site.clientId,
      dueBy: site.takeDownTo ? endOfLocalDay(site.takeDownTo, zone) : undefined,
      summary: `Take down ${up} string${up === 1 ? '' : 's'} at ${site.siteName}`,
    })
  }
  await openItems(db, items, now)
  const active = (await db('queueItems as q')
    .leftJoin('strings as s', 's.id', 'q.stringId')
    .whereIn('q.kind', SEASON_KINDS)
    .whereIn('q.state', ACTIVE)
    .modify((q) => {
      if (siteIds)
        q.whereRaw(`coalesce(q.site_id, s.site_id) in (${siteIds.map(() => '?').join(',')})`, siteIds)
    })
    .select('q.id', 'q.openKey')) as { id: number; openKey: string }[]
  const done = active.filter((i) => !wanted.has(i.openKey)).map((i) => i.id as number)
  await closeItems(db, done, { now, reason: 'Season work recorded' })
}

/** One site's season items, in the caller's transaction (after a commissioning or take-down). */
export const syncSeasonItemsOf = (db: Db, siteId: number, now = new Date()) =>
  syncSeasonItems(db, now, [siteId])
