// Energy per client, site and string type: each string's watts from the engine (its lamps out
// included) × the client's burning hours a night × the days of the season, priced at its tariff.
import type { Db } from '../db'
import { energyUse, stringLoad } from '../../shared/engine/index'
import { conditionOf, engineInput } from '../../shared/string-status'
import { burnHoursPerDay, seasonNights } from '../../shared/schedule'
import { loadType, type StringType } from './strings'
import { badRequest, notFound } from '../errors'
import type { LedWhatIf, LedWhatIfQuery } from '../../shared/schemas/energy'

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

type Load = { strings: number; watts: number }
const healthy = { lampsOut: 0, fuseFailed: false, dark: false, isolated: false }
/** Watts (billed) and volt-amps (carried) of one string as recorded; an isolated one is off. */
function loadOf(type: StringType, s: Parameters<typeof conditionOf>[0]) {
  if (s.isolated) return { watts: 0, voltAmps: 0 }
  const load = stringLoad({
    ...engineInput(type, conditionOf(s), type.supplyVolts),
    technology: type.technology,
  })
  return { watts: load.watts, voltAmps: load.runningAmps * type.supplyVolts }
}

/**
 * LED what-if for one client: every filament string swapped one for one for a new, healthy string of
 * the chosen LED type, the season's kWh and cost beside today's. Isolated strings stay off on both
 * sides; the client's LED strings are left out of both (they would not change).
 */
export async function ledWhatIf(db: Db, query: LedWhatIfQuery): Promise<LedWhatIf> {
  const c = await db('clients').where({ id: query.clientId }).first()
  if (!c) throw notFound('Client')
  const ledTypes = await db('stringTypes')
    .where({ technology: 'led' })
    .whereNull('archivedAt')
    .orderBy('code')
    .select('id', 'code', 'name')
  const chosenId = query.typeId ?? ledTypes[0]?.id
  const led = chosenId === undefined ? null : await loadType(db, chosenId)
  if (led && led.technology !== 'led')
    throw badRequest('not_led_type', `${led.name} is not an LED type: choose one of the LED string types.`)
  const strings = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .where('si.clientId', c.id)
    .select('s.typeId', 's.lampsOut', 's.fuseFailed', 's.dark', 's.isolated')
  const types = new Map<number, StringType>()
  for (const id of new Set(strings.map((s) => s.typeId as number))) types.set(id, await loadType(db, id))
  const one = led ? loadOf(led, healthy) : { watts: 0, voltAmps: 0 }
  const byType = new Map<number, { today: Load; relamped: Load }>()
  let isolated = 0
  let ledAlready = 0
  for (const s of strings) {
    const type = types.get(s.typeId)!
    if (type.technology === 'led') {
      ledAlready++
      continue
    }
    const row = byType.get(type.id) ?? { today: { strings: 0, watts: 0 }, relamped: { strings: 0, watts: 0 } }
    row.today.strings++
    row.relamped.strings++
    row.today.watts += loadOf(type, s).watts
    if (s.isolated) isolated++
    else row.relamped.watts += one.watts
    byType.set(type.id, row)
  }
  const burn = burnHoursPerDay(c.switchOn, c.switchOff)
  const seasonDays = seasonNights(c.seasonStart, c.seasonEnd) ?? 0
  const use = (w: number) => energyUse(w, burn, seasonDays, c.tariffPerKwh)
  const rows = [...byType].map(([id, r]) => ({ type: types.get(id)!, ...r }))
  const sum = (k: 'today' | 'relamped') => rows.reduce((w, r) => w + r[k].watts, 0)
  return {
    clientId: c.id,
    clientName: c.name,
    tariffPerKwh: c.tariffPerKwh,
    burnHoursPerDay: burn,
    seasonDays,
    ledTypes,
    type: led ? { id: led.id, code: led.code, name: led.name, ...one } : null,
    strings: rows.reduce((n, r) => n + r.today.strings, 0),
    isolated,
    ledStringsAlready: ledAlready,
    today: use(sum('today')),
    relamped: use(sum('relamped')),
    byType: rows
      .map((r) => ({
        code: r.type.code,
        name: r.type.name,
        strings: r.today.strings,
        today: use(r.today.watts),
        relamped: use(r.relamped.watts),
      }))
      .sort((a, b) => b.today.watts - a.today.watts),
  }
}
