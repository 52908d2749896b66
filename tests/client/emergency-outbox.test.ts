// The crew's emergency log goes through the same outbox as visits: the log under its own
// Idempotency-Key, then its photo once the server has given the log an id; a refused log holds back
// its photo.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import type { OutboxEntry } from '../../src/offline/outbox-types'
import { FakeXhr } from './fake-xhr'

const store = new Map<string, OutboxEntry>()
vi.mock('../../src/offline/outbox-repo', () => ({
  listEntries: async () => [...store.values()].sort((a, b) => a.seq - b.seq),
  putEntry: async (e: OutboxEntry) => void store.set(e.key, e),
}))
const { sendPending } = await import('../../src/offline/sender')

const base = {
  groupId: 'log-key',
  userId: 5,
  stringId: 9,
  assetTag: 'HS-009',
  createdAt: '2026-12-03T20:00:00.000Z',
  state: 'pending' as const,
  attempts: 0,
  nextAttemptAt: 0,
  lastError: null,
  sentAt: null,
}
const body = { found: 'Cable down.', did: 'Cut it free.', outcome: 'fixed' as const }

function queueLog(): void {
  const entries: OutboxEntry[] = [
    { ...base, kind: 'emergency', key: 'log-key', seq: 1, itemId: 12, body, result: null },
    {
      ...base,
      kind: 'photo',
      key: 'photo-key',
      seq: 2,
      visitKey: '',
      logKey: 'log-key',
      fileName: 'a.jpg',
      file: new Blob(['x']),
      result: null,
    },
  ]
  for (const e of entries) store.set(e.key, e)
}
const hooks = {
  userId: 5,
  onProgress: () => undefined,
  onChange: () => undefined,
  onVisitSent: () => undefined,
}

describe('emergency logs in the outbox', () => {
  beforeEach(() => {
    store.clear()
    FakeXhr.sent = []
    vi.stubGlobal('XMLHttpRequest', FakeXhr)
  })
  afterEach(() => vi.unstubAllGlobals())

  it('sends the log, then its photo to the id the server gave', async () => {
    queueLog()
    const posted: { url: string; key: string }[] = []
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      posted.push({ url, key: (init.headers as Record<string, string>)['Idempotency-Key'] })
      return new Response(JSON.stringify({ id: 77, itemId: 12 }), { status: 201 })
    })
    const pass = sendPending(hooks)
    await vi.waitFor(() => expect(FakeXhr.sent).toHaveLength(1))
    FakeXhr.sent[0].answer(201, { id: 77 })
    const outcome = await pass
    expect(posted).toEqual([{ url: '/api/v1/queue/12/emergency-log', key: 'log-key' }])
    expect(FakeXhr.sent[0].url).toBe('/api/v1/emergency-logs/77/photo')
    expect(FakeXhr.sent[0].headers['Idempotency-Key']).toBe('photo-key')
    expect(outcome).toMatchObject({ sent: 2, failed: 0 })
    expect(store.get('photo-key')).toMatchObject({ state: 'sent', file: null })
  })

  it('marks a refused log failed and keeps its photo back', async () => {
    queueLog()
    vi.stubGlobal('fetch', async () => {
      const error = { error: { code: 'not_emergency', message: 'Log a visit instead.' } }
      return new Response(JSON.stringify(error), { status: 409 })
    })
    const outcome = await sendPending(hooks)
    expect(outcome).toMatchObject({ sent: 0, failed: 1 })
    expect(store.get('log-key')).toMatchObject({ state: 'failed', lastError: { code: 'not_emergency' } })
    expect(store.get('photo-key')?.state).toBe('pending')
    expect(FakeXhr.sent).toHaveLength(0)
  })
})
