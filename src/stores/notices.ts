import { defineStore } from 'pinia'
import { ref } from 'vue'
import { noticesApi, type Notice } from '../api/notices'

/** How often the bell asks for new notices while the page is visible (no websockets: a gentle poll). */
export const NOTICE_POLL_MS = 60_000

// The signed-in user's notices for the bell in the header: the newest page and the unread count.
export const useNoticesStore = defineStore('notices', () => {
  const items = ref<Notice[]>([])
  const unread = ref(0)
  const loading = ref(false)
  const error = ref<string | null>(null)
  let timer: ReturnType<typeof setInterval> | null = null

  async function refresh(): Promise<void> {
    loading.value = true
    try {
      const page = await noticesApi.list(1)
      items.value = page.items
      unread.value = page.unread
      error.value = null
    } catch (err) {
      // The bell keeps what it had; the next poll tries again.
      error.value = (err as Error).message
    } finally {
      loading.value = false
    }
  }

  /** Marks the given notices read (the ones shown when the list was opened). */
  async function markRead(ids: number[]): Promise<void> {
    if (!ids.length) return
    try {
      const res = await noticesApi.markRead(ids)
      unread.value = res.unread
      const at = new Date().toISOString()
      items.value = items.value.map((n) => (ids.includes(n.id) && !n.readAt ? { ...n, readAt: at } : n))
    } catch (err) {
      error.value = (err as Error).message
    }
  }

  function onVisibility(): void {
    if (document.visibilityState === 'visible') void refresh()
  }

  /** Loads now, then every NOTICE_POLL_MS while the page is visible, and on coming back to it. */
  function start(): void {
    if (timer) return
    void refresh()
    timer = setInterval(() => {
      if (document.visibilityState === 'visible') void refresh()
    }, NOTICE_POLL_MS)
    document.addEventListener('visibilitychange', onVisibility)
  }

  function stop(): void {
    if (timer) clearInterval(timer)
    timer = null
    document.removeEventListener('visibilitychange', onVisibility)
    items.value = []
    unread.value = 0
  }

  return { items, unread, loading, error, refresh, markRead, start, stop }
})
