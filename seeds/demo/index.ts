// The invented demo scenario: the town of Wrenfold and Larkspur Hall Gardens, placed relative to
// `now` so every screen has fresh data whenever the demo starts. It refuses a database with users
// unless told to wipe it.
import type { Db } from '../../server/db'
import { exposureAfter, stateColumns, stringStatus, type TypeSpec } from '../../shared/string-status'
import { rng } from './geo'
import { seedPeople } from './people'
import { seedClientsAndTypes, seedPlaces } from './places'
import { seedCertificates, seedVisits } from './history'
import { seedReports } from './reports'
import { seedSeason } from './season'
import { typeDefs } from '../../shared/lamp-catalogue'
import { refreshQueue } from '../../server/jobs/refresh-queue'
import { listQueue } from '../../server/services/queue/list'
import { proposePlan, publishRuns } from '../../server/services/runs'
import { loadConfig } from '../../server/config'
import { DEMO_SETTINGS } from '../../server/services/demo-settings'
import { demoAccounts, DEMO_PASSWORD } from './accounts'
import { demoBasemap } from './basemap'
import { isoDay } from '../../shared/iso-time'
import { seedStock } from './stock'

/** What the server shows in demo mode only: the sign-in page's accounts and the drawn streets. */
async function saveDemoSettings(db: Db) {
  const accounts = demoAccounts.map(({ email, role, name }) => ({ email, role, name }))
  await db('settings').insert([
    { key: DEMO_SETTINGS.accounts, value: JSON.stringify({ accounts, password: DEMO_PASSWORD }) },
    { key: DEMO_SETTINGS.basemap, value: JSON.stringify(demoBasemap()) },
  ])
}

async function emptyAll(db: Db) {
  // Every table of the schema but the migrations' own, so a table added later is emptied too.
  const [rows] = await db.raw(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' AND table_name NOT LIKE 'knex\\_migrations%'",
  )
  const tables = (rows as { t: string }[]).map((r) => r.t)
  await db.raw('SET FOREIGN_KEY_CHECKS = 0')
  try {
    for (const t of tables) await db.raw('TRUNCATE TABLE ??', [t])
  } finally {
    await db.raw('SET FOREIGN_KEY_CHECKS = 1')
  }
}

/**
 * Loads the demo into a database with no users. `wipe` (only the test database, benchmarks and the
 * confirmed demo reset) empties every table first, whatever it holds.
 */
export async function seedDemo(db: Db, now: Date, opts: { wipe?: boolean } = {}) {
  if (!opts.wipe && (await db('users').first('id')))
    throw new Error(
      'This database holds users: the demo loads only into a fresh one, so nothing was changed.',
    )
  const r = rng(20261201)
  await emptyAll(db)
  const { crewIds, users } = await seedPeople(db)
  const { clientIds, typeIds } = await seedClientsAndTypes(db, now)
  const planned = await seedPlaces(db, r, clientIds)
  const specs = Object.fromEntries(typeDefs.map((t) => [t.code, t as TypeSpec]))

  const rows = []
  for (const p of planned) {
    let structureId: number | null = null
    if (p.structureRef) {
      ;[structureId] = await db('structures').insert({
        siteId: p.siteId,
        kind: p.structureRef.startsWith('COL') ? 'column' : 'anchor',
        ref: p.structureRef,
        lat: p.geometry === 'line' && p.line ? p.line[0][1] : p.lat,
        lng: p.geometry === 'line' && p.line ? p.line[0][0] : p.lng,
        approvedLoad: p.structureRef.startsWith('COL')
          ? 'One motif up to 25 kg, 0.6 m² wind area'
          : 'Catenary wire, 6 kN proof load',
      })
    }
    const spec = specs[p.typeCode]
    const filament = typeDefs.find((t) => t.code === p.typeCode)!.technology === 'filament'
    const roll = r.next()
    const cond = { lampsOut: 0, fuseFailed: false, dark: false, isolated: false }
    if (roll < 0.16) cond.lampsOut = 1
    else if (roll < 0.22) cond.lampsOut = filament ? r.int(2, 4) : r.int(2, 6)
    else if (roll < 0.25 && filament) cond.fuseFailed = true
    else if (roll < 0.26) cond.isolated = true
    const assessed = stringStatus(spec, cond)
    const installedOn = isoDay(now.getTime() - (40 + r.int(0, 10)) * 86_400_000)
    // A few strings carry last season's lamps, near their rated life: the forecast should notice.
    const lampAgeHours = filament ? (r.chance(0.03) ? r.int(1300, 1500) : r.int(0, 600)) : r.int(0, 8000)
    // Their exposure: those hours at the ratio the lamps burn at now (fuse lamp intact), h × r^d.
    const lit = { lampsOut: cond.lampsOut, fuseFailed: false, dark: false, isolated: false }
    const exposure = exposureAfter(
      spec,
      lit,
      spec.classes.map(() => 0),
      lampAgeHours,
    )
    rows.push({
      assetTag: p.assetTag,
      name: p.name,
      typeId: typeIds[p.typeCode],
      siteId: p.siteId,
      circuitId: p.circuitId,
      structureId,
      geometry: p.geometry,
      lat: p.lat,
      lng: p.lng,
      line: p.line ? JSON.stringify(p.line) : null,
      installedOn,
      lampAgeHours,
      lampExposure: JSON.stringify(exposure.map((x) => Math.round(x * 100) / 100)),
      exposureAt: now,
      ...stateColumns(cond, assessed),
    })
  }
  for (let i = 0; i < rows.length; i += 200) await db('strings').insert(rows.slice(i, i + 200))

  const strings = await db('strings as s')
    .join('stringTypes as t', 't.id', 's.typeId')
    .select('s.id', 's.lat', 's.lng', 't.technology')
  const crewRoster = (Object.values(crewIds) as number[]).map((crewId) => ({
    crewId,
    userIds: users.filter((u) => u.crewId === crewId).map((u) => u.id),
  }))
  const visits = await seedVisits(
    db,
    r,
    now,
    strings.map((s) => ({ stringId: s.id, lat: s.lat, lng: s.lng, shunted: s.technology === 'filament' })),
    crewRoster,
  )
  await seedStock(db)
  const safety = users.find((u) => u.role === 'safety')!
  const certificates = await seedCertificates(db, r, now, safety.id)
  const reports = await seedReports(db, now)
  await seedClosedFaults(db, r)
  await seedSeason(
    db,
    now,
    users.find((u) => u.role === 'crew')!,
  )
  await refreshQueue(db, now)
  await backdateQueue(db, r, now)
  await publishTonight(db, now, users.find((u) => u.role === 'supervisor')!.id)
  await saveDemoSettings(db)
  return { strings: rows.length, visits, certificates, reports }
}

