// Tonight's run (or another day's): from the server when it answers, else the copy on the phone.
// Online, every string on the run is saved to the phone so the visit form works without signal.
import { ref, shallowRef } from 'vue'
import { ApiError } from '../../api/http'
import { runsApi, type MyRun } from '../../api/runs'
import { cachedRun, saveRun } from '../../offline/run-cache'
import { isUnreachable, prefetchStrings } from '../../offline/string-cache'
import { useAuthStore } from '../../stores/auth'
import { addDays, appTimeZone, today } from '../../dates'
import { shiftDate } from '../../../shared/local-time'
import { afterPaint } from '../../after-paint'

export function useRun() {
  const auth = useAuthStore()
  /** null: tonight, as the server counts days. */
  const date = ref<string | null>(null)
  const data = shallowRef<MyRun | null>(null)
  const loading = ref(false)
  const error = shallowRef<ApiError | null>(null)
  /** When the run shown is the phone's copy: the time it was saved. */
  const offlineSavedAt = ref<string | null>(null)
  const ready = ref<{ done: number; total: number } | null>(null)
  let generation = 0

  async function fromPhone(userId: number): Promise<{ run: MyRun; savedAt: string } | null> {
    if (date.value) return cachedRun(userId, date.value)
    // "Tonight" offline: after midnight on a shift that crosses it, still yesterday's run.
    const yesterday = addDays(today(), -1)
    const prev = await cachedRun(userId, yesterday)
    const shift = prev?.run.run
    if (
      shift &&
      shiftDate(new Date(), { start: shift.shiftStart, end: shift.shiftEnd }, appTimeZone()) === yesterday
    )
      return prev
    return cachedRun(userId, today())
  }

  async function load(): Promise<void> {
    const userId = auth.user?.id
    if (!userId) return
    const mine = ++generation
    loading.value = true
    error.value = null
    try {
      const run = await runsApi.mine(date.value ?? undefined)
      if (mine !== generation) return
      data.value = run
      if (navigator.onLine) {
        offlineSavedAt.value = null
        await saveRun(userId, run).catch(() => undefined)
        // After the run has drawn: the crew sees the run first, the copies follow (issue 14).
        afterPaint(() => void prefetch(run, mine))
      } else {
        // The service worker answered from its cache: say so.
        offlineSavedAt.value = (await fromPhone(userId))?.savedAt ?? run.date
      }
    } catch (err) {
      if (mine !== generation) return
      const copy = isUnreachable(err) ? await fromPhone(userId) : null
      if (copy) {
        data.value = copy.run
        offlineSavedAt.value = copy.savedAt
      } else {
        data.value = null
        error.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
      }
    } finally {
      if (mine === generation) loading.value = false
    }
  }

  async function prefetch(run: MyRun, mine: number): Promise<void> {
    const ids = (run.run?.stops ?? []).map((s) => s.stringId).filter((id): id is number => id !== null)
    const total = new Set(ids).size
    ready.value = total ? { done: 0, total } : null
    await prefetchStrings(ids, (done) => {
      if (mine === generation) ready.value = { done, total }
    })
  }

  function setDate(next: string | null): void {
    date.value = next
    void load()
  }

  return { date, data, loading, error, offlineSavedAt, ready, load, setDate }
}
