// npm run bench:api-cost — what one request of each load-budget route costs, measured in ways a busy
// machine does not distort much: SQL statements per request (counted on the Knex instance), CPU ms
// per request of this process (app and client together; the health route's row is the floor) and
// answer bytes. The app runs in this process over the bench database (scripts/bench/large-estate.ts:
// the demo town tiled to 20,000 strings) with the queue items every dark or replace-now string needs.
// Requests are logged as in production, to requests.log in the bench's data folder.
import './file-log'
import { randomUUID } from 'node:crypto'
import type { Knex } from 'knex'
import { loadavg } from 'node:os'
import { rng } from '../../seeds/demo/geo'
import { openBenchApp } from './large-estate'
import { syncStateItems } from '../../server/services/queue/strings'
import { refreshForecasts } from '../../server/jobs/refresh-forecasts'

const N = Number(process.env.COST_REQUESTS ?? 100)

const bench = await openBenchApp()
try {
  // The stored forecasts the server's start-up refresh makes (the string page reads its lead from them).
  await refreshForecasts(bench.knex, new Date(), { full: true })
  await syncStateItems(bench.knex)
  let statements = 0
  // Transactions re-emit their statements on the instance they came from.
  ;(bench.knex as Knex).on('query', () => statements++)
  const tokens = {
    crew: await bench.token('crew@example.org'),
    sup: await bench.token('supervisor@example.org'),
  }
  const ids = (await bench.knex('strings').whereNull('archivedAt').select('id')).map((s) => s.id as number)
  const r = rng(7)
  const anyString = () => ids[Math.floor(r.next() * ids.length)]
  const viewport = (wide: boolean) => {
    const [w, h] = wide ? [0.2, 0.12] : [0.018, 0.007]
    const lng = -2.33 + r.next() * 0.4
    const lat = 54.02 + r.next() * 0.1
    return `bbox=${lng},${lat},${lng + w},${lat + h}&zoom=${wide ? 12 : 16}`
  }
  type Req = { path: string; token?: string; body?: unknown }
  const rows: {
    name: string
    n: number
    statements: number
    cpu: number
    ms: number
    kb: number
    codes: string
  }[] = []
  async function run(name: string, n: number, make: () => Req) {
    const codes = new Map<number, number>()
    let bytes = 0
    const s0 = statements
    const c0 = process.cpuUsage()
    const t0 = performance.now()
    for (let i = 0; i < n; i++) {
      const q = make()
      const res = await fetch(`${bench.base}${q.path}`, {
        method: q.body ? 'POST' : 'GET',
        headers: {
          ...(q.token ? { authorization: `Bearer ${q.token}` } : {}),
          ...(q.body ? { 'content-type': 'application/json', 'idempotency-key': randomUUID() } : {}),
        },
        body: q.body ? JSON.stringify(q.body) : undefined,
      })
      bytes += (await res.arrayBuffer()).byteLength
      codes.set(res.status, (codes.get(res.status) ?? 0) + 1)
    }
    const c = process.cpuUsage(c0)
    rows.push({
      name,
      n,
      statements: (statements - s0) / n,
      cpu: (c.user + c.system) / 1000 / n,
      ms: (performance.now() - t0) / n,
      kb: bytes / n / 1000,
      codes: [...codes].map(([k, v]) => `${k}×${v}`).join(' '),
    })
  }
  // Warm-up (JIT, pool), not reported.
  await run('warm-up', 20, () => ({ path: `/strings/${anyString()}`, token: tokens.crew }))
  rows.length = 0
  await run('health', N, () => ({ path: '/health' }))
  await run('visit logging', N, () => ({
    path: '/visits',
    token: tokens.crew,
    body: { stringId: anyString(), failedFound: 0, replaced: 0, notes: 'Patrol: all lit.' },
  }))
  await run('string detail, random strings', N, () => ({
    path: `/strings/${anyString()}`,
    token: tokens.crew,
  }))
  const same = ids.slice(0, 10)
  let k = 0
  await run('string detail, 10 strings again and again', N, () => ({
    path: `/strings/${same[k++ % same.length]}`,
    token: tokens.crew,
  }))
  await run('map bbox, street view (full list route)', N, () => ({
    path: `/strings?${viewport(false)}`,
    token: tokens.crew,
  }))
  await run('map bbox, district view (full list route)', Math.ceil(N / 5), () => ({
    path: `/strings?${viewport(true)}`,
    token: tokens.crew,
  }))
  await run('map, street view (compact, zoom 16)', N, () => ({
    path: `/strings/map?${viewport(false)}`,
    token: tokens.crew,
  }))
  await run('map, district view (compact, zoom 12)', N, () => ({
    path: `/strings/map?${viewport(true)}`,
    token: tokens.crew,
  }))
  await run('queue, first page', Math.ceil(N / 10), () => ({ path: '/queue', token: tokens.sup }))
  await run('queue, page 40', Math.ceil(N / 10), () => ({ path: '/queue?page=40', token: tokens.sup }))
  const open = await bench.knex('queueItems').whereIn('state', ['open']).count({ n: '*' })
  console.log(
    `\n${bench.count} strings, ${open[0].n} open queue items, load average ${loadavg()
      .map((v) => v.toFixed(2))
      .join(' / ')}\n`,
  )
  console.log(
    '| route | requests | SQL statements / request | CPU ms / request | wall ms / request | kB / answer | answers |',
  )
  console.log('| --- | --- | --- | --- | --- | --- | --- |')
  for (const x of rows)
    console.log(
      `| ${x.name} | ${x.n} | ${x.statements.toFixed(1)} | ${x.cpu.toFixed(2)} | ${x.ms.toFixed(1)} | ${x.kb.toFixed(1)} | ${x.codes} |`,
    )
} finally {
  await bench.close()
}