/** Faults were found over the last two days, not all at seed time: some are past their contract clock. */
async function backdateQueue(db: Db, r: ReturnType<typeof rng>, now: Date) {
  const items = await db('queueItems as q')
    .join('clients as c', 'c.id', 'q.clientId')
    .whereIn('q.kind', ['replace_now', 'dark'])
    .where('q.state', 'open')
    .select('q.id', 'q.severity', 'c.responseEmergencyHours', 'c.responseStandardHours')
  for (const it of items) {
    const openedAt = new Date(now.getTime() - r.int(2, 44) * 3_600_000)
    const hours = it.severity === 'emergency' ? it.responseEmergencyHours : it.responseStandardHours
    await db('queueItems')
      .where({ id: it.id })
      .update({ openedAt, dueBy: new Date(openedAt.getTime() + hours * 3_600_000) })
  }
}

/** Tonight's runs, planned and published by the demo supervisor, so crews open the app to real work. */
async function publishTonight(db: Db, now: Date, supervisorId: number) {
  const date = isoDay(now)
  const items = (await listQueue(db, { state: 'open' }, now)).filter((i) => i.lat !== null).slice(0, 14)
  const crews = (await db('crews').select('id')).map((c) => c.id as number)
  const plan = await proposePlan(db, { date, crewIds: crews, itemIds: items.map((i) => i.id), pins: [] })
  const runs = plan.runs.map((r) => ({ crewId: r.crewId, itemIds: r.stops.map((s) => s.itemId!) }))
  // Seeding sends no e-mail: the crews "already had" tonight's sheets.
  const silent = { send: async () => ({ id: 0, sent: false }) }
  await publishRuns(db, silent, loadConfig(), supervisorId, { date, runs })
}

/** The season so far as the queue saw it: each relamp closed a fault found some hours earlier. */
async function seedClosedFaults(db: Db, r: ReturnType<typeof rng>) {
  const relamps = await db('visits as v')
    .join('strings as s', 's.id', 'v.stringId')
    .join('sites as si', 'si.id', 's.siteId')
    .where('v.replaced', '>', 0)
    .select('v.id', 'v.visitedAt', 'v.replaced', 's.id as stringId', 's.assetTag', 's.siteId', 'si.clientId')
  const rows = relamps.map((v) => {
    const closedAt = new Date(v.visitedAt)
    // Most faults are fixed within the 36 h standard response; a few ran late.
    const openedAt = new Date(closedAt.getTime() - (r.chance(0.9) ? r.int(2, 30) : r.int(37, 50)) * 3_600_000)
    return {
      kind: 'replace_now',
      openKey: null,
      stringId: v.stringId,
      siteId: v.siteId,
      clientId: v.clientId,
      severity: 'standard',
      state: 'closed',
      openedAt,
      dueBy: new Date(openedAt.getTime() + 36 * 3_600_000),
      closedAt,
      closedByVisitId: v.id,
      summary: `${v.assetTag}: ${v.replaced} lamps out`,
    }
  })
  for (let i = 0; i < rows.length; i += 200) await db('queueItems').insert(rows.slice(i, i + 200))
}
