import { jsonColumn, type Db } from '../db'
import { lineOf } from './strings'
import { notFound } from '../errors'
import type { StringDetail } from '../../shared/schemas/strings'
import { burnHoursPerDay } from '../../shared/schedule'
import { photoUrls } from './photo-urls'
import { typeOf, typeStampColumns, type TypeStamp } from './type-cache'
import { exposureNow, stringAssessment, stringForecastRequest } from './string-engine'
import { cachedForecast } from './forecast-cache'
import { iso, isoOrNull } from '../../shared/iso-time'
import { localDay } from '../../shared/local-time'
import { config } from '../config'

/**
 * The string's site and client, circuit (with its supply point) and structure: one row, one statement
 * (the circuit and structure columns are null when the string has none); and its type, kept per
 * process under the stamp read in that row (type-cache.ts).
 */
async function placeOf(
  db: Db,
  s: { siteId: number; typeId: number; circuitId: number | null; structureId: number | null },
) {
  const r = await db('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .join('stringTypes as st', 'st.id', db.raw('?', [s.typeId]))
    .leftJoin('circuits as ci', 'ci.id', db.raw('?', [s.circuitId]))
    .leftJoin('supplyPoints as sp', 'sp.id', 'ci.supplyPointId')
    .leftJoin('structures as x', 'x.id', db.raw('?', [s.structureId]))
    .where('si.id', s.siteId)
    .first(
      'si.id',
      'si.name',
      'si.clientId',
      'c.name as clientName',
      'si.accessNote',
      'c.switchOn',
      'c.switchOff',
      'c.timeZone',
      'ci.id as circuitId',
      'ci.ref as circuitRef',
      'ci.breakerAmps',
      'ci.breakerCurve',
      'ci.rcdMa',
      'ci.supplyVolts',
      'sp.name as supplyPoint',
      'sp.ref as supplyPointRef',
      'x.id as structureId',
      'x.kind as structureKind',
      'x.ref as structureRef',
      'x.approvedLoad',
      ...typeStampColumns('st'),
    )
  if (!r) throw notFound('Site')
  const circuit =
    r.circuitId == null
      ? null
      : {
          id: r.circuitId as number,
          ref: r.circuitRef,
          breakerAmps: r.breakerAmps,
          breakerCurve: r.breakerCurve,
          rcdMa: r.rcdMa ?? null,
          supplyVolts: r.supplyVolts,
          supplyPoint: r.supplyPoint,
          supplyPointRef: r.supplyPointRef,
        }
  const structure =
    r.structureId == null
      ? null
      : {
          id: r.structureId as number,
          kind: r.structureKind,
          ref: r.structureRef,
          approvedLoad: r.approvedLoad ?? null,
        }
  return { site: r, circuit, structure, type: await typeOf(db, r as TypeStamp) }
}

/** The string page; `row` is the strings row as read (the estate's editable fields come from it). */
export async function stringDetailAndRow(db: Db, id: number, now = new Date()) {
  const s = await db('strings').where({ id }).first()
  if (!s) throw notFound('String')
  const { site, circuit, structure, type } = await placeOf(db, s)
  const certificates = await db('certificates')
    .where((w) => {
      w.where({ subjectType: 'string', subjectId: id })
      if (structure) w.orWhere({ subjectType: 'structure', subjectId: structure.id })
      if (circuit) w.orWhere({ subjectType: 'circuit', subjectId: circuit.id })
    })
    .orderBy('doneOn', 'desc')
    .select('id', 'kind', 'reference', 'doneOn', 'nextDue', 'result')
  // Each visit's photos in the same statement, as a JSON list of ids.
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
      'v.brightLamps',
      'v.statusAfter',
      'v.notes',
      'v.isolationId',
      'v.kind',
      {
        photoIds: db('photos as p')
          .whereRaw('p.visit_id = v.id')
          .select(db.raw('json_arrayagg(p.id order by p.id)')),
      },
    )
  const burn = burnHoursPerDay(site.switchOn, site.switchOff)
  const assessed = stringAssessment(type, s)
  // The risk rule is judged by the forecast job, not by assess: its reason says which rule fired.
  const assessment =
    s.replaceRule === 'risk' && s.riskNote
      ? {
          ...assessed,
          reasons: [
            ...assessed.reasons,
            {
              code: 'replace_risk' as const,
              text: `Replace now: ${String(s.riskNote).replace(/^forecast: /, 'the forecast gives a ')}.`,
            },
          ],
        }
      : assessed
  // Kept per process by the engine's input: an unchanged string is not simulated again.
  const fc = cachedForecast(
    stringForecastRequest(type, s, {
      burnHoursPerDay: burn,
      // The client's own zone (zones.ts), read with the site rather than again.
      startDate: localDay(now, site.timeZone || config.APP_TIME_ZONE),
      now,
    }),
  )
  // Age and exposure as stored at the last change of state, plus the hours burned since.
  const age = exposureNow(type, s, burn, now)
  const detail: StringDetail = {
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
    line: lineOf(s.line),
    installedOn: s.installedOn ?? null,
    seasonState: s.seasonState,
    storeBin: s.storeBin ?? null,
    lampAgeHours: Math.round(age.lampAgeHours),
    lampExposure: age.lampExposure.map((x) => Math.round(x)),
    exposureAt: isoOrNull(s.exposureAt),
    replaceRule: s.replaceRule ?? null,
    riskNote: s.riskNote ?? null,
    lastVisitAt: isoOrNull(s.lastVisitAt),
    type,
    site: {
      id: site.id,
      name: site.name,
      clientId: site.clientId,
      clientName: site.clientName,
      accessNote: site.accessNote ?? null,
    },
    schedule: { switchOn: site.switchOn, switchOff: site.switchOff, burnHoursPerDay: burn },
    circuit,
    structure,
    certificates: certificates.map((c) => ({
      ...c,
      reference: c.reference ?? null,
      nextDue: c.nextDue ?? null,
    })),
    assessment,
    forecast: fc,
    forecastDates: { firstFailure: fc.dates?.failures[0] ?? null, dark: fc.dates?.medianDark ?? null },
    visits: visits.map(({ photoIds, ...v }) => ({
      ...v,
      visitedAt: iso(v.visitedAt),
      fuseReplaced: !!v.fuseReplaced,
      darkOnArrival: !!v.darkOnArrival,
      notes: v.notes ?? null,
      isolationId: v.isolationId ?? null,
      photos: jsonColumn<number[]>(photoIds, []).map((p) => ({ id: p, ...photoUrls(p) })),
    })),
  }
  return { detail, row: s as Record<string, unknown> }
}

export async function stringDetail(db: Db, id: number, now = new Date()): Promise<StringDetail> {
  return (await stringDetailAndRow(db, id, now)).detail
}
