import type { Db } from '../db'
import { notFound } from '../errors'
import type { MapItem, StringDetail } from '../../shared/schemas/strings'
import { engineInput, type StringStatus, type TypeSpec } from '../../shared/string-status'
import { forecast } from '../../shared/engine/forecast'
import { assess } from '../../shared/engine/assess'
import { burnHoursPerDay } from '../../shared/schedule'
import { photoUrls } from './photo-urls'

const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : d == null ? null : String(d))
const parseLine = (v: unknown) =>
  (v == null ? null : typeof v === 'string' ? JSON.parse(v) : v) as [number, number][] | null

export async function listForMap(
  db: Db,
  q: { bbox?: [number, number, number, number]; q?: string; status?: StringStatus; limit: number },
): Promise<{ items: MapItem[]; truncated: boolean }> {
  const query = db('strings as s').select(
    's.id',
    's.assetTag',
    's.name',
    's.lat',
    's.lng',
    's.status',
    's.lampsOut',
    's.replaceNow',
    's.line',
  )
  if (q.bbox) {
    const [minLng, minLat, maxLng, maxLat] = q.bbox
    query.whereBetween('s.lat', [minLat, maxLat]).whereBetween('s.lng', [minLng, maxLng])
  }
  if (q.status) query.where('s.status', q.status)
  if (q.q) {
    const like = `%${q.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`
    query
      .join('sites as site', 'site.id', 's.siteId')
      .where((w) =>
        w
          .where('s.assetTag', 'like', like)
          .orWhere('site.name', 'like', like)
          .orWhere('s.name', 'like', like),
      )
  }
  const rows = await query.orderBy('s.id').limit(q.limit + 1)
  const truncated = rows.length > q.limit
  return {
    truncated,
    items: rows
      .slice(0, q.limit)
      .map((r) => ({ ...r, replaceNow: Boolean(r.replaceNow), line: parseLine(r.line) })),
  }
}

export async function findByTag(db: Db, tag: string) {
  const r = await db('strings').where({ assetTag: tag.toUpperCase() }).first('id', 'assetTag')
  if (!r) throw notFound(`String ${tag}`)
  return r as { id: number; assetTag: string }
}

export async function loadType(db: Db, typeId: number) {
  const t = await db('stringTypes').where({ id: typeId }).first()
  if (!t) throw notFound('String type')
  const classes = await db('lampClasses')
    .where({ stringTypeId: typeId })
    .orderBy('position')
    .select('label', 'count', 'ratedVolts', 'ratedAmps', 'shunted')
  return { ...t, classes: classes.map((c) => ({ ...c, shunted: Boolean(c.shunted) })) } as TypeSpec &
    StringDetail['type'] & { id: number }
}

/** The engine's forecast for a string as recorded now; seeded by the string's id so it is stable. */
export function stringForecast(
  type: Awaited<ReturnType<typeof loadType>>,
  s: {
    id: number
    lampsOut: number
    fuseFailed: boolean
    dark: boolean
    isolated: boolean
    lampAgeHours: number
  },
  supplyVolts: number,
  burnHours: number,
  startDate: string,
  trials = 2000,
) {
  const input = engineInput(type, s, supplyVolts)
  return forecast({
    ...input,
    ratedLifeHours: type.ratedLifeHours,
    weibullShape: type.weibullShape,
    lampAgeHours: s.lampAgeHours,
    shuntFailProbability: type.shuntFailProbability,
    burnHoursPerDay: burnHours,
    startDate,
    trials,
    seed: s.id,
  })
}

