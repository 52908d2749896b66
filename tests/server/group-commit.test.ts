// The group-commit queue on its own (no database): what goes together, in what order, and whose error
// reaches whom. The visits that ride on it are tested in visit-batches.test.ts.
import { describe, expect, it } from 'vitest'
import { groupCommit, type Settled } from '../../server/services/group-commit'

interface Send {
  id: number
  on: string
}

/** A queue whose store records each batch and answers each send after a tick, or refuses id 13. */
function recorder(o: { maxBatch: number; maxRunning: number; fail?: boolean }) {
  const batches: number[][] = []
  const send = groupCommit<Send, number>(
    async (items) => {
      batches.push(items.map((i) => i.id))
      await new Promise((r) => setTimeout(r, 5))
      if (o.fail) throw new Error('database went away')
      return items.map((i): Settled<number> =>
        i.id === 13 ? { ok: false, error: new Error('refused') } : { ok: true, value: i.id * 10 },
      )
    },
    { maxBatch: o.maxBatch, maxRunning: o.maxRunning, clash: (a, b) => a.on === b.on },
  )
  return { batches, send }
}

describe('groupCommit', () => {
  it('starts a lone send at once and puts the sends that arrive meanwhile in the next batch', async () => {
    const { batches, send } = recorder({ maxBatch: 10, maxRunning: 1 })
    const answers = await Promise.all([1, 2, 3, 4].map((id) => send({ id, on: `s${id}` })))
    expect(answers).toEqual([10, 20, 30, 40])
    expect(batches).toEqual([[1], [2, 3, 4]])
  })

  it('never puts two sends on one subject in a batch, and keeps their order', async () => {
    const { batches, send } = recorder({ maxBatch: 10, maxRunning: 1 })
    await Promise.all([
      send({ id: 1, on: 'a' }),
      send({ id: 2, on: 'a' }),
      send({ id: 3, on: 'b' }),
      send({ id: 4, on: 'a' }),
      send({ id: 5, on: 'c' }),
    ])
    expect(batches).toEqual([[1], [2, 3, 5], [4]])
  })

  it('holds batches to their size', async () => {
    const { batches, send } = recorder({ maxBatch: 2, maxRunning: 1 })
    await Promise.all([1, 2, 3, 4, 5, 6].map((id) => send({ id, on: `s${id}` })))
    expect(batches).toEqual([[1], [2, 3], [4, 5], [6]])
  })

  it('gives a refused send its own error and the others their answers', async () => {
    const { send } = recorder({ maxBatch: 10, maxRunning: 1 })
    const settled = await Promise.allSettled([12, 13, 14].map((id) => send({ id, on: `s${id}` })))
    expect(settled.map((s) => s.status)).toEqual(['fulfilled', 'rejected', 'fulfilled'])
    expect((settled[1] as PromiseRejectedResult).reason.message).toBe('refused')
  })

  it('gives every send of a failed batch its error, and goes on with the next', async () => {
    const failing = recorder({ maxBatch: 10, maxRunning: 1, fail: true })
    const settled = await Promise.allSettled([1, 2, 3].map((id) => failing.send({ id, on: `s${id}` })))
    expect(settled.every((s) => s.status === 'rejected')).toBe(true)
    expect(failing.batches).toEqual([[1], [2, 3]])
  })

  it('runs as many batches at once as allowed', async () => {
    const { batches, send } = recorder({ maxBatch: 10, maxRunning: 2 })
    await Promise.all([1, 2, 3, 4].map((id) => send({ id, on: `s${id}` })))
    expect(batches).toEqual([[1], [2], [3, 4]])
  })
})
