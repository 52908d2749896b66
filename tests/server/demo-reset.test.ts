// `npm run demo:reset` deletes everything, so it refuses outside demo mode and on an external
// database unless given --yes-wipe-everything.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDb, type Db } from '../../server/db'
import { resetRefusal, WIPE_FLAG } from '../../scripts/demo-reset'
import { runScript, stackLines } from './start-helpers'

let db: Db
const tables = ['users', 'strings', 'visits', 'certificates', 'audit_log']

async function counts() {
  const out: Record<string, number> = {}
  for (const t of tables) out[t] = Number((await db(t).count({ n: '*' }))[0].n)
  return out
}

beforeAll(() => {
  db = createDb(process.env.DATABASE_URL ?? '')
})
afterAll(() => db.destroy())

describe('demo:reset refusal', () => {
  it.each([
    ['DEMO_MODE=false', { DEMO_MODE: 'false' }, /DEMO_MODE is false/],
    ['an external DATABASE_URL, even in demo mode', { DEMO_MODE: 'true' }, /external database/],
  ])(
    'refuses with %s: one line, non-zero exit, nothing deleted',
    async (_label, env, reason) => {
      const before = await counts()
      expect(before.users).toBeGreaterThan(0)
      const run = runScript('scripts/demo-reset.ts', { DATABASE_URL: process.env.DATABASE_URL ?? '', ...env })
      expect(await run.exited).not.toBe(0)
      const out = run.output().trim()
      expect(out).toMatch(reason)
      expect(out).toContain(WIPE_FLAG)
      expect(out.split('\n')).toHaveLength(1)
      expect(stackLines(out)).toEqual([])
      expect(await counts()).toEqual(before)
    },
    60_000,
  )

  it('runs on the private database in demo mode, or anywhere with the flag', () => {
    expect(resetRefusal({}, [])).toBeNull()
    expect(resetRefusal({ DEMO_MODE: 'false' }, [])).toMatch(/refused/)
    expect(
      resetRefusal({ DEMO_MODE: 'false', DATABASE_URL: 'mysql://x@db.example/x' }, [WIPE_FLAG]),
    ).toBeNull()
  })
})
