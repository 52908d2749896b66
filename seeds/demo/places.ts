import type { Db } from '../../server/db'
import { along, toLatLng, type Rng } from './geo'
import { clientsDef, streets, type StreetDef } from './town'
import { typeDefs } from '../../shared/lamp-catalogue'
import { isoDay } from '../../shared/iso-time'

export interface SeedString {
  assetTag: string
  name: string
  typeCode: string
  siteId: number
  circuitId: number
  structureRef: string | null
  geometry: 'point' | 'line'
  lat: number
  lng: number
  line: [number, number][] | null
}

const dayOffset = (now: Date, days: number) => isoDay(now.getTime() + days * 86_400_000)

export async function seedClientsAndTypes(db: Db, now: Date) {
  for (const c of Object.values(clientsDef)) {
    await db('clients').insert({
      name: c.name,
      kind: c.kind,
      contactName: c.contactName,
      contactEmail: c.contactEmail,
      contractRef: c.contractRef,
      responseEmergencyHours: c.emergency,
      responseStandardHours: c.standard,
      switchOn: c.switchOn,
      switchOff: c.switchOff,
      seasonStart: dayOffset(now, -12),
      seasonEnd: `${now.getUTCMonth() >= 6 ? now.getUTCFullYear() + 1 : now.getUTCFullYear()}-01-06`,
      tariffPerKwh: c.tariff,
    })
  }
  for (const t of typeDefs) {
    // Every field of the catalogue's type is a column, but its picker label and its lamp classes.
    const { classes, label, ...row } = t
    void label
    const [id] = await db('stringTypes').insert(row)
    await db('lampClasses').insert(
      classes.map((k, i) => ({
        ...k,
        ratedLifeHours: k.ratedLifeHours ?? null,
        lifeExponent: k.lifeExponent ?? null,
        stringTypeId: id,
        position: i + 1,
      })),
    )
  }
  const clientIds = Object.fromEntries(
    (await db('clients').select('id', 'kind')).map((c) => [c.kind === 'venue' ? 'venue' : 'town', c.id]),
  )
  const typeIds = Object.fromEntries(
    (await db('stringTypes').select('id', 'code')).map((t) => [t.code, t.id]),
  )
  return { clientIds, typeIds }
}

/** Strings along one street: catenaries across it, motifs on columns, festoons and wraps in squares and gardens. */
function planStreet(s: StreetDef, r: Rng) {
  const out: Omit<SeedString, 'siteId' | 'circuitId'>[] = []
  const prefix = s.client === 'venue' ? 'LH' : 'WF'
  let n = 0
  const tag = () => `${prefix}-${s.code}-${String(++n).padStart(3, '0')}`
  const half = s.widthM / 2
  if (s.kind === 'street') {
    for (const p of along(s.path, 30)) {
      const a = toLatLng(p.x - p.dy * half, p.y + p.dx * half)
      const b = toLatLng(p.x + p.dy * half, p.y - p.dx * half)
      const m = toLatLng(p.x, p.y)
      const t = tag()
      out.push({
        assetTag: t,
        name: `${s.name} catenary ${n}`,
        typeCode: 'CAT-F20',
        structureRef: `ANC-${t.slice(3)}`,
        geometry: 'line',
        lat: m.lat,
        lng: m.lng,
        line: [
          [a.lng, a.lat],
          [b.lng, b.lat],
        ],
      })
    }
    let side = 1
    for (const p of along(s.path, 60, 15)) {
      side = -side
      const c = toLatLng(p.x - p.dy * half * side, p.y + p.dx * half * side)
      const t = tag()
      out.push({
        assetTag: t,
        name: `${s.name} column motif ${n}`,
        typeCode: r.chance(0.85) ? 'MOT-L' : 'CUR-L',
        structureRef: `COL-${t.slice(3)}`,
        geometry: 'point',
        lat: c.lat,
        lng: c.lng,
        line: null,
      })
    }
  } else {
    for (let i = 0; i < s.path.length - 1; i++) {
      const a = toLatLng(...s.path[i])
      const b = toLatLng(...s.path[i + 1])
      const mid = toLatLng((s.path[i][0] + s.path[i + 1][0]) / 2, (s.path[i][1] + s.path[i + 1][1]) / 2)
      for (const half of [0, 1]) {
        const from = half ? mid : a
        const to = half ? b : mid
        out.push({
          assetTag: tag(),
          name: `${s.name} festoon ${n}`,
          typeCode: 'FES-F30',
          structureRef: null,
          geometry: 'line',
          lat: (from.lat + to.lat) / 2,
          lng: (from.lng + to.lng) / 2,
          line: [
            [from.lng, from.lat],
            [to.lng, to.lat],
          ],
        })
      }
    }
    const xs = s.path.map((p) => p[0])
    const ys = s.path.map((p) => p[1])
    const trees = s.kind === 'park' ? 50 : 22
    for (let i = 0; i < trees; i++) {
      const x = Math.min(...xs) + 8 + r.next() * (Math.max(...xs) - Math.min(...xs) - 16)
      const y = Math.min(...ys) + 8 + r.next() * (Math.max(...ys) - Math.min(...ys) - 16)
      const c = toLatLng(x, y)
      out.push({
        assetTag: tag(),
        name: `${s.name} tree wrap ${n}`,
        typeCode: i % 7 === 6 ? 'CUR-L' : 'WRAP-M100',
        structureRef: null,
        geometry: 'point',
        lat: c.lat,
        lng: c.lng,
        line: null,
      })
    }
  }
  return out
}

export async function seedPlaces(db: Db, r: Rng, clientIds: Record<string, number>) {
  const strings: SeedString[] = []
  for (const s of streets) {
    const centre = s.path[Math.floor(s.path.length / 2)]
    const c = toLatLng(...centre)
    const [siteId] = await db('sites').insert({
      clientId: clientIds[s.client],
      name: s.name,
      kind: s.kind,
      importance: s.importance,
      lat: c.lat,
      lng: c.lng,
      accessFrom: s.access?.from ?? null,
      accessTo: s.access?.to ?? null,
      accessNote: s.access?.note ?? null,
    })
    const planned = planStreet(s, r)
    const pillars = Math.max(1, Math.ceil(planned.length / 40))
    const circuitIds: number[] = []
    for (let p = 0; p < pillars; p++) {
      const at = planned[Math.floor(((p + 0.5) / pillars) * planned.length)]
      const [spId] = await db('supplyPoints').insert({
        siteId,
        ref: `FP-${s.code}-${p + 1}`,
        name: `${s.name} feeder pillar ${p + 1}`,
        lat: at.lat,
        lng: at.lng,
        controlledBy: s.client === 'venue' ? 'remote' : 'timer',
      })
      for (let k = 0; k < 2; k++) {
        const [cid] = await db('circuits').insert({
          supplyPointId: spId,
          ref: `FP-${s.code}-${p + 1}/${k + 1}`,
          supplyVolts: 230,
          breakerAmps: k === 0 ? 16 : 20,
          breakerCurve: k === 0 ? 'B' : 'C',
          rcdMa: 30,
          rcdType: 'general',
        })
        circuitIds.push(cid)
      }
    }
    planned.forEach((p, i) =>
      strings.push({
        ...p,
        siteId,
        circuitId: circuitIds[Math.floor((i / planned.length) * circuitIds.length)],
      }),
    )
  }
  return strings
}
