// The real app (API + built client from dist/) over the test database, and a headless Chromium
// driven by playwright-core with a fresh profile: what a crew phone would see.
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { existsSync } from 'node:fs'
import { mkdir, mkdtemp, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { Jimp } from 'jimp'
import { loadConfig } from '../../server/config'
import { createDb, type Db } from '../../server/db'
import { createApp } from '../../server/app'
import { createMailer, createTransport } from '../../server/mail/mailer'
import { startFakeSmtp } from '../../server/mail/fake-smtp'
import { localFileStore } from '../../server/files/local-store'

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium'
export const CHROMIUM_FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
]
export const PHONE = { width: 390, height: 844 }
export const PASSWORD = 'lampwright'

export interface E2eApp {
  baseUrl: string
  db: Db
  close(): Promise<void>
}

export async function startApp(): Promise<E2eApp> {
  const config = loadConfig({ ...process.env, SMTP_URL: '' })
  if (!config.DATABASE_URL)
    throw new Error('Run the browser tests through npm test (DATABASE_URL is not set).')
  if (!existsSync('dist/index.html')) throw new Error('Build the client first (npx vite build).')
  const db = createDb(config.DATABASE_URL)
  const fake = await startFakeSmtp(db, 0)
  const mailer = createMailer(db, createTransport(undefined, fake.port), config.MAIL_FROM)
  const app = createApp(
    {
      db,
      config,
      jwtSecret: config.JWT_SECRET ?? 'e2e-secret-that-is-long-enough-0123456789',
      mailer,
      files: localFileStore('uploads/test'),
    },
    // Absolute: express's sendFile refuses a relative index.html path.
    { clientDir: resolve('dist') },
  )
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s))
  })
  const { port } = server.address() as AddressInfo
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    db,
    async close() {
      server.closeAllConnections()
      await new Promise((r) => server.close(r))
      await fake.close()
      await db.destroy()
    },
  }
}

export interface Phone {
  context: BrowserContext
  page: Page
  close(): Promise<void>
}

/** A fresh profile each time: no service worker, IndexedDB or cookies from an earlier run. */
export async function launchPhone(): Promise<Phone> {
  const profile = await mkdtemp(join(tmpdir(), 'lw-e2e-'))
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_FLAGS,
    viewport: PHONE,
    deviceScaleFactor: 1,
    locale: 'en-GB',
    timezoneId: 'Europe/London',
  })
  const page = context.pages()[0] ?? (await context.newPage())
  return {
    context,
    page,
    async close() {
      await context.close()
      await rm(profile, { recursive: true, force: true })
    },
  }
}

export async function signIn(page: Page, baseUrl: string, email: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password', { exact: true }).fill(PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 20_000 })
}

/** A bearer token for `email`, signed in through the API: for a test's set-up steps, not its subject. */
export async function apiToken(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/v1/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: PASSWORD }),
  })
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status} ${await res.text()}`)
  return ((await res.json()) as { token: string }).token
}

/** One JSON request to the API as the holder of `token`; anything but a 2xx answer throws. */
export async function apiCall<T>(
  baseUrl: string,
  token: string,
  method: string,
  path: string,
  body?: unknown,
): Promise<T> {
  const res = await fetch(`${baseUrl}/api/v1${path}`, {
    method,
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`)
  return (await res.json()) as T
}

/** A small real JPEG, made on the spot, as a phone camera would hand over. */
export async function smallJpeg(): Promise<Buffer> {
  const img = new Jimp({ width: 160, height: 120, color: 0xf4a940ff })
  return img.getBuffer('image/jpeg')
}

/** Screenshots only when asked (E2E_SHOTS=dir), so CI runs stay quiet. */
export async function shot(page: Page, name: string): Promise<void> {
  const dir = process.env.E2E_SHOTS
  if (!dir) return
  await mkdir(dir, { recursive: true })
  await page.screenshot({ path: join(dir, `${name}.png`) })
}

/** Polls until `check` returns true or the time is up. */
export async function eventually(
  check: () => Promise<boolean>,
  timeoutMs = 30_000,
  stepMs = 250,
): Promise<boolean> {
  const end = Date.now() + timeoutMs
  while (Date.now() < end) {
    if (await check()) return true
    await new Promise((r) => setTimeout(r, stepMs))
  }
  return check()
}
