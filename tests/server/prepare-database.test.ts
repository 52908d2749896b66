// Start-up on a database that holds real rows changes nothing: no seeding, no truncating.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { prepareDatabase } from '../../scripts/setup'
import { seedDemo } from '../../seeds/demo/index'
import { createDb, type Db } from '../../server/db'
import { inviteUser } from '../../server/services/users'
import { recordCertificate } from '../../server/services/certificates'
import { audit } from '../../server/services/audit'

const url = process.env.DATABASE_URL ?? ''
const tables = ['users', 'certificates', 'audit_log', 'strings', 'visits', 'crews', 'clients']
let db: Db
const ids = { user: 0, certificate: 0 }
const auditAction = 'prepare_database_test'

async function snapshot() {
  const counts: Record<string, number> = {}
  for (const t of tables) counts[t] = Number((await db(t).count({ n: '*' }))[0].n)
  return {
    counts,
    user: await db('users').where({ id: ids.user }).first(),
    certificate: await db('certificates').where({ id: ids.certificate }).first(),
    audit: await db('auditLog').where({ action: auditAction }).select(),
  }
}

beforeAll(async () => {
  db = createDb(url)
  const { user } = await inviteUser(db, {
    name: 'Real Contractor Admin',
    email: 'real.admin@contractor.example',
    role: 'admin',
  })
  ids.user = user.id
  const platform = await db('platforms').first('id')
  const cert = await recordCertificate(db, user.id, {
    kind: 'platform_exam',
    subjectType: 'platform',
    subjectId: platform.id,
    doneOn: '2026-11-20',
    result: 'pass',
    reference: 'REAL-CERT-1',
  })
  ids.certificate = cert.id
  await audit(db, { userId: user.id, action: auditAction, entity: 'certificate', entityId: cert.id })
})

afterAll(async () => {
  await db('auditLog').where({ action: auditAction }).delete()
  await db('certificates').where({ id: ids.certificate }).delete()
  await db('users').where({ id: ids.user }).delete()
  await db.destroy()
})

describe('prepareDatabase on a database with users', () => {
  it('leaves users, certificates and audit rows untouched with the start-up options', async () => {
    const before = await snapshot()
    expect(before.user.email).toBe('real.admin@contractor.example')
    expect(before.certificate.reference).toBe('REAL-CERT-1')
    expect(before.audit).toHaveLength(1)
    // What npm start passes in demo mode and outside it.
    await prepareDatabase(url, { seed: 'if-fresh' })
    await prepareDatabase(url, { seed: 'never' })
    expect(await snapshot()).toEqual(before)
  })

  it('seedDemo itself refuses a database with users unless told to wipe it', async () => {
    const before = await snapshot()
    await expect(seedDemo(db, new Date())).rejects.toThrow(/holds users/)
    expect(await snapshot()).toEqual(before)
  })
})
