// A real app over the test database (scripts/test.ts migrated and seeded it), with the local
// mail fake on a free port, for supertest.
import request from 'supertest'
import { loadConfig } from '../../server/config'
import { createDb, type Db } from '../../server/db'
import { createApp } from '../../server/app'
import { createMailer, createTransport } from '../../server/mail/mailer'
import { startFakeSmtp } from '../../server/mail/fake-smtp'
import type { AppDeps } from '../../server/deps'
import type { Role } from '../../shared/roles'
import { createFileStore } from '../../server/files/index'

export interface TestApp {
  app: ReturnType<typeof createApp>
  db: Db
  deps: AppDeps
  token(role: Role): Promise<string>
  close(): Promise<void>
}

export async function makeTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const config = loadConfig({ ...process.env, SMTP_URL: '', ...env })
  if (!config.DATABASE_URL)
    throw new Error('Run the server tests through npm test (DATABASE_URL is not set).')
  const db = createDb(config.DATABASE_URL)
  const fake = await startFakeSmtp(db, 0)
  const mailer = createMailer(db, createTransport(undefined, fake.port), config.MAIL_FROM)
  const deps: AppDeps = {
    db,
    config,
    jwtSecret: 'test-secret-that-is-long-enough-0123456789',
    mailer,
    files: createFileStore({ ...config, UPLOAD_DIR: 'uploads/test' }),
  }
  const app = createApp(deps, { clientDir: '/nonexistent' })
  const tokens = new Map<Role, string>()
  return {
    app,
    db,
    deps,
    async token(role) {
      if (!tokens.has(role)) {
        const res = await request(app)
          .post('/api/v1/auth/sign-in')
          .send({ email: `${role}@example.org`, password: 'lampwright' })
        if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status}`)
        tokens.set(role, res.body.token)
      }
      return tokens.get(role)!
    },
    async close() {
      await fake.close()
      await db.destroy()
    },
  }
}

/**
 * Lit 20-lamp filament catenaries (type CAT-F20: 19 shunted lamps and a fuse lamp) of the demo town,
 * lowest id first, `skip` passed over; `noneOut` only those with no lamp out.
 */
export async function litCatenaries(db: Db, n: number, o: { skip?: number; noneOut?: boolean } = {}) {
  const rows = await db('strings as s')
    .join('stringTypes as ty', 'ty.id', 's.typeId')
    .where({ 'ty.code': 'CAT-F20', 's.status': 'lit', ...(o.noneOut ? { 's.lampsOut': 0 } : {}) })
    .whereNull('s.archivedAt')
    .orderBy('s.id')
    .offset(o.skip ?? 0)
    .limit(n)
    .select('s.id')
  if (rows.length < n) throw new Error(`the demo town has fewer than ${n} lit CAT-F20 strings left`)
  return rows.map((r) => r.id as number)
}
