// The last copy of each day's run, per user, for opening tonight's run without signal.
import type { MyRun } from '../api/runs'
import { offlineDb } from './db'

export async function saveRun(userId: number, run: MyRun): Promise<void> {
  const db = await offlineDb()
  await db.put('runs', {
    id: `${userId}:${run.date}`,
    userId,
    date: run.date,
    run,
    savedAt: new Date().toISOString(),
  })
}

export async function cachedRun(
  userId: number,
  date: string,
): Promise<{ run: MyRun; savedAt: string } | null> {
  const row = await (await offlineDb()).get('runs', `${userId}:${date}`)
  return row ? { run: row.run, savedAt: row.savedAt } : null
}
