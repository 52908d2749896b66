// npm run bench:api — the API's load budget (issue 13 part 7). autocannon against npm start's API
// processes (node:cluster, WORKERS, default one per core) serving the demo town tiled to 20,000
// strings in a throw-away database (BENCH_DATA_DIR, default .bench-data; DB_BENCH_PORT, default 3309).
// Every route below runs in turn in the same run, ROUNDS times (default 2), each for BENCH_SECONDS
// (default 10) with BENCH_CONNECTIONS (default 10) connections; the health route runs first and last
// in each round and its mean is the reference rate. Each route starts once the machine is quiet (at
// most a minute's wait, settle() below): the visits leave a forecast refresh behind them. The load
// generator shares the machine with the server and MariaDB, so the load average is printed beside
// every round.
import { randomUUID } from 'node:crypto'
import { availableParallelism, cpus, loadavg } from 'node:os'
import autocannon, { type RequestStep } from 'autocannon'
import { rng } from '../../seeds/demo/geo'
import { openBenchDatabase, signIn } from './large-estate'
import { startBenchServer } from './api-server'
import { REFRESH_SOON_MS } from '../../server/services/queue/refresh-soon'

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10)
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 10)
const ROUNDS = Number(process.env.ROUNDS ?? 2)
const WORKERS = process.env.WORKERS ?? String(availableParallelism())
/** BENCH_ONLY=visit,health: only the routes whose names contain one of these words. */
const ONLY = (process.env.BENCH_ONLY ?? '').split(',').filter(Boolean)

interface Scenario {
  name: string
  path: string
  connections: number
  token: 'crew' | 'supervisor' | null
  /** Builds each request (a new visit key, another string, another viewport). */
  step?: (req: RequestStep) => RequestStep
}

interface Row {
  name: string
  connections: number
  rate: number
  p50: number
  p95: number
  p99: number
  /** Mean size of a 2xx answer, kB (uncompressed: autocannon asks for no compression). */
  kb: number
  failed: number
  statuses: string
}

const pct = (sorted: number[], q: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] : NaN

async function measure(
  base: string,
  s: Scenario,
  tokens: Record<string, string>,
  seconds = SECONDS,
): Promise<Row> {
  const headers: Record<string, string> = s.token ? { authorization: `Bearer ${tokens[s.token]}` } : {}
  const times: number[] = []
  let bytes = 0
  const instance = autocannon({
    url: base.replace(/\/api\/v1$/, ''),
    connections: s.connections,
    duration: seconds,
    timeout: 30,
    requests: [
      { method: 'GET', path: `/api/v1${s.path}`, headers, ...(s.step ? { setupRequest: s.step } : {}) },
    ],
  })
  // Every response's own time, so that p95 (which autocannon's summary lacks) comes from the same data.
  instance.on('response', (_client: unknown, status: number, b: number, ms: number) => {
    if (status < 200 || status >= 300) return
    times.push(ms)
    bytes += b
  })
  const r = await instance
  times.sort((a, b) => a - b)
  const statuses = Object.entries(r.statusCodeStats)
    .map(([code, { count }]) => `${code}×${count}`)
    .join(' ')
  return {
    name: s.name,
    connections: s.connections,
    rate: times.length / r.duration,
    p50: pct(times, 0.5),
    p95: pct(times, 0.95),
    p99: pct(times, 0.99),
    kb: times.length ? bytes / times.length / 1000 : 0,
    failed: r.non2xx + r.errors,
    statuses: r.errors ? `${statuses} errors×${r.errors}` : statuses,
  }
}

function scenarios(ids: number[]): Scenario[] {
  const all = everyScenario(ids)
  return ONLY.length ? all.filter((s) => ONLY.some((w) => s.name.includes(w))) : all
}

function everyScenario(ids: number[]): Scenario[] {
  const r = rng(99)
  const anyString = () => ids[Math.floor(r.next() * ids.length)]
  const c = CONNECTIONS
  const health: Scenario = { name: 'health', path: '/health', connections: c, token: null }
  // The viewports of scripts/bench/bbox.ts: a phone at street zoom (16), every tenth a whole
  // district (zoom 12), through the map's compact route (GET /strings/map, grouped below zoom 15).
  let n = 0
  const bbox = (req: RequestStep): RequestStep => {
    const wide = n++ % 10 === 0
    const [w, h] = wide ? [0.2, 0.12] : [0.018, 0.007]
    const lng = -2.33 + r.next() * 0.4
    const lat = 54.02 + r.next() * 0.1
    return {
      ...req,
      path: `/api/v1/strings/map?bbox=${lng},${lat},${lng + w},${lat + h}&zoom=${wide ? 12 : 16}`,
    }
  }
  return [
    health,
    {
      name: 'visit logging',
      path: '/visits',
      connections: c,
      token: 'crew',
      step: (req) => ({
        ...req,
        method: 'POST',
        headers: { ...req.headers, 'content-type': 'application/json', 'idempotency-key': randomUUID() },
        body: JSON.stringify({
          stringId: anyString(),
          failedFound: 0,
          replaced: 0,
          notes: 'Patrol: all lit.',
        }),
      }),
    },
    {
      name: 'string detail',
      path: '/strings/1',
      connections: c,
      token: 'crew',
      step: (req) => ({ ...req, path: `/api/v1/strings/${anyString()}` }),
    },
    { name: 'map bbox', path: '/strings/map', connections: c, token: 'crew', step: bbox },
    { name: 'map bbox, one phone', path: '/strings/map', connections: 1, token: 'crew', step: bbox },
    { name: 'queue (first page of 50)', path: '/queue', connections: c, token: 'supervisor' },
    { ...health, name: 'health (again)' },
  ]
}

