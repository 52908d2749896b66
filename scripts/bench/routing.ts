// Route-optimiser benchmark on TSPLIB instances (run: node --import tsx scripts/bench/routing.ts).
// Each instance is solved the way the API solves it: stops shuffled and renamed (a fixed seed per
// instance, so the run repeats), the body checked by the API's schema, then `solveTour` with no
// tuning hooks (plain Euclidean search, default seed). The tour is measured under TSPLIB's rounding.
// Targets (issue 16): every instance within 1 % of its published optimum; each instance up to 439
// nodes within 2 s on one core, rl1304 within 10 s.
import { pathToFileURL } from 'node:url'
import { createRandom, randomInt } from '../../shared/routing/prng'
import { solveTour } from '../../shared/routing/solve'
import { tourRequestSchema } from '../../shared/schemas/routing'
import {
  readTsplib,
  TSPLIB_OPTIMA,
  tsplibTourLength,
  type TsplibInstance,
} from '../../tests/fixtures/tsplib/tsplib'

export interface RoutingBenchRow {
  instance: string
  nodes: number
  optimum: number
  length: number
  excessPercent: number
  /** wall-clock and this process's CPU time (user + system) for the solve */
  ms: number
  cpuMs: number
}

export interface RoutingBenchResult {
  rows: RoutingBenchRow[]
  /** mean excess over instances with at most 439 nodes */
  meanExcessPercent: number
  maxExcessPercent: number
}

const SMALL_LIMIT_NODES = 439
// Search budgets stay under the time targets (2 s and 10 s) with room for setup.
const SMALL_TIME_LIMIT_MS = 1500
const LARGE_TIME_LIMIT_MS = 8000

/** The instance's stops in a seeded random order under new names, so neither the file's order nor
 * its numbering can help the solver; `original` maps a new name back to the TSPLIB node id. */
export function disguise(instance: TsplibInstance, seed: number) {
  const random = createRandom(seed)
  const nodes = instance.nodes.slice()
  for (let i = nodes.length - 1; i > 0; i--) {
    const j = randomInt(random, i + 1)
    ;[nodes[i], nodes[j]] = [nodes[j], nodes[i]]
  }
  const original = new Map<string, string>()
  const stops = nodes.map((node, i) => {
    const id = `stop-${((i * 7919 + seed) % 1_000_003).toString(36)}-${i}`
    original.set(id, node.id)
    return { id, x: node.x, y: node.y }
  })
  return { stops, original }
}

export function runRoutingBench(instances = Object.keys(TSPLIB_OPTIMA), seed = 20261202): RoutingBenchResult {
  const rows: RoutingBenchRow[] = []
  for (const name of instances) {
    const instance = readTsplib(name)
    const nodes = instance.nodes.length
    const timeLimitMs = nodes <= SMALL_LIMIT_NODES ? SMALL_TIME_LIMIT_MS : LARGE_TIME_LIMIT_MS
    const { stops, original } = disguise(instance, seed + nodes)
    const t0 = performance.now()
    const cpu0 = process.cpuUsage()
    const result = solveTour(tourRequestSchema.parse({ stops, timeLimitMs }))
    const cpu = process.cpuUsage(cpu0)
    const ms = performance.now() - t0
    const order = result.order.map((id) => original.get(id) ?? `unknown ${id}`)
    // A tour that skips or repeats a node would look short: refuse to score it.
    if (new Set(order).size !== nodes || order.length !== nodes) throw new Error(`${name}: bad tour`)
    const length = tsplibTourLength(instance, order)
    const optimum = TSPLIB_OPTIMA[name]
    rows.push({
      instance: name,
      nodes,
      optimum,
      length,
      excessPercent: (100 * (length - optimum)) / optimum,
      ms,
      cpuMs: (cpu.user + cpu.system) / 1000,
    })
  }
  const small = rows.filter((r) => r.nodes <= SMALL_LIMIT_NODES)
  const meanExcessPercent = small.reduce((sum, r) => sum + r.excessPercent, 0) / Math.max(1, small.length)
  const maxExcessPercent = Math.max(0, ...rows.map((r) => r.excessPercent))
  return { rows, meanExcessPercent, maxExcessPercent }
}

export function formatRoutingBench({
  rows,
  meanExcessPercent,
  maxExcessPercent,
}: RoutingBenchResult): string {
  const lines = [
    '| instance | nodes | optimum | our length | excess % | time ms | CPU ms |',
    '| --- | ---: | ---: | ---: | ---: | ---: | ---: |',
    ...rows.map(
      (r) =>
        `| ${r.instance} | ${r.nodes} | ${r.optimum} | ${r.length} | ${r.excessPercent.toFixed(2)} | ${Math.round(r.ms)} | ${Math.round(r.cpuMs)} |`,
    ),
    '',
    `Mean excess (instances ≤ ${SMALL_LIMIT_NODES} nodes): ${meanExcessPercent.toFixed(2)} %; ` +
      `worst instance: ${maxExcessPercent.toFixed(2)} % (target ≤ 1 % each)`,
  ]
  return lines.join('\n')
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const names = process.argv.slice(2)
  console.log(formatRoutingBench(runRoutingBench(names.length > 0 ? names : undefined)))
}
