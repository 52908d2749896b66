// Route-optimiser benchmark on TSPLIB instances (run: node --import tsx scripts/bench/routing.ts).
// Targets from the routing brief: mean excess ≤ 2 % over instances up to 439 nodes, each within
// 2 s on one core; rl1304 within 10 s.
import { pathToFileURL } from 'node:url'
import { solveTour } from '../../shared/routing/solve'
import { readTsplib, TSPLIB_OPTIMA, tsplibTourLength } from '../../tests/fixtures/tsplib/tsplib'

export interface RoutingBenchRow {
  instance: string
  nodes: number
  optimum: number
  length: number
  excessPercent: number
  ms: number
}

export interface RoutingBenchResult {
  rows: RoutingBenchRow[]
  /** mean excess over instances with at most 439 nodes */
  meanExcessPercent: number
}

const SMALL_LIMIT_NODES = 439
// Search budgets stay under the targets (2 s and 10 s) with room for setup.
const SMALL_TIME_LIMIT_MS = 1500
const LARGE_TIME_LIMIT_MS = 8000

// TSPLIB EUC_2D rule nint(sqrt(dx² + dy²)) (Reinelt 1991), used inside the search too.
const nint = (d: number) => Math.floor(d + 0.5)

export function runRoutingBench(instances = Object.keys(TSPLIB_OPTIMA)): RoutingBenchResult {
  const rows: RoutingBenchRow[] = []
  for (const name of instances) {
    const instance = readTsplib(name)
    const nodes = instance.nodes.length
    const timeLimitMs = nodes <= SMALL_LIMIT_NODES ? SMALL_TIME_LIMIT_MS : LARGE_TIME_LIMIT_MS
    const t0 = performance.now()
    const result = solveTour({ stops: instance.nodes, timeLimitMs }, { roundDistance: nint })
    const ms = performance.now() - t0
    // A tour that skips or repeats a node would look short: refuse to score it.
    if (new Set(result.order).size !== nodes || result.order.length !== nodes)
      throw new Error(`${name}: bad tour`)
    const length = tsplibTourLength(instance, result.order)
    const optimum = TSPLIB_OPTIMA[name]
    rows.push({
      instance: name,
      nodes,
      optimum,
      length,
      excessPercent: (100 * (length - optimum)) / optimum,
      ms,
    })
  }
  const small = rows.filter((r) => r.nodes <= SMALL_LIMIT_NODES)
  const meanExcessPercent = small.reduce((sum, r) => sum + r.excessPercent, 0) / Math.max(1, small.length)
  return { rows, meanExcessPercent }
}

export function formatRoutingBench({ rows, meanExcessPercent }: RoutingBenchResult): string {
  const lines = [
    '| instance | nodes | optimum | our length | excess % | time ms |',
    '| --- | ---: | ---: | ---: | ---: | ---: |',
    ...rows.map(
      (r) =>
        `| ${r.instance} | ${r.nodes} | ${r.optimum} | ${r.length} | ${r.excessPercent.toFixed(2)} | ${Math.round(r.ms)} |`,
    ),
    '',
    `Mean excess (instances ≤ ${SMALL_LIMIT_NODES} nodes): ${meanExcessPercent.toFixed(2)} %`,
  ]
  return lines.join('\n')
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const names = process.argv.slice(2)
  console.log(formatRoutingBench(runRoutingBench(names.length > 0 ? names : undefined)))
}
