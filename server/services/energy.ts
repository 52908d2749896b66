// Energy per client, site and string type: each string's watts from the engine (its lamps out
// included) × the client's burning hours a night × the days of the season, priced at its tariff.
import type { Db } from '../db'
import { energyUse, stringLoad } from '../../shared/engine/index'
import { conditionOf, engineInput } from '../../shared/string-status'
import { burnHoursPerDay, seasonNights } from '../../shared/schedule'
import { loadType, type StringType } from './strings'

interface Acc {
  strings: number
  watts: number
}
const add = (m: Map<string, Acc>, k: string, w: number) => {
  const a = m.get(k) ?? { strings: 0, watts: 0 }
  a.strings++
  a.watts += w
  m.set(k, a)
}

export async function energyReport(db: Db, now = new Date()) {
  const clients = await db('clients').orderBy('name').select('*')
  const strings = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .select(
      's.id',
      's.typeId',
      's.lampsOut',
      's.fuseFailed',
      's.dark',
      's.isolated',
      's.lampAgeHours',
      'si.id as siteId',
      'si.name as siteName',
      'si.clientId',
    )
  const types = new Map<number, StringType>()
  for (const id of new Set(strings.map((s) => s.typeId as number))) types.set(id, await loadType(db, id))
  return {
    generatedAt: now.toISOString(),
    clients: clients.map((c) => {
      const burn = burnHoursPerDay(c.switchOn, c.switchOff)
      const seasonDays = seasonNights(c.seasonStart, c.seasonEnd) ?? 0
      const bySite = new Map<string, Acc>()
      const byType = new Map<string, Acc>()
      const siteNames = new Map<string, string>()
      let total = 0
      let count = 0
      for (const s of strings.filter((x) => x.clientId === c.id)) {
        const type = types.get(s.typeId)!
        const watts = s.isolated
          ? 0
          : stringLoad({
              ...engineInput(type, conditionOf(s), type.supplyVolts),
              technology: type.technology,
            }).watts
        add(bySite, String(s.siteId), watts)
        add(byType, type.code, watts)
        siteNames.set(String(s.siteId), s.siteName)
        total += watts
        count++
      }
      const use = (w: number) => energyUse(w, burn, seasonDays, c.tariffPerKwh)
      return {
        id: c.id,
        name: c.name,
        tariffPerKwh: c.tariffPerKwh,
        switchOn: c.switchOn,
        switchOff: c.switchOff,
        burnHoursPerDay: burn,
        seasonStart: c.seasonStart ?? null,
        seasonEnd: c.seasonEnd ?? null,
        seasonDays,
        strings: count,
        ...use(total),
        sites: [...bySite]
          .map(([id, a]) => ({
            id: Number(id),
            name: siteNames.get(id)!,
            strings: a.strings,
            ...use(a.watts),
          }))
          .sort((a, b) => b.watts - a.watts),
        types: [...byType]
          .map(([code, a]) => {
            const t = [...types.values()].find((x) => x.code === code)!
            return { code, name: t.name, technology: t.technology, strings: a.strings, ...use(a.watts) }
          })
          .sort((a, b) => b.watts - a.watts),
      }
    }),
  }
}
