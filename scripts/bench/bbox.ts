// Benchmark: the map's bounding-box query over 20,000 strings through the real HTTP API.
// Target: p95 ≤ 100 ms on this machine. Uses its own throw-away database in .bench-data.
import { rng } from '../../seeds/demo/geo'
import { openBenchApp, percentiles } from './large-estate'

const bench = await openBenchApp()
try {
  const token = await bench.token('crew@example.org')
  const r = rng(99)
  const times: number[] = []
  let items = 0
  for (let i = 0; i < 300; i++) {
    // A phone viewport at street zoom (≈ 1.2 × 0.8 km) or, every tenth query, a whole-district view.
    const wide = i % 10 === 0
    const w = wide ? 0.2 : 0.018
    const h = wide ? 0.12 : 0.007
    const lng = -2.33 + r.next() * 0.4
    const lat = 54.02 + r.next() * 0.1
    const t0 = performance.now()
    const res = await fetch(`${bench.base}/strings?bbox=${lng},${lat},${lng + w},${lat + h}`, {
      headers: { authorization: `Bearer ${token}` },
    })
    const body = (await res.json()) as { items: unknown[] }
    times.push(performance.now() - t0)
    items += body.items.length
  }
  const { p50, p95 } = percentiles(times)
  console.log('| strings | queries | mean items | p50 ms | p95 ms | target p95 | ok |')
  console.log('| --- | --- | --- | --- | --- | --- | --- |')
  console.log(
    `| ${bench.count} | ${times.length} | ${Math.round(items / times.length)} | ${p50.toFixed(1)} | ${p95.toFixed(1)} | 100 | ${p95 <= 100 ? 'yes' : 'NO'} |`,
  )
} finally {
  await bench.close()
}
