// Independent check of a day plan, written apart from the planner (shared/routing/plan*.ts) and
// sharing no code with it: it replays each crew's stops from the plain PlanInput (leave the depot at
// shift start, drive, wait for the access window, work, drive back) and checks shift ends, access
// windows, platform needs and that every item is either on one run or listed as not planned.
// Travel is the input's matrix when given, else great-circle distance × detour factor at the given
// speed, rounded up to whole minutes (the planner's documented convention, shared/routing/plan-model.ts).

export interface CheckCrew {
  id: string
  depot: { lat: number; lng: number }
  shiftStart: string
  shiftEnd: string
  hasPlatform: boolean
}
export interface CheckItem {
  id: string
  lat: number
  lng: number
  serviceMinutes: number
  window?: { from: string; to: string }
  needsPlatform?: boolean
}
export interface CheckInput {
  crews: CheckCrew[]
  items: CheckItem[]
  settings?: { speedKmh?: number; detourFactor?: number; matrixMinutes?: number[][] }
}
/** A crew's stops in order; `times` when the plan states them (arrive/start/depart 'HH:mm'). */
export interface CheckRun {
  crewId: string
  itemIds: string[]
  times?: { arrive: string; start: string; depart: string }[]
  returnAt?: string
}

export interface PlanCheck {
  ok: boolean
  problems: string[]
  served: number
  travelMinutes: number
  /** sum over crews with work of (back at the depot − shift start) */
  durationMinutes: number
  /** per crew with work: (back − shift start) in minutes */
  durations: number[]
}

const DAY = 1440
const R = 6_371_008.8 // IUGG mean Earth radius, metres (Moritz, Geodetic Reference System 1980)

const clock = (hhmm: string) => {
  const [h, m] = hhmm.split(':').map(Number)
  return h * 60 + m
}
const text = (t: number) => {
  const m = ((Math.round(t) % DAY) + DAY) % DAY
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`
}

function greatCircleMetres(a: { lat: number; lng: number }, b: { lat: number; lng: number }): number {
  const rad = Math.PI / 180
  const h =
    Math.sin(((b.lat - a.lat) * rad) / 2) ** 2 +
    Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(((b.lng - a.lng) * rad) / 2) ** 2
  return 2 * R * Math.asin(Math.min(1, Math.sqrt(h)))
}

/** Earliest time ≥ t whose clock reading lies in the window, or Infinity within two days. */
function earliestIn(t: number, w: { from: string; to: string } | undefined, dayStart: number): number {
  if (!w) return t
  const a = clock(w.from)
  const b = clock(w.to) < a ? clock(w.to) + DAY : clock(w.to)
  let best = Infinity
  for (let k = -1; k <= 2; k++) {
    const lo = dayStart + a + k * DAY
    const hi = dayStart + b + k * DAY
    if (hi >= t) best = Math.min(best, Math.max(lo, t))
  }
  return best
}

export function checkPlan(input: CheckInput, runs: CheckRun[], unassignedIds: string[]): PlanCheck {
  const { crews, items, settings } = input
  const C = crews.length
  const place = (k: number) => (k < C ? crews[k].depot : items[k - C])
  const speed = settings?.speedKmh ?? 25
  const detour = settings?.detourFactor ?? 1.4
  const minutes = (a: number, b: number) =>
    a === b
      ? 0
      : Math.ceil(
          (settings?.matrixMinutes
            ? settings.matrixMinutes[a][b]
            : (greatCircleMetres(place(a), place(b)) / 1000) * detour * (60 / speed)) - 1e-9,
        )
  const itemIndex = new Map(items.map((it, i) => [it.id, i]))
  const problems: string[] = []
  const seen = new Set<string>()
  let travelMinutes = 0
  const durations: number[] = []
  for (const run of runs) {
    const c = crews.findIndex((k) => k.id === run.crewId)
    if (c < 0) {
      problems.push(`unknown crew ${run.crewId}`)
      continue
    }
    const crew = crews[c]
    const start = clock(crew.shiftStart)
    const end = clock(crew.shiftEnd) <= start ? clock(crew.shiftEnd) + DAY : clock(crew.shiftEnd)
    let t = start
    let at = c
    run.itemIds.forEach((id, p) => {
      const i = itemIndex.get(id)
      if (i === undefined) return void problems.push(`crew ${crew.id}: unknown item ${id}`)
      if (seen.has(id)) problems.push(`item ${id} is on more than one stop`)
      seen.add(id)
      const item = items[i]
      if (item.needsPlatform && !crew.hasPlatform)
        problems.push(`crew ${crew.id}: item ${id} needs a platform`)
      const leg = minutes(at, C + i)
      travelMinutes += leg
      const arrive = t + leg
      const begin = earliestIn(arrive, item.window, start - (start % DAY))
      if (item.window && begin > arrive + DAY)
        problems.push(`crew ${crew.id}: item ${id} has no window after ${text(arrive)}`)
      t = begin + item.serviceMinutes
      at = C + i
      const stated = run.times?.[p]
      if (stated) {
        const mine = [text(arrive), text(begin), text(t)]
        const theirs = [stated.arrive, stated.start, stated.depart]
        if (mine.join() !== theirs.join())
          problems.push(`crew ${crew.id}: item ${id} stated ${theirs.join('/')}, replayed ${mine.join('/')}`)
      }
    })
    if (run.itemIds.length === 0) continue
    const back = minutes(at, c)
    travelMinutes += back
    t += back
    if (t > end) problems.push(`crew ${crew.id}: back at ${text(t)}, shift ends ${crew.shiftEnd}`)
    if (run.returnAt !== undefined && run.returnAt !== text(t))
      problems.push(`crew ${crew.id}: stated back at ${run.returnAt}, replayed ${text(t)}`)
    durations.push(t - start)
  }
  for (const id of unassignedIds) {
    if (!itemIndex.has(id)) problems.push(`unassigned item ${id} is unknown`)
    if (seen.has(id)) problems.push(`item ${id} is both planned and listed unassigned`)
  }
  const listed = new Set(unassignedIds)
  for (const it of items)
    if (!seen.has(it.id) && !listed.has(it.id)) problems.push(`item ${it.id} is neither planned nor listed`)
  return {
    ok: problems.length === 0,
    problems,
    served: seen.size,
    travelMinutes,
    durationMinutes: durations.reduce((s, d) => s + d, 0),
    durations,
  }
}
