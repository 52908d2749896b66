// Runs one of the project's scripts as a child process, as an operator would, with the caller's
// settings and nothing inherited that would pick a database or a mode for it.
import { spawn } from 'node:child_process'

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
