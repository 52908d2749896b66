import { jsonColumn, type Db } from '../db'
import { lineOf, type StringType } from './strings'
import { notFound } from '../errors'
import type { StringDetail } from '../../shared/schemas/strings'
import { burnHoursPerDay } from '../../shared/schedule'
import { photoUrls } from './photo-urls'
import { typeOf, typeStampColumns, type TypeStamp } from './type-cache'
import { exposureNow, stringAssessment, stringForecastRequest, type StringRecord } from './string-engine'
import { cachedForecast } from './forecast-cache'
import { outlookOf, storedOutlook, type StoredForecast } from './string-outlook'
import { isoOrNull } from '../../shared/iso-time'
import { localDay } from '../../shared/local-time'
import { config } from '../config'

/** The place columns read beside the strings row, under names no strings column has. */
const PLACE = {
  siteId: 'si.id',
  siteName: 'si.name',
  siteClientId: 'si.clientId',
  clientName: 'c.name',
  accessNote: 'si.accessNote',
  switchOn: 'c.switchOn',
  switchOff: 'c.switchOff',
  timeZone: 'c.timeZone',
  circuitRef: 'ci.ref',
  breakerAmps: 'ci.breakerAmps',
  breakerCurve: 'ci.breakerCurve',
  rcdMa: 'ci.rcdMa',
  supplyVolts: 'ci.supplyVolts',
  supplyPoint: 'sp.name',
  supplyPointRef: 'sp.ref',
  structureKind: 'x.kind',
  structureRef: 'x.ref',
  approvedLoad: 'x.approvedLoad',
} as const
// Named `place…` in the answer (column names come back camelCase, db.ts), so that they part from the
// strings row's own columns.
const PREFIX = 'place'
const aliased = (name: string) => `${PREFIX}${name[0].toUpperCase()}${name.slice(1)}`
/** The type stamp's own names (typeId, typeVersion…), as typeStampColumns gives them. */
const STAMP_NAMES = typeStampColumns('st').map((c) => c.replace(/^.* as /, ''))
const TYPE_STAMP = typeStampColumns('st').map((c) =>
  c.replace(/ as (\w+)$/, (_m, n: string) => ` as ${aliased(n)}`),
)
const ALIASES = new Map(
  [...Object.keys(PLACE), ...STAMP_NAMES, 'certificates', 'visits'].map((n) => [aliased(n), n]),
)

/** Each certificate of the string, its structure or its circuit, newest first, as a JSON list. */
const certificatesJson = (db: Db) =>
  db.raw(`(select json_arrayagg(json_object('id', ce.id, 'kind', ce.kind, 'reference', ce.reference,
      'doneOn', ce.done_on, 'nextDue', ce.next_due, 'result', ce.result) order by ce.done_on desc)
    from certificates ce
    where (ce.subject_type = 'string' and ce.subject_id = s.id)
      or (ce.subject_type = 'structure' and ce.subject_id = s.structure_id)
      or (ce.subject_type = 'circuit' and ce.subject_id = s.circuit_id)) as place_certificates`)

/** The last 50 visits, newest first, each with its photos' ids, as a JSON list. */
const visitsJson = (db: Db) =>
  db.raw(`(select json_arrayagg(json_object('id', v.id, 'visitedAt', date_format(v.visited_at, '%Y-%m-%dT%H:%i:%s.000Z'),
      'by', u.name, 'failedFound', v.failed_found, 'replaced', v.replaced, 'fuseReplaced', v.fuse_replaced,
      'darkOnArrival', v.dark_on_arrival, 'brightLamps', v.bright_lamps, 'statusAfter', v.status_after,
      'notes', v.notes, 'isolationId', v.isolation_id, 'kind', v.kind,
      'photoIds', (select json_arrayagg(p.id order by p.id) from photos p where p.visit_id = v.id))
      order by v.visited_at desc limit ${VISITS_SHOWN})
    from visits v join users u on u.id = v.user_id
    where v.string_id = s.id) as place_visits`)

const VISITS_SHOWN = 50

/**
 * The strings row, its site and client, circuit (with its supply point) and structure, its
 * certificates and its last visits: one statement. The circuit and structure columns are null when the
 * string has none. Its type is kept per process under the stamp read in the same row (type-cache.ts).
 */
