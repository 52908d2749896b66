// npm run demo:reset: drops every table, migrates again and loads the demo town fresh.
import { openDatabase, prepareDatabase } from './setup'
import { createDb } from '../server/db'

const db = await openDatabase({ dir: '.data', port: Number(process.env.DB_PORT ?? 3307), name: 'lampwright' })
const knex = createDb(db.url)
await knex.migrate.rollback(undefined, true)
await knex.destroy()
await prepareDatabase(db.url, { seed: 'always' })
if (db.startedHere) await db.stop()
console.log('Demo data rebuilt.')
