// npm test: the same set-up as npm start on a throw-away database (.test-data, DB_TEST_PORT),
// then lint, type checks, the client build, and every vitest project (shared, server, e2e).
import { spawnSync } from 'node:child_process'
import { resolve } from 'node:path'
import { openDatabase, prepareDatabase, buildClientIfStale, throwAwayDatabaseUrl } from './setup'
import { reportStartError } from '../server/start-errors'

const port = Number(process.env.DB_TEST_PORT ?? 3308)
// TEST_DATA_DIR lets two checkouts (or two developers' runs) test side by side on their own databases;
// TEST_QUICK=1 skips lint, type checks and the client build while iterating on one test file.
const dir = process.env.TEST_DATA_DIR ?? '.test-data'
const quick = process.env.TEST_QUICK === '1'
// The test database is wiped and reseeded: an external one only when its name says it is for tests.
try {
  throwAwayDatabaseUrl(process.env)
} catch (err) {
  reportStartError(err)
  process.exit(1)
}
// scratch: tests may create empty `lampwright_test_…` databases (e.g. a first start of a real install).
const db = await openDatabase({
  dir,
  port,
  name: 'lampwright_test',
  fresh: true,
  portSetting: 'DB_TEST_PORT',
  scratch: true,
}).catch((err) => {
  reportStartError(err)
  return process.exit(1)
})
let code = 0
const run = (
  label: string,
  cmd: string,
  args: string[],
  env: NodeJS.ProcessEnv = process.env,
  always = false,
) => {
  if (code !== 0 && !always) return
  console.log(`\n▶ ${label}`)
  const r = spawnSync(cmd, args, { stdio: 'inherit', env })
  if (r.status !== 0) {
    console.error(`✗ ${label} failed`)
    code = r.status ?? 1
  }
}
try {
  await prepareDatabase(db.url, { seed: 'always' })
  if (!quick) {
    run('lint', 'npm', ['run', '--silent', 'lint'])
    run('type checks', 'npm', ['run', '--silent', 'typecheck'])
    if (code === 0) buildClientIfStale()
  }
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: db.url,
    JWT_SECRET: 'test-secret-that-is-long-enough-0123456789',
    // The test database holds the demo, and the tests expect demo mode.
    DEMO_MODE: 'true',
    // Where the private test database keeps its files, for the tests of its permissions.
    TEST_DB_DIR: resolve(dir),
    DB_TEST_PORT: String(port),
  }
  // One project at a time, each on freshly seeded demo data, so no suite sees another's writes.
  // `node scripts/test.ts -- <args>` passes a literal '--' that vitest would read as "files follow".
  const extra = process.argv.slice(2).filter((a, i) => !(i === 0 && a === '--'))
  const projects = extra.length ? [null] : ['shared', 'server', 'e2e']
  const ready = code === 0
  for (const project of ready ? projects : []) {
    if (project === 'e2e') await prepareDatabase(db.url, { seed: 'always' })
    run(
      project ? `tests: ${project}` : 'tests',
      'npx',
      ['vitest', 'run', ...(project ? ['--project', project] : extra)],
      env,
      true,
    )
  }
} catch (err) {
  console.error(err)
  code = 1
} finally {
  await db.stop()
}
console.log(code === 0 ? '\nAll checks passed.' : '\nSome checks failed.')
process.exit(code)
