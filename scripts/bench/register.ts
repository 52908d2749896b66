// Benchmark: pages of the register over 20,000 strings through the real HTTP API, sorted by every
// column, filtered and searched, at shallow and deep pages. Target (issue 10): p95 ≤ 100 ms a page.
import { registerSorts } from '../../shared/schemas/register'
import { rng } from '../../seeds/demo/geo'
import { openBenchApp, percentiles } from './large-estate'

const TARGET_MS = 100
const bench = await openBenchApp()
try {
  const token = await bench.token('manager@example.org')
  const sites = (await bench.knex('sites').select('id')).map((s) => s.id as number)
  const r = rng(7)
  const times: number[] = []
  for (let i = 0; i < 300; i++) {
    const q = new URLSearchParams({
      sort: registerSorts[i % registerSorts.length],
      dir: i % 2 ? 'desc' : 'asc',
      pageSize: '50',
      // Every fifth request goes deep into the register (the last pages of 400).
      page: String(i % 5 === 0 ? 350 + Math.floor(r.next() * 50) : 1 + Math.floor(r.next() * 20)),
    })
    if (i % 7 === 0) q.set('status', r.pick(['lit', 'watch', 'replace', 'dark']))
    if (i % 11 === 0) q.set('siteId', String(r.pick(sites)))
    if (i % 13 === 0) q.set('q', 'HS-0')
    const t0 = performance.now()
    const res = await fetch(`${bench.base}/register?${q}`, { headers: { authorization: `Bearer ${token}` } })
    if (res.status !== 200) throw new Error(`register answered ${res.status}`)
    await res.json()
    times.push(performance.now() - t0)
  }
  const { p50, p95 } = percentiles(times)
  console.log('| strings | pages | p50 ms | p95 ms | target p95 | ok |')
  console.log('| --- | --- | --- | --- | --- | --- |')
  console.log(
    `| ${bench.count} | ${times.length} | ${p50.toFixed(1)} | ${p95.toFixed(1)} | ${TARGET_MS} | ${p95 <= TARGET_MS ? 'yes' : 'NO'} |`,
  )
} finally {
  await bench.close()
}
