// The MariaDB command-line tools run against a database URL. The password goes in a 0600 options
// file in a private temporary folder, never on the command line (where `ps` would show it).
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Knex } from 'knex'
import { parseDatabaseUrl } from '../../server/db'

export interface DbTarget {
  url: string
  database: string
}

export function targetOf(url: string): DbTarget {
  const c = parseDatabaseUrl(url) as { database?: string }
  if (!c.database) throw new Error('The database URL names no database.')
  return { url, database: c.database }
}

/** Runs `fn` with the path of a private options file for `url`'s server. */
export function withOptionsFile<T>(url: string, fn: (file: string) => T): T {
  const c = parseDatabaseUrl(url) as { host?: string; port?: number; user?: string; password?: string }
  const dir = mkdtempSync(join(tmpdir(), 'lampwright-db-'))
  const file = join(dir, 'client.cnf')
  const quote = (s: string) => `"${s.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`
  writeFileSync(
    file,
    [
      '[client]',
      `host=${c.host ?? '127.0.0.1'}`,
      `port=${c.port ?? 3306}`,
      `user=${quote(c.user ?? '')}`,
      `password=${quote(c.password ?? '')}`,
      '',
    ].join('\n'),
    { mode: 0o600 },
  )
  try {
    return fn(file)
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}

/**
 * A consistent dump of one database: one transaction's snapshot of every InnoDB table
 * (`--single-transaction`), with stored routines, straight into `outFile`.
 */
export function dumpDatabase(target: DbTarget, outFile: string): void {
  withOptionsFile(target.url, (cnf) =>
    execFileSync(
      'mariadb-dump',
      [
        `--defaults-extra-file=${cnf}`,
        '--protocol=tcp',
        '--single-transaction',
        '--routines',
        '--no-tablespaces',
        '--skip-lock-tables',
        `--result-file=${outFile}`,
        target.database,
      ],
      { stdio: ['ignore', 'ignore', 'pipe'] },
    ),
  )
}

/** Loads a dump into `target` (which must already exist). */
export function loadDump(target: DbTarget, dumpFile: string): void {
  withOptionsFile(target.url, (cnf) => {
    const r = spawnSync(
      'mariadb',
      [`--defaults-extra-file=${cnf}`, '--protocol=tcp', target.database, '-e', `source ${dumpFile}`],
      { stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' },
    )
    if (r.status !== 0) throw new Error(`Loading the dump failed: ${r.stderr.trim()}`)
  })
}

export interface TableStat {
  rows: number
  checksum: string
}

/** Row count and CHECKSUM TABLE of every base table, by name. */
export async function tableStats(db: Knex): Promise<Record<string, TableStat>> {
  const [tables] = await db.raw(
    "select table_name as name from information_schema.tables where table_schema = database() and table_type = 'BASE TABLE' order by table_name",
  )
  const out: Record<string, TableStat> = {}
  for (const t of tables as { name: string }[]) {
    const [[count]] = await db.raw('select count(*) as n from ??', [t.name])
    const [[sum]] = await db.raw('checksum table ??', [t.name])
    out[t.name] = { rows: Number(count.n), checksum: String(sum.Checksum ?? sum.checksum) }
  }
  return out
}
