// A client, site and string type of our own for the engine-* server tests, so every expected value is a
// hand calculation on round numbers rather than a property of the demo town.
import type { Db } from '../../server/db'

export interface Fixture {
  clientId: number
  siteId: number
  typeId: number
}

/**
 * Client: lights 16:00–23:00, 7 burning hours a night; standard response 36 h. Type: 240 V series,
 * 19 × 12 V 0.5 A shunted lamps (life exponent 13, the type's) and one 12 V 0.5 A fuse lamp with its own
 * life exponent 16; rated life 1,000 h, Weibull shape 2.8, shunts never open.
 */
export async function makeFixture(db: Db, tag: string): Promise<Fixture> {
  const [clientId] = await db('clients').insert({
    name: `Engine test client ${tag}`,
    kind: 'council',
    responseEmergencyHours: 4,
    responseStandardHours: 36,
    switchOn: '16:00',
    switchOff: '23:00',
    tariffPerKwh: 0.3,
    timeZone: 'Europe/London',
  })
  const [siteId] = await db('sites').insert({
    clientId,
    name: `Engine test street ${tag}`,
    kind: 'street',
    lat: 51.5,
    lng: -0.1,
  })
  const [typeId] = await db('stringTypes').insert({
    code: `EN-${tag}`.slice(0, 30),
    name: 'Engine test catenary',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 240,
    ratedLifeHours: 1000,
    lifeExponent: 13,
    weibullShape: 2.8,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0,
  })
  await db('lampClasses').insert([
    {
      stringTypeId: typeId,
      position: 1,
      label: 'Lamp',
      count: 19,
      ratedVolts: 12,
      ratedAmps: 0.5,
      shunted: true,
    },
    {
      stringTypeId: typeId,
      position: 2,
      label: 'Fuse lamp',
      count: 1,
      ratedVolts: 12,
      ratedAmps: 0.5,
      shunted: false,
      lifeExponent: 16,
    },
  ])
  return { clientId, siteId, typeId }
}

let n = 0
/** A string of the fixture's type; `row` sets its condition, age and exposure. */
export async function makeString(db: Db, f: Fixture, tag: string, row: Record<string, unknown>) {
  const [id] = await db('strings').insert({
    assetTag: `EN-${tag}-${++n}`.slice(0, 40),
    name: 'Engine test string',
    typeId: f.typeId,
    siteId: f.siteId,
    lat: 51.5,
    lng: -0.1,
    ...row,
  })
  return id as number
}

export const exposureOf = async (db: Db, id: number): Promise<number[]> => {
  const s = await db('strings').where({ id }).first('lampExposure')
  return typeof s.lampExposure === 'string' ? JSON.parse(s.lampExposure) : s.lampExposure
}
