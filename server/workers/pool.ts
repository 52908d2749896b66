// One pool of worker threads for the server's heavy pure computations (forecasts, tour search, run
// planning), so a large one never stalls other requests on the event loop. Created on first use and
// shared by every app in the process; idle threads are unref'd (they never keep a process alive) and
// exit after ten minutes. server/index.ts closes it on shutdown.
import { availableParallelism } from 'node:os'
import { Piscina } from 'piscina'
import { config } from '../config'
import { logger } from '../logger'
import { HttpError } from '../errors'
import type { TaskName, TaskReply } from './tasks'

let pool: Piscina | undefined
let nextId = 1
/** Called when a job's worker reports that it has started. */
const onStart = new Map<number, () => void>()

export function workerThreads(): number {
  return config.WORKER_THREADS ?? Math.max(1, availableParallelism() - 1)
}

/** Jobs that may wait for a free thread; beyond this the server answers 503 `busy`. */
export const maxQueued = () => 4 * workerThreads()

function getPool(): Piscina {
  if (pool) return pool
  const threads = workerThreads()
  const p = new Piscina({
    filename: new URL('./boot.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: threads,
    idleTimeout: 600_000,
  })
  p.on('message', (m: { started?: number }) => {
    if (m?.started !== undefined) onStart.get(m.started)?.()
  })
  // A thread that dies with no job on it: piscina starts another; log it instead of crashing.
  p.on('error', (err) => logger.error({ err }, 'worker thread failed'))
  pool = p
  return p
}

export const queuedJobs = () => pool?.queueSize ?? 0

export interface PoolJob {
  /** wall-clock limit counted from the moment a thread starts the job (not while it waits) */
  timeoutMs: number
  /** aborts the job, e.g. when the client has gone away */
  signal?: AbortSignal
}

/** Runs one task on a worker thread. Expected failures come back as HttpErrors; a job over its time
 * is stopped (its thread terminated) and answered 503 `job_timeout`. */
export async function runInPool<T>(task: TaskName, input: unknown, job: PoolJob): Promise<T> {
  const id = nextId++
  const abort = new AbortController()
  let timedOut = false
  let timer: NodeJS.Timeout | undefined
  onStart.set(id, () => {
    timer = setTimeout(() => {
      timedOut = true
      abort.abort()
    }, job.timeoutMs)
  })
  const stop = () => abort.abort()
  job.signal?.addEventListener('abort', stop)
  try {
    const reply: TaskReply = await getPool().run({ id, task, input }, { signal: abort.signal })
    if ('err' in reply)
      throw new HttpError(reply.err.status, reply.err.code, reply.err.message, reply.err.details)
    return reply.ok as T
  } catch (err) {
    if (timedOut) {
      throw new HttpError(
        503,
        'job_timeout',
        `The computation ran past its limit of ${Math.ceil(job.timeoutMs / 1000)} s and was stopped. Ask for a smaller one.`,
      )
    }
    // Nobody reads this answer; an HttpError keeps the hang-up out of the error log.
    if (job.signal?.aborted) throw new HttpError(503, 'cancelled', 'The request was cancelled.')
    if ((err as Error)?.name === 'AbortError') {
      throw new HttpError(503, 'busy', 'The server is shutting down; try again shortly.')
    }
    throw err
  } finally {
    clearTimeout(timer)
    onStart.delete(id)
    job.signal?.removeEventListener('abort', stop)
  }
}

/**
 * Starts a thread and loads the tasks' code at server start-up, so the first planner's request does
 * not wait the seconds that takes. Threads then stay for ten idle minutes.
 */
export function warmWorkers(): void {
  void getPool()
    .run({ id: 0, task: 'warm', input: null })
    .catch((err) => logger.warn({ err }, 'worker warm-up failed'))
}

/** Stops every thread; jobs still running or waiting fail. A later job starts a fresh pool. */
export async function closeWorkers(): Promise<void> {
  const p = pool
  pool = undefined
  await p?.close({ force: true })
}
