// Reads config, builds the app and listens: the only file that opens the server's ports.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { join, resolve } from 'node:path'
import type { Server } from 'node:http'
import { pathToFileURL } from 'node:url'
import { loadConfig, type Config } from './config'
import { createDb } from './db'
import { createApp } from './app'
import { createMailer, createTransport } from './mail/mailer'
import { startFakeSmtp } from './mail/fake-smtp'
import { logger } from './logger'
import { startJobs } from './jobs/schedule'

/** JWT_SECRET, else a secret generated once into .data/ (git-ignored, never committed). */
export function jwtSecret(config: Config, dataDir = '.data'): string {
  if (config.JWT_SECRET) return config.JWT_SECRET
  const file = join(dataDir, 'jwt-secret')
  if (!existsSync(file)) {
    mkdirSync(dataDir, { recursive: true })
    writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 })
  }
  return readFileSync(file, 'utf8').trim()
}

export async function startServer(env: NodeJS.ProcessEnv = process.env) {
  const config = loadConfig(env)
  if (!config.DATABASE_URL)
    throw new Error('DATABASE_URL is not set (npm start sets it for the private database).')
  const db = createDb(config.DATABASE_URL)
  const fake = config.SMTP_URL ? null : await startFakeSmtp(db, config.SMTP_FAKE_PORT)
  const mailer = createMailer(db, createTransport(config.SMTP_URL, fake?.port ?? 0), config.MAIL_FROM)
  const uploadDir = resolve(config.UPLOAD_DIR)
  mkdirSync(uploadDir, { recursive: true })
  const app = createApp({ db, config, jwtSecret: jwtSecret(config), mailer, uploadDir })
  const server: Server = await new Promise((r) => {
    const s = app.listen(config.PORT, () => r(s))
  })
  const addr = server.address()
  const port = typeof addr === 'object' && addr ? addr.port : config.PORT
  logger.info({ port }, 'Lampwright is listening')
  const stopJobs = startJobs(db)
  return {
    port,
    async close() {
      stopJobs()
      await new Promise((r) => server.close(r))
      server.closeAllConnections()
      await fake?.close()
      await db.destroy()
    },
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const running = await startServer()
  const stop = async () => {
    await running.close()
    process.exit(0)
  }
  process.once('SIGINT', stop)
  process.once('SIGTERM', stop)
}
