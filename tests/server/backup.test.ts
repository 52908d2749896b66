// npm run backup / npm run restore as an operator runs them: back up the test database and an upload
// folder, restore into a fresh empty database, and compare every table's row count and checksum,
// read here straight from both databases (not from the backup's own manifest).
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { createDb, type Db } from '../../server/db'
import { dropDatabase, emptyDatabase, runScript } from './start-helpers'

const RESTORED = 'lampwright_test_restore'
const work = mkdtempSync(join(tmpdir(), 'lampwright-backup-test-'))

async function stats(db: Db) {
  const [tables] = await db.raw(
    "select table_name as name from information_schema.tables where table_schema = database() and table_type = 'BASE TABLE' order by table_name",
  )
  const out: Record<string, { rows: number; checksum: string }> = {}
  for (const { name } of tables as { name: string }[]) {
    const [[c]] = await db.raw('select count(*) as n from ??', [name])
    const [[s]] = await db.raw('checksum table ??', [name])
    out[name] = { rows: Number(c.n), checksum: String(s.checksum) }
  }
  return out
}

async function run(script: string, env: Record<string, string>, args: string[] = []) {
  const r = runScript(script, env, args)
  const code = await r.exited
  return { code, out: r.output() }
}

afterAll(() => dropDatabase(RESTORED))

describe('backup and restore', () => {
  it('restores the same rows and uploads into an empty database, and refuses one that holds data', async () => {
    const uploads = join(work, 'uploads')
    mkdirSync(join(uploads, 'photos'), { recursive: true })
    writeFileSync(join(uploads, 'photos', 'a.jpg'), 'not really a photo')
    const backupDir = join(work, 'backups')
    const backup = await run('scripts/backup.ts', {
      DATABASE_URL: process.env.DATABASE_URL ?? '',
      BACKUP_DIR: backupDir,
      UPLOAD_DIR: uploads,
    })
    expect(backup.code, backup.out).toBe(0)
    const file = backup.out.trim().split('\n').at(-1) ?? ''
    expect(file.startsWith(backupDir)).toBe(true)
    expect(existsSync(file)).toBe(true)

    const url = await emptyDatabase(RESTORED)
    const restoredUploads = join(work, 'restored-uploads')
    const restore = await run('scripts/restore.ts', { DATABASE_URL: url, UPLOAD_DIR: restoredUploads }, [
      file,
    ])
    expect(restore.code, restore.out).toBe(0)

    const source = createDb(process.env.DATABASE_URL ?? '')
    const copy = createDb(url)
    try {
      const [a, b] = [await stats(source), await stats(copy)]
      expect(Object.keys(a).length).toBeGreaterThan(20)
      expect(a.users.rows).toBeGreaterThan(0)
      expect(b).toEqual(a)
    } finally {
      await source.destroy()
      await copy.destroy()
    }
    expect(readFileSync(join(restoredUploads, 'photos', 'a.jpg'), 'utf8')).toBe('not really a photo')

    // A second restore into the now-full database is refused and changes nothing.
    const again = await run('scripts/restore.ts', { DATABASE_URL: url, UPLOAD_DIR: restoredUploads }, [file])
    expect(again.code).toBe(1)
    expect(again.out).toMatch(/already holds \d+ tables/)
  }, 120_000)
})