async function readString(db: Db, id: number) {
  const r = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .join('stringTypes as st', 'st.id', 's.typeId')
    .leftJoin('circuits as ci', 'ci.id', 's.circuitId')
    .leftJoin('supplyPoints as sp', 'sp.id', 'ci.supplyPointId')
    .leftJoin('structures as x', 'x.id', 's.structureId')
    .where('s.id', id)
    .first(
      's.*',
      ...Object.entries(PLACE).map(([as, col]) => `${col} as ${aliased(as)}`),
      ...TYPE_STAMP,
      certificatesJson(db),
      visitsJson(db),
    )
  if (!r) throw notFound('String')
  // The strings row alone (the estate's editable fields come from it); the rest by its own names.
  const row: typeof r = {}
  const place: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(r)) {
    const name = ALIASES.get(k)
    if (name) place[name] = v
    else row[k] = v
  }
  return { row, place: place as unknown as PlaceRow & TypeStamp }
}

/** The place columns; the circuit's and structure's are read only when the string has one. */
interface PlaceRow {
  siteId: number
  siteName: string
  siteClientId: number
  clientName: string
  accessNote: string | null
  switchOn: string
  switchOff: string
  timeZone: string | null
  circuitRef: string
  breakerAmps: number
  breakerCurve: string
  rcdMa: number | null
  supplyVolts: number
  supplyPoint: string
  supplyPointRef: string
  structureKind: string
  structureRef: string
  approvedLoad: string | null
  certificates: unknown
  visits: unknown
}

interface VisitJson {
  id: number
  visitedAt: string
  by: string
  failedFound: number
  replaced: number
  fuseReplaced: number | boolean
  darkOnArrival: number | boolean
  brightLamps: number
  statusAfter: StringDetail['visits'][number]['statusAfter']
  notes: string | null
  isolationId: number | null
  kind: StringDetail['visits'][number]['kind']
  photoIds: number[] | string | null
}

/** The string page; `row` is the strings row as read (the estate's editable fields come from it). */
export async function stringDetailAndRow(db: Db, id: number, now = new Date()) {
  const { row: s, place: p } = await readString(db, id)
  const type = await typeOf(db, p)
  const site = {
    id: p.siteId,
    name: p.siteName,
    clientId: p.siteClientId,
    clientName: p.clientName,
    accessNote: p.accessNote,
    switchOn: p.switchOn,
    switchOff: p.switchOff,
    timeZone: p.timeZone,
  }
  const circuit =
    s.circuitId == null
      ? null
      : {
          id: s.circuitId as number,
          ref: p.circuitRef,
          breakerAmps: p.breakerAmps,
          breakerCurve: p.breakerCurve,
          rcdMa: p.rcdMa ?? null,
          supplyVolts: p.supplyVolts,
          supplyPoint: p.supplyPoint,
          supplyPointRef: p.supplyPointRef,
        }
  const structure =
    s.structureId == null
      ? null
      : {
          id: s.structureId as number,
          kind: p.structureKind,
          ref: p.structureRef,
          approvedLoad: p.approvedLoad ?? null,
        }
  const certificates = jsonColumn<StringDetail['certificates']>(p.certificates, [])
  const visits = jsonColumn<VisitJson[]>(p.visits, [])
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
  const outlook =
    storedOutlook(s as unknown as StoredForecast, burn, zoneOf(p), now) ??
    outlookOf(forecastNow(type, s, p, now), now)
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
    outlook,
    visits: visits.map(({ photoIds, ...v }) => ({
      ...v,
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

const zoneOf = (p: PlaceRow) => p.timeZone || config.APP_TIME_ZONE

/** The engine's whole forecast of the string as it is now, kept per process by its inputs. */
function forecastNow(type: StringType, s: Record<string, unknown>, p: PlaceRow, now: Date) {
  return cachedForecast(
    stringForecastRequest(type, s as unknown as StringRecord, {
      burnHoursPerDay: burnHoursPerDay(p.switchOn, p.switchOff),
      // The client's own zone (zones.ts), read with the site rather than again.
      startDate: localDay(now, zoneOf(p)),
      now,
    }),
  )
}

/** GET /strings/{id}/forecast: the chart and table under the page's "How this is worked out". */
export async function wholeForecast(db: Db, id: number, now = new Date()) {
  const { row, place } = await readString(db, id)
  return { forecast: forecastNow(await typeOf(db, place), row, place, now) }
}
