// npm run backup: a consistent copy of the database that `npm start` uses (or DATABASE_URL) and of
// the uploads, as one file in BACKUP_DIR (default backups/). The last line printed is the file's path.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { loadConfig } from '../server/config'
import { createDb } from '../server/db'
import { openDatabase } from './setup'
import { dumpDatabase, tableStats, targetOf } from './backup/db-tools'
import { FORMAT, listBucket, pack, stageUploads, writeManifest } from './backup/archive'
import { createFileStore } from '../server/files/index'

const settings = loadConfig(process.env)
const backupDir = resolve(process.env.BACKUP_DIR || 'backups')
const database = await openDatabase({ dir: settings.DATA_DIR, port: settings.DB_PORT, name: 'lampwright' })
const staging = mkdtempSync(join(tmpdir(), 'lampwright-backup-'))
try {
  const target = targetOf(database.url)
  const db = createDb(database.url)
  const tables = await tableStats(db).finally(() => db.destroy())
  dumpDatabase(target, join(staging, 'database.sql'))
  // Files on S3 stay in their bucket (with its own versioning and backups): the backup lists them.
  const files = settings.S3_URL
    ? listBucket(staging, await createFileStore(settings).list())
    : stageUploads(resolve(settings.UPLOAD_DIR), staging)
  const createdAt = new Date().toISOString()
  writeManifest(staging, {
    format: FORMAT,
    createdAt,
    database: target.database,
    tables,
    uploads: { files, inBucket: !!settings.S3_URL },
  })
  mkdirSync(backupDir, { recursive: true, mode: 0o700 })
  const file = join(backupDir, `lampwright-${createdAt.replace(/[:.]/g, '-')}.tar.gz`)
  pack(staging, file)
  const rows = Object.values(tables).reduce((n, t) => n + t.rows, 0)
  console.log(`Saved ${Object.keys(tables).length} tables (${rows} rows) and ${files} uploaded files.`)
  console.log(file)
} catch (err) {
  console.error(`Backup failed: ${(err as Error).message}`)
  process.exitCode = 1
} finally {
  rmSync(staging, { recursive: true, force: true })
  if (database.startedHere) await database.stop()
}
