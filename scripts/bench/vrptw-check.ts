// Independent feasibility check of a VRPTW answer, written apart from the solver (shared/routing/vrptw)
// and sharing no code with it: it replays every route from the plain request and recomputes the
// distance. Used by `npm run bench:vrptw` and tests/shared/vrptw-check.test.ts.

export interface CheckInstance {
  depot: { x: number; y: number; ready: number; due: number }
  vehicles: { count: number; capacity: number }
  stops: { id: string; x: number; y: number; demand: number; ready: number; due: number; service: number }[]
}

export interface CheckAnswer {
  routes: string[][]
  unserved: { id: string }[]
}

export interface CheckReport {
  /** true when no rule is broken */
  ok: boolean
  problems: string[]
  /** recomputed total distance (double precision Euclidean, depot to depot) */
  distance: number
  servedCount: number
}

// Service may start this little after the due time before it counts as late (floating-point sums).
const TOLERANCE = 1e-6

export function checkVrptw(inst: CheckInstance, answer: CheckAnswer): CheckReport {
  const problems: string[] = []
  const byId = new Map(inst.stops.map((s) => [s.id, s]))
  const seen = new Set<string>()
  let distance = 0
  if (answer.routes.length > inst.vehicles.count) {
    problems.push(`${answer.routes.length} routes, more than the ${inst.vehicles.count} vehicles`)
  }
  answer.routes.forEach((route, r) => {
    let x = inst.depot.x
    let y = inst.depot.y
    let clock = inst.depot.ready
    let load = 0
    for (const id of route) {
      const stop = byId.get(id)
      if (!stop) {
        problems.push(`route ${r}: unknown stop ${id}`)
        continue
      }
      if (seen.has(id)) problems.push(`stop ${id} is visited twice`)
      seen.add(id)
      const leg = Math.sqrt((stop.x - x) ** 2 + (stop.y - y) ** 2)
      distance += leg
      clock += leg
      if (clock < stop.ready) clock = stop.ready
      if (clock > stop.due + TOLERANCE)
        problems.push(`route ${r}: stop ${id} starts at ${clock}, due ${stop.due}`)
      clock += stop.service
      load += stop.demand
      x = stop.x
      y = stop.y
    }
    const back = Math.sqrt((inst.depot.x - x) ** 2 + (inst.depot.y - y) ** 2)
    distance += back
    clock += back
    if (clock > inst.depot.due + TOLERANCE)
      problems.push(`route ${r}: back at ${clock}, depot due ${inst.depot.due}`)
    if (load > inst.vehicles.capacity)
      problems.push(`route ${r}: load ${load} over capacity ${inst.vehicles.capacity}`)
  })
  for (const u of answer.unserved) {
    if (!byId.has(u.id)) problems.push(`unserved stop ${u.id} is unknown`)
    if (seen.has(u.id)) problems.push(`stop ${u.id} is both served and listed unserved`)
  }
  const listed = new Set(answer.unserved.map((u) => u.id))
  for (const s of inst.stops) {
    if (!seen.has(s.id) && !listed.has(s.id))
      problems.push(`stop ${s.id} is neither served nor listed unserved`)
  }
  return { ok: problems.length === 0, problems, distance, servedCount: seen.size }
}
