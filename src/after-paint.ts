// Work a screen does not need to draw (the service worker, the outbox's first send, the bell's first
// poll, saving the run's strings for offline use) waits until the screen has painted and the browser
// is idle, so it does not compete with the first screen's downloads and scripts (issue 14).

type IdleWindow = Window & {
  requestIdleCallback?: (cb: () => void, opts: { timeout: number }) => number
}

/** Runs `task` after the next paint, once the main thread is idle (at the latest after `timeoutMs`). */
export function afterPaint(task: () => void, timeoutMs = 2000): void {
  const w = window as IdleWindow
  requestAnimationFrame(() =>
    setTimeout(() => {
      if (w.requestIdleCallback) w.requestIdleCallback(task, { timeout: timeoutMs })
      else setTimeout(task, 50)
    }, 0),
  )
}
