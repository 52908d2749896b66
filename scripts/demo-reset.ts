// npm run demo:reset: drops every table, migrates again and loads the demo town fresh. It deletes
// everything, so it refuses outside demo mode and on an external DATABASE_URL unless told plainly.
import { pathToFileURL } from 'node:url'
import { openDatabase, prepareDatabase, demoModeSetting, type Database } from './setup'
import { createDb } from '../server/db'
import { loadConfig } from '../server/config'
import { reportStartError } from '../server/start-errors'

export const WIPE_FLAG = '--yes-wipe-everything'

/** Why the reset must not run, in one line; null when it may. */
export function resetRefusal(env: NodeJS.ProcessEnv, args: string[]): string | null {
  if (args.includes(WIPE_FLAG)) return null
  const again = `run \`npm run demo:reset -- ${WIPE_FLAG}\` if every row may go`
  if (!loadConfig({ ...env, DEMO_MODE: demoModeSetting(env) }).DEMO_MODE)
    return `demo:reset refused: DEMO_MODE is false and the reset deletes every row; ${again}`
  if (env.DATABASE_URL)
    return `demo:reset refused: DATABASE_URL points at an external database and the reset deletes every row in it; ${again}`
  return null
}

async function main(): Promise<number> {
  let db: Database | undefined
  try {
    const refusal = resetRefusal(process.env, process.argv.slice(2))
    if (refusal) {
      console.error(refusal)
      return 2
    }
    const settings = loadConfig(process.env)
    db = await openDatabase({ dir: settings.DATA_DIR, port: settings.DB_PORT, name: 'lampwright' })
    const knex = createDb(db.url)
    await knex.migrate.rollback(undefined, true).finally(() => knex.destroy())
    await prepareDatabase(db.url, { seed: 'always' })
    console.log('Demo data rebuilt.')
    return 0
  } catch (err) {
    reportStartError(err)
    return 1
  } finally {
    if (db?.startedHere) await db.stop()
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) process.exit(await main())
