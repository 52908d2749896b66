import bcrypt from 'bcryptjs'
import type { Db } from '../../server/db'
import { demoAccounts, DEMO_PASSWORD } from './accounts'
import { toLatLng } from './geo'

// Invented crews, platforms and people of the demo scenario.
export const crewDefs = [
  {
    name: 'Lantern',
    depot: 'Wrenfold Depot, Foundry Street',
    at: [380, -380] as [number, number],
    shift: ['16:00', '00:00'],
    platform: 'PL-01',
  },
  {
    name: 'Tallow',
    depot: 'Wrenfold Depot, Foundry Street',
    at: [380, -380] as [number, number],
    shift: ['08:00', '16:00'],
    platform: 'PL-02',
  },
  {
    name: 'Wick',
    depot: 'Quay Yard',
    at: [1050, -380] as [number, number],
    shift: ['15:00', '23:00'],
    platform: null,
  },
]

const crewMembers: { email: string; name: string; crew: string }[] = [
  { email: 'dewi.marchbank@example.org', name: 'Dewi Marchbank', crew: 'Lantern' },
  { email: 'priya.castellane@example.org', name: 'Priya Castellane', crew: 'Tallow' },
  { email: 'oskar.brindley@example.org', name: 'Oskar Brindley', crew: 'Tallow' },
  { email: 'noor.fairweather@example.org', name: 'Noor Fairweather', crew: 'Wick' },
  { email: 'calum.threlkeld@example.org', name: 'Calum Threlkeld', crew: 'Wick' },
]

export async function seedPeople(db: Db) {
  const platforms = [
    {
      name: 'Scissor lift 10 m',
      assetTag: 'PL-01',
      kind: 'scissor',
      workingHeightM: 10,
      safeWorkingLoadKg: 320,
    },
    {
      name: 'Van-mounted boom 14 m',
      assetTag: 'PL-02',
      kind: 'vehicle_mounted',
      workingHeightM: 14,
      safeWorkingLoadKg: 200,
    },
  ]
  await db('platforms').insert(platforms)
  const platformIds = Object.fromEntries(
    (await db('platforms').select('id', 'assetTag')).map((p) => [p.assetTag, p.id]),
  )
  for (const c of crewDefs) {
    const { lat, lng } = toLatLng(...c.at)
    await db('crews').insert({
      name: c.name,
      depotName: c.depot,
      depotLat: lat,
      depotLng: lng,
      shiftStart: c.shift[0],
      shiftEnd: c.shift[1],
      platformId: c.platform ? platformIds[c.platform] : null,
    })
  }
  const crewIds = Object.fromEntries((await db('crews').select('id', 'name')).map((c) => [c.name, c.id]))
  // One hash for every demo account keeps the seed fast; cost 10 meets the OWASP minimum.
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10)
  const rows = [
    ...demoAccounts.map((a) => ({
      email: a.email,
      name: a.name,
      role: a.role,
      crewId: a.crew ? crewIds[a.crew] : null,
    })),
    ...crewMembers.map((m) => ({ email: m.email, name: m.name, role: 'crew', crewId: crewIds[m.crew] })),
  ]
  await db('users').insert(rows.map((r) => ({ ...r, passwordHash: hash, active: true })))
  const users = await db('users').select('id', 'email', 'crewId', 'role')
  return { crewIds, platformIds, users }
}
