// A backup file: one gzipped tar holding `database.sql` (the dump), `manifest.json` (what was saved,
// with each table's row count and checksum) and `uploads/` (photos and documents on local disk).
import { execFileSync } from 'node:child_process'
import { cpSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import type { TableStat } from './db-tools'

export const FORMAT = 'lampwright-backup/1'

export interface Manifest {
  format: typeof FORMAT
  createdAt: string
  database: string
  /** Row count and CHECKSUM TABLE per table, read just before the dump. */
  tables: Record<string, TableStat>
  /** inBucket: the files are on S3 and `uploads/bucket-list.json` names them. */
  uploads: { files: number; inBucket?: boolean }
}

export function writeManifest(dir: string, m: Manifest): void {
  writeFileSync(join(dir, 'manifest.json'), `${JSON.stringify(m, null, 2)}\n`)
}

export function readManifest(dir: string): Manifest {
  const file = join(dir, 'manifest.json')
  if (!existsSync(file)) throw new Error('This file is not a Lampwright backup: it has no manifest.json.')
  const m = JSON.parse(readFileSync(file, 'utf8')) as Manifest
  if (m.format !== FORMAT) throw new Error(`Unknown backup format "${String(m.format)}".`)
  return m
}

/** Writes the names of the files kept on S3; returns how many. */
export function listBucket(staging: string, names: string[]): number {
  mkdirSync(join(staging, 'uploads'), { recursive: true })
  writeFileSync(join(staging, 'uploads', 'bucket-list.json'), `${JSON.stringify(names)}\n`)
  return names.length
}

/** Copies the upload folder into the staging folder; returns how many files it held. */
export function stageUploads(uploadDir: string, staging: string): number {
  const to = join(staging, 'uploads')
  mkdirSync(to, { recursive: true })
  if (!existsSync(uploadDir)) return 0
  cpSync(uploadDir, to, { recursive: true })
  return countFiles(to)
}

export function countFiles(dir: string): number {
  if (!existsSync(dir)) return 0
  const out = execFileSync('find', [dir, '-type', 'f'], { encoding: 'utf8' })
  return out.split('\n').filter(Boolean).length
}

export function pack(staging: string, file: string): void {
  execFileSync('tar', ['-czf', file, '-C', staging, 'manifest.json', 'database.sql', 'uploads'])
}

export function unpack(file: string, into: string): void {
  execFileSync('tar', ['-xzf', file, '-C', into, '--no-same-owner'])
}