export async function stringDetail(db: Db, id: number, now = new Date()): Promise<StringDetail> {
  const s = await db('strings').where({ id }).first()
  if (!s) throw notFound('String')
  const type = await loadType(db, s.typeId)
  const site = await db('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .where('si.id', s.siteId)
    .first(
      'si.id',
      'si.name',
      'si.clientId',
      'c.name as clientName',
      'si.accessNote',
      'c.switchOn',
      'c.switchOff',
    )
  const circuit = s.circuitId
    ? await db('circuits as ci')
        .join('supplyPoints as sp', 'sp.id', 'ci.supplyPointId')
        .where('ci.id', s.circuitId)
        .first(
          'ci.id',
          'ci.ref',
          'ci.breakerAmps',
          'ci.breakerCurve',
          'ci.rcdMa',
          'ci.supplyVolts',
          'sp.name as supplyPoint',
          'sp.ref as supplyPointRef',
        )
    : null
  const structure = s.structureId
    ? await db('structures').where({ id: s.structureId }).first('id', 'kind', 'ref', 'approvedLoad')
    : null
  const certificates = await db('certificates')
    .where((w) => {
      w.where({ subjectType: 'string', subjectId: id })
      if (structure) w.orWhere({ subjectType: 'structure', subjectId: structure.id })
      if (circuit) w.orWhere({ subjectType: 'circuit', subjectId: circuit.id })
    })
    .orderBy('doneOn', 'desc')
    .select('id', 'kind', 'reference', 'doneOn', 'nextDue', 'result')
  const visits = await db('visits as v')
    .join('users as u', 'u.id', 'v.userId')
    .where('v.stringId', id)
    .orderBy('v.visitedAt', 'desc')
    .limit(50)
    .select(
      'v.id',
      'v.visitedAt',
      'u.name as by',
      'v.failedFound',
      'v.replaced',
      'v.fuseReplaced',
      'v.darkOnArrival',
      'v.statusAfter',
      'v.notes',
      'v.isolationId',
    )
  const photos = visits.length
    ? await db('photos')
        .whereIn(
          'visitId',
          visits.map((v) => v.id),
        )
        .select('id', 'visitId')
    : []
  const burn = burnHoursPerDay(site.switchOn, site.switchOff)
  const cond = {
    id: s.id,
    lampsOut: s.lampsOut,
    fuseFailed: !!s.fuseFailed,
    dark: !!s.dark,
    isolated: !!s.isolated,
    lampAgeHours: s.lampAgeHours,
  }
  // The string's own design supply: a 24 V curtain hangs on a 230 V circuit through its driver.
  const supply = type.supplyVolts
  const assessment = assess(engineInput(type, cond, supply))
  const fc = stringForecast(type, cond, supply, burn, now.toISOString().slice(0, 10))
  return {
    id: s.id,
    assetTag: s.assetTag,
    name: s.name,
    status: s.status,
    lampsOut: s.lampsOut,
    fuseFailed: !!s.fuseFailed,
    dark: !!s.dark,
    isolated: !!s.isolated,
    replaceNow: !!s.replaceNow,
    lat: s.lat,
    lng: s.lng,
    line: parseLine(s.line),
    installedOn: s.installedOn ?? null,
    lampAgeHours: s.lampAgeHours,
    lastVisitAt: iso(s.lastVisitAt),
    type,
    site: {
      id: site.id,
      name: site.name,
      clientId: site.clientId,
      clientName: site.clientName,
      accessNote: site.accessNote ?? null,
    },
    schedule: { switchOn: site.switchOn, switchOff: site.switchOff, burnHoursPerDay: burn },
    circuit: circuit ? { ...circuit, rcdMa: circuit.rcdMa ?? null } : null,
    structure: structure ? { ...structure, approvedLoad: structure.approvedLoad ?? null } : null,
    certificates: certificates.map((c) => ({
      ...c,
      reference: c.reference ?? null,
      nextDue: c.nextDue ?? null,
    })),
    assessment,
    forecast: fc,
    forecastDates: { firstFailure: fc.dates?.failures[0] ?? null, dark: fc.dates?.medianDark ?? null },
    visits: visits.map((v) => ({
      ...v,
      visitedAt: iso(v.visitedAt)!,
      fuseReplaced: !!v.fuseReplaced,
      darkOnArrival: !!v.darkOnArrival,
      notes: v.notes ?? null,
      isolationId: v.isolationId ?? null,
      photos: photos.filter((p) => p.visitId === v.id).map((p) => ({ id: p.id, ...photoUrls(p.id) })),
    })),
  }
}
