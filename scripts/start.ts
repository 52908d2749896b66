// npm start: set up everything (after scripts/bootstrap.sh installed packages) and serve the app.
import { openDatabase, prepareDatabase, buildClientIfStale } from './setup'
import { startServer } from '../server/index'
import { demoAccounts, DEMO_PASSWORD } from '../seeds/demo/accounts'

const devMode = process.argv.includes('--api-only')
const db = await openDatabase({ dir: '.data', port: Number(process.env.DB_PORT ?? 3307), name: 'lampwright' })
let stopping = false
const shutdown = async (server?: { close(): Promise<void> }) => {
  if (stopping) return
  stopping = true
  console.log('\nStopping Lampwright...')
  await server?.close()
  await db.stop()
  process.exit(0)
}
process.once('SIGINT', () => void shutdown())
process.once('SIGTERM', () => void shutdown())

await prepareDatabase(db.url, { seed: 'if-empty' })
if (!devMode) buildClientIfStale()
const server = await startServer({ ...process.env, DATABASE_URL: db.url })
process.removeAllListeners('SIGINT')
process.removeAllListeners('SIGTERM')
process.once('SIGINT', () => void shutdown(server))
process.once('SIGTERM', () => void shutdown(server))

const url = `http://localhost:${server.port}`
console.log(`\nLampwright is running at ${url}`)
if (process.env.DEMO_MODE !== 'false') {
  console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`)
  for (const a of demoAccounts) console.log(`  ${a.role.padEnd(10)} ${a.email}`)
}
console.log('Press Ctrl-C to stop.')
