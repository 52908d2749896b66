// The solve-vrptw job as a pool thread runs it: the raw body is checked here (a 1,000-stop body is
// work to check too), in the order the answers promise: non-finite numbers, the schema, duplicate
// ids, stops no vehicle can serve alone; then the search.
import type { z } from 'zod'
import { vrptwRequestSchema } from '../../shared/schemas/routing-vrptw'
import { solveVrptw } from '../../shared/routing/vrptw/index'
import { nonFiniteStops, vrptwProblems, type VrptwInputProblem } from '../../shared/routing/vrptw/validate'
import type { TaskReply } from './tasks'

const asError = (p: VrptwInputProblem) => ({
  err: { status: 400, code: p.code, message: p.message, details: { ids: p.ids } },
})

export function solveVrptwTask(input: unknown, validationFailed: (e: z.ZodError) => unknown): TaskReply {
  const infinite = nonFiniteStops(input)
  if (infinite) return asError(infinite)
  const parsed = vrptwRequestSchema.safeParse(input)
  if (!parsed.success) return { err: validationFailed(parsed.error) as never }
  const problem = vrptwProblems(parsed.data)
  if (problem) return asError(problem)
  return { ok: solveVrptw(parsed.data) }
}
