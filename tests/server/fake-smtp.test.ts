// The local mail fake takes a free port by default, so two instances run side by side.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import nodemailer from 'nodemailer'
import { createDb, type Db } from '../../server/db'
import { loadConfig } from '../../server/config'
import { startFakeSmtp } from '../../server/mail/fake-smtp'

let db: Db
const subject = 'fake-smtp test message'

beforeAll(() => {
  db = createDb(process.env.DATABASE_URL ?? '')
})
afterAll(async () => {
  await db('caughtMail').where({ subject }).delete()
  await db.destroy()
})

describe('local mail fake', () => {
  it('defaults SMTP_FAKE_PORT to 0, a free port', () => {
    expect(loadConfig({}).SMTP_FAKE_PORT).toBe(0)
  })

  it('runs twice at once on two free ports, each catching its mail; a taken port is refused', async () => {
    const a = await startFakeSmtp(db, 0)
    const b = await startFakeSmtp(db, 0)
    try {
      expect(a.port).toBeGreaterThan(0)
      expect(b.port).toBeGreaterThan(0)
      expect(a.port).not.toBe(b.port)
      for (const [fake, to] of [
        [a, 'a@example.org'],
        [b, 'b@example.org'],
      ] as const) {
        const t = nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, ignoreTLS: true })
        await t.sendMail({ from: 'x@example.org', to, subject, text: 'hello' })
      }
      const caught = await db('caughtMail').where({ subject }).orderBy('toAddress').select('toAddress')
      expect(caught.map((c) => c.toAddress)).toEqual(['a@example.org', 'b@example.org'])
      await expect(startFakeSmtp(db, a.port)).rejects.toMatchObject({ code: 'EADDRINUSE' })
    } finally {
      await a.close()
      await b.close()
    }
  })
})
