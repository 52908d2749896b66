// npm start: set up everything (after scripts/bootstrap.sh installed packages) and serve the app.
// A failed start says in one line what went wrong and what to do, and stops the private MariaDB
// it started; LOG_LEVEL=debug adds the full error.
import { openDatabase, prepareDatabase, buildClientIfStale, demoModeSetting, type Database } from './setup'
import { availableParallelism } from 'node:os'
import { jwtSecret, startServer } from '../server/index'
import { startCluster } from '../server/cluster'
import { loadConfig } from '../server/config'
import { reportStartError } from '../server/start-errors'
import { demoAccounts, DEMO_PASSWORD } from '../seeds/demo/accounts'

const devMode = process.argv.includes('--api-only')
// The user's DEMO_MODE wins; else demo mode only on the private database (also for the seed's config).
process.env.DEMO_MODE = demoModeSetting(process.env)

let db: Database | undefined
let server: { port: number; workers?: number; close(): Promise<void> } | undefined
let stopping = false
const shutdown = async () => {
  if (stopping) return
  stopping = true
  console.log('\nStopping Lampwright...')
  await server?.close()
  await db?.stop()
  process.exit(0)
}
process.once('SIGINT', () => void shutdown())
process.once('SIGTERM', () => void shutdown())

try {
  const settings = loadConfig(process.env)
  db = await openDatabase({ dir: settings.DATA_DIR, port: settings.DB_PORT, name: 'lampwright' })
  await prepareDatabase(db.url, { seed: settings.DEMO_MODE ? 'if-fresh' : 'never' })
  if (!devMode) buildClientIfStale()
  const env = { ...process.env, DATABASE_URL: db.url }
  const workers = settings.WORKERS ?? availableParallelism()
  if (workers > 1) {
    jwtSecret(settings) // made once here, before the workers read it
    server = await startCluster(env, workers)
  } else server = await startServer(env)
} catch (err) {
  stopping = true
  reportStartError(err)
  // A database that was already running belongs to someone else: leave it.
  if (db?.startedHere) await db.stop().catch(() => {})
  process.exit(1)
}

const config = loadConfig(process.env)
const processes = server.workers ? ` (${server.workers} API processes)` : ''
console.log(`\nLampwright is running at http://localhost:${server.port}${processes}`)
if (config.DEMO_MODE) {
  console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`)
  for (const a of demoAccounts) console.log(`  ${a.role.padEnd(10)} ${a.email}`)
}
console.log('Press Ctrl-C to stop.')
