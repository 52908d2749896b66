import { defineStore } from 'pinia'
import { computed, ref, shallowRef, watch } from 'vue'
import { Notify } from 'quasar'
import { newKey, toIsolationBody, toVisitBody } from '../components/visit/visit-draft'
import { localStamp } from '../dates'
import {
  deleteEntries,
  groupEntries,
  listEntries,
  pruneSent,
  putEntry,
  queueSave,
} from '../offline/outbox-repo'
import type { OutboxEntry, QueuedSave, VisitEntry } from '../offline/outbox-types'
import { sendPending } from '../offline/sender'
import { recordVisitResult } from '../offline/string-cache'
import type { VisitDraft } from '../offline/visit-record'
import { useAuthStore } from './auth'
import { queueSeasonRecord, type SeasonSave } from '../offline/season-record'

const LOCK_NAME = 'lampwright-outbox'

/** The form's side of a save: its requests, built from what was typed, for the outbox to queue. */
function toQueuedSave(draft: VisitDraft): QueuedSave {
  return {
    groupId: draft.groupId ?? newKey(),
    isolation: toIsolationBody(draft),
    // The time of the save is when the work was done, however late the upload.
    visit: toVisitBody(draft, localStamp()),
    draft,
  }
}

// The offline outbox: every field write is stored on the phone first, then sent in order by one
// sender per browser (a Web Lock keeps two tabs from sending the same photo twice).
export const useOutboxStore = defineStore('outbox', () => {
  const entries = shallowRef<OutboxEntry[]>([])
  const online = ref(typeof navigator === 'undefined' ? true : navigator.onLine)
  const sending = ref(false)
  const sessionEnded = ref(false)
  const lastPassAt = ref<string | null>(null)
  const progress = ref<Record<string, number>>({})
  let retryTimer: ReturnType<typeof setTimeout> | null = null
  let running: Promise<void> | null = null
  let again = false
  let started = false

  const auth = useAuthStore()
  const mine = computed(() => entries.value.filter((e) => e.userId === auth.user?.id))
  const waiting = computed(() => mine.value.filter((e) => e.state !== 'sent'))
  const pending = computed(() => mine.value.filter((e) => e.state === 'pending'))
  const failed = computed(() => mine.value.filter((e) => e.state === 'failed'))
  const waitingVisits = computed(() => waiting.value.filter((e) => e.kind === 'visit').length)
  /** Entries queued by someone else on this phone; they go when that person signs in again. */
  const othersWaiting = computed(
    () => entries.value.filter((e) => e.userId !== auth.user?.id && e.state !== 'sent').length,
  )

  async function refresh(): Promise<void> {
    entries.value = await listEntries()
  }

  function pendingVisitsFor(stringId: number, exceptGroup: string | null = null): VisitEntry[] {
    return mine.value.filter(
      (e): e is VisitEntry =>
        e.kind === 'visit' && e.stringId === stringId && e.state !== 'sent' && e.groupId !== exceptGroup,
    )
  }

  async function save(draft: VisitDraft): Promise<string> {
    if (!auth.user) throw new Error('Sign in before saving.')
    const groupId = await queueSave(toQueuedSave(draft), auth.user.id)
    await refresh()
    return groupId
  }

  /** A commissioning, store inspection or take-down: on the phone first, then sent with its photos. */
  async function saveSeason(s: SeasonSave): Promise<void> {
    if (!auth.user) throw new Error('Sign in before saving.')
    await queueSeasonRecord(s, auth.user.id)
    await refresh()
    void flush()
  }

  function setProgress(key: string, fraction: number | null): void {
    const next = { ...progress.value }
    if (fraction === null) delete next[key]
    else next[key] = fraction
    progress.value = next
  }

  async function pass(): Promise<void> {
    const userId = auth.user?.id
    if (!userId) return
    const outcome = await sendPending({
      userId,
      onProgress: setProgress,
      onChange: () => void refresh(),
      onVisitSent: (e) => {
        if (e.result) void recordVisitResult(e.result)
      },
    })
    sessionEnded.value = outcome.stoppedBy === 'session'
    lastPassAt.value = new Date().toISOString()
    await refresh()
    if (outcome.failed > 0) {
      Notify.create({
        type: 'negative',
        message: 'The server refused an item in the outbox. Open the outbox to fix it.',
      })
    }
    scheduleRetry(outcome.nextAttemptAt)
  }

  function scheduleRetry(at: number | null): void {
    if (retryTimer) clearTimeout(retryTimer)
    retryTimer = null
    if (at !== null) retryTimer = setTimeout(() => void flush(), Math.max(1000, at - Date.now()))
  }

  /** Sends what can be sent now. Calls during a pass ask for one more pass instead of a second sender. */
  function flush(): Promise<void> {
    if (running) {
      again = true
      return running
    }
    sending.value = true
    const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined
    const once = () =>
      locks ? locks.request(LOCK_NAME, { ifAvailable: true }, (lock) => (lock ? pass() : undefined)) : pass()
    running = (async () => {
      try {
        do {
          again = false
          await once()
        } while (again)
      } catch (err) {
        console.error('outbox pass failed', err)
      } finally {
        running = null
        sending.value = false
      }
    })()
    return running
  }

  async function retry(key: string): Promise<void> {
    const all = await listEntries()
    const e = all.find((x) => x.key === key)
    if (!e) return
    await putEntry({ ...e, state: 'pending', nextAttemptAt: 0, lastError: null })
    await refresh()
    await flush()
  }

  /** A refused isolation or visit takes the rest of its save with it; a photo goes alone. */
  async function discard(key: string): Promise<void> {
    const e = entries.value.find((x) => x.key === key)
    if (!e) return
    const group = e.kind === 'photo' ? [e] : (await groupEntries(e.groupId)).filter((x) => x.state !== 'sent')
    await deleteEntries(group.map((x) => x.key))
    await refresh()
  }

  function start(): void {
    if (started) return
    started = true
    window.addEventListener('online', () => {
      online.value = true
      void sendNow()
    })
    window.addEventListener('offline', () => {
      online.value = false
    })
    document.addEventListener('visibilitychange', () => {
      if (document.visibilityState === 'visible') void flush()
    })
    // Send as soon as someone is signed in: at app start, and again after signing back in.
    watch(
      () => auth.user?.id,
      (id) => {
        if (id) void pruneSent().then(refresh).then(flush)
      },
      { immediate: true },
    )
  }

  /** Back-off waits are for a flaky server; when the phone says the signal is back, try at once. */
  async function sendNow(): Promise<void> {
    for (const e of await listEntries())
      if (e.state === 'pending' && e.nextAttemptAt > 0) await putEntry({ ...e, nextAttemptAt: 0 })
    await refresh()
    await flush()
  }

  return {
    entries,
    mine,
    waiting,
    pending,
    failed,
    waitingVisits,
    othersWaiting,
    online,
    sending,
    sessionEnded,
    lastPassAt,
    progress,
    refresh,
    pendingVisitsFor,
    save,
    saveSeason,
    flush,
    sendNow,
    retry,
    discard,
    start,
  }
})
