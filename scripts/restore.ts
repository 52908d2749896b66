// npm run restore FILE: brings a backup made by `npm run backup` back into an EMPTY database (the one
// `npm start` uses, or DATABASE_URL) and its uploads into UPLOAD_DIR, then checks every table's row
// count and checksum against the backup's manifest. A database that holds any table is refused:
// restoring never overwrites data.
import { cpSync, existsSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { loadConfig } from '../server/config'
import { createDb } from '../server/db'
import { openDatabase } from './setup'
import { loadDump, tableStats, targetOf } from './backup/db-tools'
import { readManifest, unpack } from './backup/archive'

const file = process.argv[2]
if (!file || !existsSync(file)) {
  console.error('Usage: npm run restore -- FILE   (a file written by npm run backup)')
  process.exit(2)
}
const settings = loadConfig(process.env)
const database = await openDatabase({ dir: settings.DATA_DIR, port: settings.DB_PORT, name: 'lampwright' })
const staging = mkdtempSync(join(tmpdir(), 'lampwright-restore-'))
const db = createDb(database.url)
try {
  const target = targetOf(database.url)
  const [existing] = await db.raw(
    "select count(*) as n from information_schema.tables where table_schema = database() and table_type = 'BASE TABLE'",
  )
  if (Number(existing[0].n) > 0) {
    throw new Error(
      `The database "${target.database}" already holds ${existing[0].n} tables. Restore only into an empty database: a new DATA_DIR, or an empty database in DATABASE_URL.`,
    )
  }
  unpack(resolve(file), staging)
  const manifest = readManifest(staging)
  loadDump(target, join(staging, 'database.sql'))
  // Uploads: files already in UPLOAD_DIR are kept as they are; files on S3 stayed in their bucket.
  if (!manifest.uploads.inBucket)
    cpSync(join(staging, 'uploads'), resolve(settings.UPLOAD_DIR), { recursive: true, force: false })
  const restored = await tableStats(db)
  const differ = Object.entries(manifest.tables).filter(
    ([name, t]) => restored[name]?.rows !== t.rows || restored[name]?.checksum !== t.checksum,
  )
  for (const [name, t] of differ)
    console.error(
      `  ${name}: backup ${t.rows} rows (checksum ${t.checksum}), restored ${restored[name]?.rows ?? 'missing'}`,
    )
  if (differ.length) throw new Error(`${differ.length} tables differ from the backup's manifest (see above).`)
  const rows = Object.values(restored).reduce((n, t) => n + t.rows, 0)
  console.log(
    `Restored ${Object.keys(restored).length} tables (${rows} rows, every count and checksum as in the backup of ${manifest.createdAt}) and ${manifest.uploads.files} uploaded files${manifest.uploads.inBucket ? ' (kept in the S3 bucket)' : ''}.`,
  )
} catch (err) {
  console.error(`Restore failed: ${(err as Error).message}`)
  process.exitCode = 1
} finally {
  await db.destroy()
  rmSync(staging, { recursive: true, force: true })
  if (database.startedHere) await database.stop()
}
