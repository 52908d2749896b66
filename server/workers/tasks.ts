// Runs on a pool thread (loaded by boot.mjs): the heavy pure computations, each behind its name.
// Input problems come back as { err } and become 4xx answers; anything else thrown is a bug, which
// the pool rejects with and the error handler logs as a 500.
import { readlinkSync } from 'node:fs'
import { getPriority, setPriority } from 'node:os'
import { parentPort } from 'node:worker_threads'
import type { z } from 'zod'
import { forecast } from '../../shared/engine/forecast'
import type { ForecastRequest } from '../../shared/schemas/engine'
import { tourRequestSchema } from '../../shared/schemas/routing'
import { solveTour } from '../../shared/routing/solve'
import { planRuns, type PlanInput } from '../../shared/routing/plan'
import { solveVrptwTask } from './vrptw-task'
import { readRegisterFile, type ReadInput } from '../services/register/read-task'
import { renderClientReportPdf, type PdfInput } from '../services/client-report-pdf-layout'

// Below the event loop's priority, so when the cores are busy requests are served first. On Linux a
// thread has its own nice value (piscina's niceIncrement does the same through a native add-on).
try {
  const tid = Number(readlinkSync('/proc/thread-self').split('/').pop())
  setPriority(tid, Math.min(19, getPriority(tid) + 10))
} catch {
  // not Linux: the threads keep the process's priority
}

export type TaskName =
  'forecast' | 'forecastMany' | 'solve' | 'solveVrptw' | 'plan' | 'registerRead' | 'clientReportPdf'

export interface TaskError {
  status: number
  code: string
  message: string
  details?: unknown
}

export type TaskReply = { ok: unknown } | { err: TaskError }

const tasks: Record<TaskName, (input: unknown) => TaskReply | Promise<TaskReply>> = {
  // Validated on the event loop already: a forecast request is at most 50 lamp classes.
  forecast: (input) => ({ ok: forecast(input as ForecastRequest) }),
  // The queue job's whole-town forecasts: only what the job keeps of each (72 h risk, median date, and
  // the chance of going dark by the hours it asked about, for the replace-now-by-risk rule).
  forecastMany: (input) => ({
    ok: (input as ForecastRequest[]).map((req) => {
      const fc = forecast(req)
      return {
        pDark72: fc.pDark.find((p) => p.hours === 72)?.p ?? 0,
        medianDark: fc.dates?.medianDark ?? null,
        pDarkAt: fc.pDarkAt,
      }
    }),
  }),
  // A 1,000-stop matrix is a million numbers: checking them is work too, so it happens here.
  solve: (input) => {
    const parsed = tourRequestSchema.safeParse(input)
    if (!parsed.success) return { err: validationFailed(parsed.error) }
    return { ok: solveTour(parsed.data) }
  },
  // Checked here too: non-finite numbers, the schema, duplicate ids, stops nobody can reach (vrptw-task.ts).
  solveVrptw: (input) => solveVrptwTask(input, validationFailed),
  plan: (input) => ({ ok: planRuns(input as PlanInput) }),
  // A register import's file: parsing and checking 50,000 rows is seconds of work.
  registerRead: (input) => readRegisterFile(input as ReadInput),
  // A client report's PDF: pdfmake lays out and draws it synchronously for the best part of a second.
  clientReportPdf: async (input) => ({ ok: await renderClientReportPdf(input as PdfInput) }),
}

/** The same answer as server/middleware/validate.ts gives for a body that fails its schema. */
function validationFailed(error: z.ZodError): TaskError {
  const fields = error.issues.map((i) => ({ path: ['body', ...i.path].join('.'), message: i.message }))
  return {
    status: 400,
    code: 'validation_failed',
    message: 'Some body fields are not valid.',
    details: { fields },
  }
}

export function runTask(job: {
  id: number
  task: TaskName | 'warm'
  input: unknown
}): TaskReply | Promise<TaskReply> {
  // Start-up loads this module on a thread ahead of the first real job (pool.ts warmWorkers).
  if (job.task === 'warm') return { ok: null }
  // The job's clock starts now, not while it waited for a thread.
  parentPort?.postMessage({ started: job.id })
  try {
    return tasks[job.task](job.input)
  } catch (err) {
    // The shared solvers throw RangeError for input they cannot take.
    if (err instanceof RangeError)
      return { err: { status: 400, code: 'invalid_request', message: err.message } }
    throw err
  }
}
