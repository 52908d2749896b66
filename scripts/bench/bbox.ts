// Benchmark: the map's bounding-box query over 20,000 strings through the real HTTP API.
// Target: p95 ≤ 100 ms on this machine. Uses its own throw-away database in .bench-data.
import { openDatabase, prepareDatabase, throwAwayDatabaseUrl } from '../setup'
import { createDb } from '../../server/db'
import { createApp } from '../../server/app'
import { loadConfig } from '../../server/config'
import type { Mailer } from '../../server/mail/mailer'
import { rng } from '../../seeds/demo/geo'

const TARGET = 20_000
// The benchmark wipes its database: an external one only when its name says so.
throwAwayDatabaseUrl(process.env)
const db = await openDatabase({
  dir: '.bench-data',
  port: Number(process.env.DB_BENCH_PORT ?? 3309),
  name: 'lampwright_bench',
})
try {
  await prepareDatabase(db.url, { seed: 'always' })
  const knex = createDb(db.url)
  // Copies of the demo town tiled over a wider area, as a contractor serving many towns would have.
  const base = await knex('strings').select('*')
  const r = rng(99)
  let n = base.length
  for (let copy = 1; n < TARGET; copy++) {
    const dLat = Math.floor(copy / 8) * 0.03
    const dLng = (copy % 8) * 0.05
    const rows = base.slice(0, TARGET - n).map((s) => {
      const { id: _id, createdAt: _c, updatedAt: _u, ...rest } = s
      return {
        ...rest,
        assetTag: `${s.assetTag}-${copy}`,
        lat: s.lat + dLat,
        lng: s.lng + dLng,
        line: s.line ? JSON.stringify(s.line) : null,
        status: r.pick(['lit', 'lit', 'lit', 'watch', 'replace', 'dark']),
      }
    })
    for (let i = 0; i < rows.length; i += 500) await knex('strings').insert(rows.slice(i, i + 500))
    n += rows.length
  }
  const count = Number((await knex('strings').count({ n: '*' }))[0].n)
  const config = loadConfig({
    ...process.env,
    DATABASE_URL: db.url,
    JWT_SECRET: 'bench-secret-long-enough-0123456789',
    LOG_LEVEL: 'silent',
  })
  const mailer: Mailer = { send: async () => ({ id: 0, sent: false }) }
  const app = createApp(
    { db: knex, config, jwtSecret: config.JWT_SECRET!, mailer, uploadDir: '.bench-data/uploads' },
    { clientDir: '/none' },
  )
  const server = app.listen(0)
  const port = (server.address() as { port: number }).port
  const signIn = await fetch(`http://127.0.0.1:${port}/api/v1/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'crew@example.org', password: 'lampwright' }),
  })
  const { token } = (await signIn.json()) as { token: string }
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
    const res = await fetch(
      `http://127.0.0.1:${port}/api/v1/strings?bbox=${lng},${lat},${lng + w},${lat + h}`,
      { headers: { authorization: `Bearer ${token}` } },
    )
    const body = (await res.json()) as { items: unknown[] }
    times.push(performance.now() - t0)
    items += body.items.length
  }
  server.close()
  await knex.destroy()
  times.sort((a, b) => a - b)
  const p = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))]
  console.log('| strings | queries | mean items | p50 ms | p95 ms | target p95 | ok |')
  console.log('| --- | --- | --- | --- | --- | --- | --- |')
  const p95 = p(0.95)
  console.log(
    `| ${count} | ${times.length} | ${Math.round(items / times.length)} | ${p(0.5).toFixed(1)} | ${p95.toFixed(1)} | 100 | ${p95 <= 100 ? 'yes' : 'NO'} |`,
  )
} finally {
  if (db.startedHere) await db.stop()
}
