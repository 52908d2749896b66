// Group commit: writes that arrive at the same moment share one transaction. A busy API process gets
// many sends while a transaction is open; each of them alone would pay for its own BEGIN, reads,
// statements and COMMIT, and on a small server those statements, not the work, are most of a write's
// cost. The queue starts a batch at once when a slot is free (a lone send never waits for company),
// and the sends that arrive meanwhile go together in the next one. Each send still gets its own
// answer or its own error.

export type Settled<R> = { ok: true; value: R } | { ok: false; error: unknown }

export interface GroupOptions<I> {
  /** Most sends in one batch. */
  maxBatch: number
  /** Batches in flight at once per process. */
  maxRunning: number
  /** Two sends that may not share a batch (the same string): the later one waits for the next. */
  clash: (a: I, b: I) => boolean
}

interface Waiting<I, R> {
  item: I
  resolve: (r: R) => void
  reject: (e: unknown) => void
}

/**
 * A function that queues one send and answers its result. `run` stores a batch, in order, and
 * answers one Settled per send; if it throws, every send of the batch gets that error.
 */
export function groupCommit<I, R>(
  run: (items: I[]) => Promise<Settled<R>[]>,
  o: GroupOptions<I>,
): (item: I) => Promise<R> {
  const waiting: Waiting<I, R>[] = []
  let running = 0

  /** The next batch: the oldest sends that do not clash with one already taken, in arrival order. */
  function take(): Waiting<I, R>[] {
    const batch: Waiting<I, R>[] = []
    for (let i = 0; i < waiting.length && batch.length < o.maxBatch;) {
      const w = waiting[i]
      if (batch.some((b) => o.clash(b.item, w.item))) i++
      else batch.push(...waiting.splice(i, 1))
    }
    return batch
  }

  async function runBatch(batch: Waiting<I, R>[]) {
    try {
      const results = await run(batch.map((w) => w.item))
      batch.forEach((w, i) => {
        const r = results[i]
        if (r.ok) w.resolve(r.value)
        else w.reject(r.error)
      })
    } catch (err) {
      for (const w of batch) w.reject(err)
    }
  }

  function pump() {
    while (running < o.maxRunning && waiting.length) {
      const batch = take()
      running++
      void runBatch(batch).finally(() => {
        running--
        pump()
      })
    }
  }

  return (item) =>
    new Promise<R>((resolve, reject) => {
      waiting.push({ item, resolve, reject })
      pump()
    })
}
