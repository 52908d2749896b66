// Benchmark: the map's bounding-box query over 20,000 strings through the real HTTP API, one client
// at a time: the full list (GET /strings?bbox=…, used by search and "near me") and the map's compact
// answer (GET /strings/map, grouped on the server below zoom 15). Target: p95 ≤ 100 ms for the list
// on this machine, ≤ 50 ms for the map (issue 13 part 7). Uses its own throw-away database in .bench-data.
import { rng } from '../../seeds/demo/geo'
import { openBenchApp, percentiles } from './large-estate'

const bench = await openBenchApp()
try {
  const token = await bench.token('crew@example.org')
  console.log('| route | strings | queries | mean marks | mean kB | p50 ms | p95 ms | target p95 | ok |')
  console.log('| --- | --- | --- | --- | --- | --- | --- | --- | --- |')
  for (const [route, target] of [
    ['/strings', 100],
    ['/strings/map', 50],
  ] as const) {
    const r = rng(99)
    const times: number[] = []
    let marks = 0
    let bytes = 0
    for (let i = 0; i < 300; i++) {
      // A phone viewport at street zoom (≈ 1.2 × 0.8 km) or, every tenth query, a whole-district view.
      const wide = i % 10 === 0
      const w = wide ? 0.2 : 0.018
      const h = wide ? 0.12 : 0.007
      const lng = -2.33 + r.next() * 0.4
      const lat = 54.02 + r.next() * 0.1
      const t0 = performance.now()
      const res = await fetch(
        `${bench.base}${route}?bbox=${lng},${lat},${lng + w},${lat + h}&zoom=${wide ? 12 : 16}`,
        { headers: { authorization: `Bearer ${token}` } },
      )
      const text = await res.text()
      times.push(performance.now() - t0)
      const body = JSON.parse(text) as { items: unknown[]; clusters?: unknown[] }
      marks += body.items.length + (body.clusters?.length ?? 0)
      bytes += text.length
    }
    const { p50, p95 } = percentiles(times)
    console.log(
      `| ${route} | ${bench.count} | ${times.length} | ${Math.round(marks / times.length)} | ${(bytes / times.length / 1000).toFixed(1)} | ${p50.toFixed(1)} | ${p95.toFixed(1)} | ${target} | ${p95 <= target ? 'yes' : 'NO'} |`,
    )
  }
} finally {
  await bench.close()
}
