// Runs `npm start`'s script (scripts/start.ts --api-only) as a child process, as an operator would,
// and makes empty scratch databases on the test server (the test app user may create
// `lampwright_test_…` databases; see scripts/db/private-db.ts `scratch`).
import { runScript } from '../../scripts/run-script'
import { createDb } from '../../server/db'

export { runScript, type Run } from '../../scripts/run-script'

export const runStart = (env: Record<string, string>) => runScript('scripts/start.ts', env, ['--api-only'])

/** The test server's URL pointed at another database. */
export function databaseUrl(name: string): string {
  const u = new URL(process.env.DATABASE_URL ?? '')
  u.pathname = `/${name}`
  return u.toString()
}

/** Drops and creates an empty database `name` (which must start with lampwright_test_). */
export async function emptyDatabase(name: string): Promise<string> {
  const db = createDb(process.env.DATABASE_URL ?? '')
  try {
    await db.raw('DROP DATABASE IF EXISTS ??', [name])
    await db.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [name])
  } finally {
    await db.destroy()
  }
  return databaseUrl(name)
}

export async function dropDatabase(name: string): Promise<void> {
  const db = createDb(process.env.DATABASE_URL ?? '')
  await db.raw('DROP DATABASE IF EXISTS ??', [name]).finally(() => db.destroy())
}

/** Lines that look like a stack trace. */
export const stackLines = (s: string) => s.split('\n').filter((l) => /^\s+at /.test(l))
