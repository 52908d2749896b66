// A small queue refresh a few seconds after a visit, so its string's new forecast and judgement need
// not wait for the 10-minute tick. The visit never waits for it: the schedule (jobs/schedule.ts) installs
// the refresh to run; without a schedule (tests, scripts) asking for one does nothing. Visits within
// the delay share one refresh.
export const REFRESH_SOON_MS = 5_000

let run: (() => unknown) | null = null
let timer: NodeJS.Timeout | undefined

/** Installs (or with null removes) what a refresh soon runs. */
export function onRefreshSoon(work: (() => unknown) | null): void {
  run = work
  if (!work) {
    clearTimeout(timer)
    timer = undefined
  }
}

/** Asks for a refresh in REFRESH_SOON_MS unless one is already waiting. */
export function refreshSoon(): void {
  if (!run || timer) return
  timer = setTimeout(() => {
    timer = undefined
    void run?.()
  }, REFRESH_SOON_MS)
  timer.unref()
}
