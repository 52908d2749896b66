// Several API processes on one machine (node:cluster): they share the listening port, and the
// primary starts a new worker when one dies. Nothing two workers must agree on lives in a process:
// sessions are tokens, rate limits, idempotency records and job locks are in MariaDB.
import cluster, { type Worker } from 'node:cluster'
import { fileURLToPath } from 'node:url'
import { logger } from './logger'
import { StartError } from './start-errors'

export type WorkerMessage = { type: 'ready'; port: number } | { type: 'failed'; message: string }

/** How long to wait before replacing a worker that died; doubles while workers keep dying young. */
const RESTART_MS = 1000
const YOUNG_MS = 10_000

export async function startCluster(env: NodeJS.ProcessEnv, count: number) {
  cluster.setupPrimary({ exec: fileURLToPath(new URL('./cluster-worker.ts', import.meta.url)) })
  let stopping = false
  let delay = RESTART_MS
  const started = new Map<number, number>()
  const fork = () => {
    const w = cluster.fork(env)
    started.set(w.id, Date.now())
    return w
  }
  const ready = (w: Worker) =>
    new Promise<number>((ok, fail) => {
      w.on('message', (m: WorkerMessage) => {
        if (m.type === 'ready') ok(m.port)
        if (m.type === 'failed') fail(new StartError(m.message))
      })
      w.once('exit', (code) =>
        fail(new StartError(`An API worker stopped during start-up (exit code ${code}).`)),
      )
    })
  const first = Array.from({ length: count }, fork)
  let port: number
  try {
    ;[port] = await Promise.all(first.map(ready))
  } catch (err) {
    stopping = true
    for (const w of Object.values(cluster.workers ?? {})) w?.kill('SIGTERM')
    throw err
  }
  cluster.on('exit', (w, code, signal) => {
    if (stopping) return
    const age = Date.now() - (started.get(w.id) ?? 0)
    started.delete(w.id)
    delay = age < YOUNG_MS ? Math.min(delay * 2, 60_000) : RESTART_MS
    logger.warn({ worker: w.id, code, signal, restartInMs: delay }, 'API worker stopped; starting another')
    setTimeout(() => {
      if (!stopping) fork()
    }, delay).unref()
  })
  return {
    port,
    workers: count,
    async close() {
      stopping = true
      const live = Object.values(cluster.workers ?? {}).filter((w): w is Worker => !!w)
      await Promise.all(
        live.map((w) => new Promise<void>((done) => (w.once('exit', () => done()), w.kill('SIGTERM')))),
      )
    },
  }
}
