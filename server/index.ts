// Reads config, builds the app and listens: the only file that opens the server's ports.
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { join } from 'node:path'
import type { Server } from 'node:http'
import { pathToFileURL } from 'node:url'
import cluster from 'node:cluster'
import { loadConfig, type Config } from './config'
import { createDb } from './db'
import { createApp } from './app'
import { createMailer, createTransport } from './mail/mailer'
import { startFakeSmtp } from './mail/fake-smtp'
import { logger } from './logger'
import { startJobs } from './jobs/schedule'
import { createFileStore } from './files/index'
import { closeWorkers, warmWorkers } from './workers/pool'
import { activeDemoAccounts, ensureFirstAdmin, firstAdminLine } from './services/first-admin'
import { portError, reportStartError, StartError } from './start-errors'

/** JWT_SECRET, else a secret generated once into DATA_DIR (git-ignored, never committed). */
export function jwtSecret(config: Config, dataDir = config.DATA_DIR): string {
  if (config.JWT_SECRET) return config.JWT_SECRET
  const file = join(dataDir, 'jwt-secret')
  if (!existsSync(file)) {
    mkdirSync(dataDir, { recursive: true, mode: 0o700 })
    writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 })
  }
  chmodSync(file, 0o600)
  return readFileSync(file, 'utf8').trim()
}

function listen(app: ReturnType<typeof createApp>, port: number): Promise<Server> {
  return new Promise((ok, fail) => {
    const s = app.listen(port, (err?: Error) => (err ? fail(portError(err, port, 'PORT')) : ok(s)))
  })
}

/** Opens everything in order; on a failure closes what was opened, then rethrows. */
export async function startServer(env: NodeJS.ProcessEnv = process.env) {
  const config = loadConfig(env)
  if (!config.DATABASE_URL)
    throw new StartError('DATABASE_URL is not set: npm start sets it for the private database')
  const db = createDb(config.DATABASE_URL)
  const undo: (() => Promise<unknown>)[] = [() => db.destroy()]
  try {
    const fake = config.SMTP_URL
      ? null
      : await startFakeSmtp(db, config.SMTP_FAKE_PORT).catch((err) => {
          throw portError(err, config.SMTP_FAKE_PORT, 'SMTP_FAKE_PORT (or leave it unset)')
        })
    if (fake) undo.push(() => fake.close())
    const mailer = createMailer(db, createTransport(config.SMTP_URL, fake?.port ?? 0), config.MAIL_FROM)
    const admin = await ensureFirstAdmin(db, config, mailer)
    // Under node:cluster the first API process speaks for all; the one that created the admin says so.
    const announce = !cluster.isWorker || cluster.worker?.id === 1
    const line = admin.kind === 'created' || announce ? firstAdminLine(admin) : null
    if (line) console.log(line)
    if (!config.DEMO_MODE && announce) {
      const demo = await activeDemoAccounts(db)
      if (demo.length)
        console.log(
          `Warning: the demo accounts (${demo.join(', ')}) are active and their password is published: deactivate them under Users.`,
        )
    }
    const files = createFileStore(config)
    const app = createApp({ db, config, jwtSecret: jwtSecret(config), mailer, files })
    const server = await listen(app, config.PORT)
    const addr = server.address()
    const port = typeof addr === 'object' && addr ? addr.port : config.PORT
    logger.info({ port }, 'Lampwright is listening')
    const stopJobs = startJobs(db, mailer, config)
    warmWorkers()
    return {
      port,
      async close() {
        stopJobs()
        await new Promise((r) => server.close(r))
        server.closeAllConnections()
        await fake?.close()
        await closeWorkers()
        await db.destroy()
      },
    }
  } catch (err) {
    for (const u of undo.reverse()) await u().catch(() => {})
    throw err
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  try {
    const running = await startServer()
    const stop = async () => {
      await running.close()
      process.exit(0)
    }
    process.once('SIGINT', stop)
    process.once('SIGTERM', stop)
  } catch (err) {
    reportStartError(err)
    process.exit(1)
  }
}
