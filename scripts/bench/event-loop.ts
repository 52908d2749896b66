// Event-loop benchmark: `node --import tsx scripts/bench/event-loop.ts`. The largest forecast the cap
// allows and a 1,000-stop matrix tour run at once on the worker pool while the loop's delay is
// sampled; target from issue 8 (item 7): /health within 100 ms meanwhile, so the loop's longest
// stall ≤ 100 ms. The same two jobs run on the loop are shown for comparison (no target).
import { monitorEventLoopDelay } from 'node:perf_hooks'
import { forecast } from '../../shared/engine/forecast'
import { solveTour } from '../../shared/routing/solve'
import { closeWorkers, runInPool, workerThreads } from '../../server/workers/pool'

// The heaviest shape under the cap: 50 classes of mixed ratings, no shunt opening, 2,000,000 lamp-trials.
const largestForecast = {
  supplyVolts: 120,
  ratedLifeHours: 3000,
  lamps: Array.from({ length: 50 }, (_, i) => ({ count: 40, ratedVolts: 0.06 + i * 0.001, ratedAmps: 0.3 })),
  shuntFailProbability: 0,
  trials: 1000,
}

function tour(n: number) {
  let s = 7
  const rnd = () => (s = (s * 16807) % 2147483647) / 2147483647
  const pts = Array.from({ length: n }, () => [rnd() * 10_000, rnd() * 10_000])
  return {
    stops: pts.map((_, i) => ({ id: `s${i}` })),
    matrix: pts.map((a) => pts.map((b) => Math.round(Math.hypot(a[0] - b[0], a[1] - b[1])))),
  }
}

const TARGET_MS = 100
const body = tour(1000)
const timeout = { timeoutMs: 30_000 }
// Warm the pool so thread start-up (loading TypeScript through tsx) is not counted.
await runInPool('forecast', { ...largestForecast, trials: 1 }, timeout)

const delay = monitorEventLoopDelay({ resolution: 5 })
delay.enable()
const started = performance.now()
await Promise.all([runInPool('forecast', largestForecast, timeout), runInPool('solve', body, timeout)])
const pooledMs = performance.now() - started
delay.disable()
await closeWorkers()
const maxStall = delay.max / 1e6

const inline = performance.now()
forecast(largestForecast)
solveTour(body)
const inlineMs = performance.now() - inline

const ok = maxStall <= TARGET_MS
console.log(`worker threads: ${workerThreads()}`)
console.log(
  `forecast + 1,000-stop tour on the pool  ${pooledMs.toFixed(0).padStart(6)} ms, longest loop stall ` +
    `${maxStall.toFixed(1)} ms  target ≤ ${TARGET_MS} ms: ${ok ? 'ok' : 'OVER TARGET'}`,
)
console.log(
  `the same on the event loop              ${inlineMs.toFixed(0).padStart(6)} ms, all of it a stall`,
)
process.exit(ok ? 0 : 1)
