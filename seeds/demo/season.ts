// The demo's season (issue 15): each client's install and take-down windows around its switch-on
// and switch-off dates, commissioning records for strings that went up this season (one hung low
// over a footway, so its warning shows), a few strings still in store awaiting installation, a few
// installed and awaiting switch-on, and last season's take-downs: two on the repair list, one in its
// bin. Invented names and numbers only.
import type { Db } from '../../server/db'
import { rng } from './geo'
import { isoDay } from '../../shared/iso-time'

const D = 86_400_000

export async function seedSeason(db: Db, now: Date, crewUser: { id: number; crewId: number | null }) {
  // Its own random stream, so the rest of the demo draws what it drew before the season existed.
  const r = rng(20261203)
  const t = now.getTime()
  const day = (n: number) => isoDay(t + n * D)
  for (const c of await db('clients').select('id', 'seasonEnd')) {
    const off = Date.parse(`${c.seasonEnd}T00:00:00Z`)
    await db('clients')
      .where({ id: c.id })
      .update({
        installFrom: day(-55),
        installTo: day(2),
        takeDownFrom: isoDay(off + D),
        takeDownTo: isoDay(off + 21 * D),
      })
  }
  // Lit strings only, from the end of the register (the gardens' festoons and motifs).
  const lit: { id: number; assetTag: string; lampsOut: number; status: string; installedOn: string }[] =
    await db('strings')
      .where('status', 'lit')
      .orderBy('id', 'desc')
      .limit(40)
      .select('id', 'assetTag', 'lampsOut', 'status', 'installedOn')
  const [store, installed, repair, down, commissioned] = [
    lit.slice(0, 3),
    lit.slice(3, 6),
    lit.slice(6, 8),
    lit.slice(8, 9),
    lit.slice(9, 24),
  ]
  const readings = (i: number) => ({
    ratedMa: 30,
    rcdType: 'general',
    tripMsAt1x: r.int(16, 32),
    tripMsAt5x: r.int(9, 19),
    testVolts: 500,
    megohms: 40 + r.int(0, 160) + (i % 3),
    circuitVolts: 230,
  })
  const rows = []
  for (const [i, s] of [...commissioned, ...installed].entries()) {
    const low = i === 4
    const at = installed.includes(s) ? new Date(t - r.int(1, 3) * D) : new Date(`${s.installedOn}T10:00:00Z`)
    rows.push({
      idempotencyKey: `demo-commissioning-${s.id}`,
      kind: 'commissioning',
      stringId: s.id,
      userId: crewUser.id,
      crewId: crewUser.crewId,
      doneAt: at,
      place: i % 2 ? 'carriageway' : 'footway',
      mountingHeightM: low ? 3.2 : i % 2 ? 5.6 : 4.1,
      readings: JSON.stringify(readings(i)),
      lampsOut: i % 5 === 0 ? 1 : 0,
      result: low ? 'advisory' : 'pass',
      findings: JSON.stringify(
        low
          ? [
              {
                code: 'clearance_low',
                level: 'advisory',
                text: "Mounted at 3.2 m over the footway: below the 3.5 m minimum (one highway authority's conditions). Raise it or agree the height with the highway authority.",
              },
            ]
          : [],
      ),
    })
  }
  if (rows.length) await db('commissionings').insert(rows)
  const ids = (list: { id: number }[]) => list.map((s) => s.id)
  await db('strings').whereIn('id', ids(store)).update({ seasonState: 'in_store', storeBin: 'Depot B-14' })
  await db('strings').whereIn('id', ids(installed)).update({ seasonState: 'installed' })
  // Last January's take-downs: two marked for repair, one back in its bin.
  const lastJan = new Date(Date.UTC(now.getUTCFullYear() - (now.getUTCMonth() >= 6 ? 0 : 1), 0, 14, 11))
  const takeDowns = [...repair, ...down].map((s, i) => ({
    idempotencyKey: `demo-take-down-${s.id}`,
    stringId: s.id,
    userId: crewUser.id,
    crewId: crewUser.crewId,
    doneAt: lastJan,
    lampsOut: [3, 5, 0][i],
    damage: ['Two lampholders cracked, water inside', 'Cable sheath split near the plug', null][i],
    cable: (['worn', 'damaged', 'good'] as const)[i],
    connectors: (['damaged', 'worn', 'good'] as const)[i],
    storeBin: [`Depot R-0${i + 1}`, `Depot R-0${i + 1}`, 'Depot C-07'][i],
    forRepair: i < 2,
  }))
  if (takeDowns.length) await db('takeDowns').insert(takeDowns)
  for (const td of takeDowns)
    await db('strings')
      .where({ id: td.stringId })
      .update({ seasonState: td.forRepair ? 'needs_repair' : 'taken_down', storeBin: td.storeBin })
  return { commissioned: rows.length, inStore: store.length, repairs: repair.length }
}
