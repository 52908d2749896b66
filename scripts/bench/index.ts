// npm run bench: every benchmark in turn; each prints its own table against its target.
import { spawnSync } from 'node:child_process'

const benches = [
  'scripts/bench/forecast.ts',
  'scripts/bench/routing.ts',
  'scripts/bench/vrptw.ts',
  'scripts/bench/bbox.ts',
  'scripts/bench/register.ts',
  'scripts/bench/import.ts',
  'scripts/bench/event-loop.ts',
  'scripts/bench/queue-refresh.ts',
  'scripts/bench/api.ts',
  'scripts/bench/web.ts',
]
let failed = false
for (const b of benches) {
  console.log(`\n## ${b}\n`)
  const r = spawnSync('node', ['--import', 'tsx', b], {
    stdio: 'inherit',
    env: { ...process.env, LOG_LEVEL: 'silent' },
  })
  if (r.status !== 0) failed = true
}
process.exit(failed ? 1 : 0)