/** Share of all cores busy over the next `ms` milliseconds (from the kernel's per-core counters). */
async function busyShare(ms: number): Promise<number> {
  const sum = () =>
    cpus().reduce(
      (a, c) => {
        const t = c.times
        const all = t.user + t.nice + t.sys + t.idle + t.irq
        return { idle: a.idle + t.idle, all: a.all + all }
      },
      { idle: 0, all: 0 },
    )
  const a = sum()
  await new Promise((r) => setTimeout(r, ms))
  const b = sum()
  return 1 - (b.idle - a.idle) / Math.max(1, b.all - a.all)
}

/**
 * Waits until the machine is quiet before a route's turn: a visit asks for a forecast refresh
 * REFRESH_SOON_MS later, so the refresh the visit phase's last visits ask for starts after that phase
 * has ended and runs on the server's worker threads; a route measured meanwhile would be measured
 * beside it, not beside the health route. Quiet: two seconds in a row under a fifth of the cores
 * busy, waited for at most a minute.
 */
async function settle(): Promise<void> {
  await new Promise((r) => setTimeout(r, REFRESH_SOON_MS + 1000))
  const until = Date.now() + 60_000
  let quiet = 0
  while (Date.now() < until && quiet < 2) quiet = (await busyShare(1000)) < 0.2 ? quiet + 1 : 0
}

const ms = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : '—')

/** The targets (issue 13 part 7), judged on one round's rows. */
function targets(row: Row, healthRate: number): { target: string; met: boolean | null } {
  switch (row.name) {
    case 'visit logging': {
      const share = row.rate / healthRate
      return {
        target: `≥ 800 req/s, p99 ≤ 50 ms, ≥ 40 % of health (here ${(share * 100).toFixed(0)} %)`,
        met: row.rate >= 800 && row.p99 <= 50 && share >= 0.4 && row.failed === 0,
      }
    }
    case 'string detail':
      return { target: '≥ 500 req/s', met: row.rate >= 500 && row.failed === 0 }
    case 'map bbox':
    case 'map bbox, one phone':
      return { target: 'p95 ≤ 50 ms', met: row.p95 <= 50 && row.failed === 0 }
    default:
      return { target: row.name.startsWith('health') ? 'reference' : '—', met: null }
  }
}

function printRound(round: number, rows: Row[], load: [number[], number[]]) {
  const health = rows.filter((r) => r.name.startsWith('health'))
  const healthRate = health.reduce((a, r) => a + r.rate, 0) / health.length
  const la = (l: number[]) => l.map((v) => v.toFixed(2)).join(' / ')
  console.log(`\n### Round ${round}: load average (1/5/15 min) before ${la(load[0])}, after ${la(load[1])}\n`)
  console.log(
    '| route | conn. | req/s (2xx) | p50 ms | p95 ms | p99 ms | kB/answer | answers | target | met |',
  )
  console.log('| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |')
  for (const row of rows) {
    const { target, met } = targets(row, healthRate)
    const ok = met === null ? '' : met ? 'yes' : 'NO'
    console.log(
      `| ${row.name} | ${row.connections} | ${row.rate.toFixed(0)} | ${ms(row.p50)} | ${ms(row.p95)} | ${ms(row.p99)} | ${row.kb.toFixed(1)} | ${row.statuses} | ${target} | ${ok} |`,
    )
  }
}

const db = await openBenchDatabase()
try {
  const ids = (await db.knex('strings').whereNull('archivedAt').select('id')).map((s) => s.id as number)
  console.log(`Bench database: ${db.count} strings. Starting the API as ${WORKERS} process(es)...`)
  const server = await startBenchServer(db, WORKERS)
  try {
    const tokens = {
      crew: await signIn(server.base, 'crew@example.org'),
      supervisor: await signIn(server.base, 'supervisor@example.org'),
    }
    console.log(
      `\n## API load, ${SECONDS} s a route, ${db.count} strings, ${WORKERS} API process(es), ${availableParallelism()} cores\n`,
    )
    // One unreported pass of every route (2 s each) so that JIT warm-up is not measured.
    for (const s of scenarios(ids)) await measure(server.base, { ...s }, tokens, 2)
    for (let round = 1; round <= ROUNDS; round++) {
      const before = loadavg()
      const rows: Row[] = []
      for (const s of scenarios(ids)) {
        await settle()
        rows.push(await measure(server.base, s, tokens))
      }
      printRound(round, rows, [before, loadavg()])
    }
  } finally {
    await server.stop()
  }
} finally {
  await db.close()
}
