// The real app over the database in DATABASE_URL, serving the built client from dist/, plus a
// Chromium driven by playwright-core (Debian's own browser; nothing is downloaded).
import type { Server } from 'node:http'
import { resolve } from 'node:path'
import { chromium, type Browser, type Page } from 'playwright-core'
import { loadConfig } from '../../server/config'
import { createDb, type Db } from '../../server/db'
import { createApp } from '../../server/app'
import { createMailer, createTransport } from '../../server/mail/mailer'
import { startFakeSmtp } from '../../server/mail/fake-smtp'
import type { AppDeps } from '../../server/deps'
import { localFileStore } from '../../server/files/local-store'

export interface RunningApp {
  baseUrl: string
  db: Db
  close(): Promise<void>
}

export async function startApp(): Promise<RunningApp> {
  const config = loadConfig({ ...process.env, SMTP_URL: '' })
  if (!config.DATABASE_URL) throw new Error('Set DATABASE_URL (npm test does) to run the browser tests.')
  const db = createDb(config.DATABASE_URL)
  const fake = await startFakeSmtp(db, 0)
  const mailer = createMailer(db, createTransport(undefined, fake.port), config.MAIL_FROM)
  const deps: AppDeps = {
    db,
    config,
    jwtSecret: 'e2e-secret-that-is-long-enough-0123456789',
    mailer,
    files: localFileStore('uploads/test'),
  }
  // Absolute: express's sendFile refuses a relative path for the index.html fallback.
  const app = createApp(deps, { clientDir: resolve('dist') })
  // Port 0: the system picks a free port, so the test never collides with a running server.
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s))
  })
  const address = server.address()
  const port = typeof address === 'object' && address ? address.port : 0
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    db,
    async close() {
      await new Promise((resolve) => server.close(resolve))
      server.closeAllConnections()
      await fake.close()
      await db.destroy()
    },
  }
}

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  })
}

/** Signs in through the sign-in form, as a person would, and waits for the role's home page. */
export async function signIn(page: Page, baseUrl: string, email: string, home: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password', { exact: true }).fill('lampwright')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL((url) => url.pathname === home)
}
