// npm test: the same set-up as npm start on a throw-away database (.test-data, DB_TEST_PORT),
// then lint, type checks, the client build, and every vitest project (shared, server, e2e).
import { spawnSync } from 'node:child_process'
import { openDatabase, prepareDatabase, buildClientIfStale } from './setup'

const port = Number(process.env.DB_TEST_PORT ?? 3308)
const db = await openDatabase({ dir: '.test-data', port, name: 'lampwright_test', fresh: true })
let code = 0
const run = (label: string, cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env) => {
  if (code !== 0) return
  console.log(`\n▶ ${label}`)
  const r = spawnSync(cmd, args, { stdio: 'inherit', env })
  if (r.status !== 0) {
    console.error(`✗ ${label} failed`)
    code = r.status ?? 1
  }
}
try {
  await prepareDatabase(db.url, { seed: 'always' })
  run('lint', 'npm', ['run', '--silent', 'lint'])
  run('type checks', 'npm', ['run', '--silent', 'typecheck'])
  if (code === 0) buildClientIfStale()
  const extra = process.argv.slice(2)
  run('tests', 'npx', ['vitest', 'run', ...extra], {
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: db.url,
    JWT_SECRET: 'test-secret-that-is-long-enough-0123456789',
  })
} catch (err) {
  console.error(err)
  code = 1
} finally {
  await db.stop()
}
console.log(code === 0 ? '\nAll checks passed.' : '\nSome checks failed.')
process.exit(code)
