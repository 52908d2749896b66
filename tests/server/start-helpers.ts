// Runs `npm start`'s script (scripts/start.ts --api-only) as a child process, as an operator would,
// and makes empty scratch databases on the test server (the test app user may create
// `lampwright_test_…` databases; see scripts/db/private-db.ts `scratch`).
import { spawn } from 'node:child_process'
import { createDb } from '../../server/db'

export interface Run {
  /** The process id of the started script (the cluster's primary under npm start). */
  pid: number
  output(): string
  /** Resolves with the HTTP port once the start banner is printed; rejects when the process ends first. */
  ready: Promise<number>
  exited: Promise<number | null>
  stop(): Promise<number | null>
}

/** The test environment minus what would pick a database or a mode for the child. */
function baseEnv(): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', LOG_LEVEL: 'warn', PORT: '0' }
  for (const k of [
    'DATABASE_URL',
    'DEMO_MODE',
    'SMTP_FAKE_PORT',
    'ADMIN_EMAIL',
    'ADMIN_PASSWORD',
    'SMTP_URL',
  ])
    delete env[k]
  return env
}

export function runScript(script: string, env: Record<string, string>, args: string[] = []): Run {
  const child = spawn('node', ['--import', 'tsx', script, ...args], {
    env: { ...baseEnv(), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let out = ''
  child.stdout.on('data', (d) => (out += d))
  child.stderr.on('data', (d) => (out += d))
  const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)))
  const ready = new Promise<number>((ok, fail) => {
    const check = () => {
      const m = /running at http:\/\/localhost:(\d+)/.exec(out)
      if (m) ok(Number(m[1]))
    }
    child.stdout.on('data', check)
    void exited.then((code) => fail(new Error(`exited with ${code} before it was ready:\n${out}`)))
  })
  ready.catch(() => {})
  return {
    pid: child.pid ?? 0,
    output: () => out,
    ready,
    exited,
    async stop() {
      if (child.exitCode === null) child.kill('SIGTERM')
      return exited
    },
  }
}

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
