import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import type { OutboxEntry } from '../../src/offline/outbox-types'
import { FakeXhr } from './fake-xhr'

// The outbox in memory instead of IndexedDB, so the sender can be driven from outside.
const store = new Map<string, OutboxEntry>()
vi.mock('../../src/offline/outbox-repo', () => ({
  listEntries: async () => [...store.values()].sort((a, b) => a.seq - b.seq),
  putEntry: async (e: OutboxEntry) => void store.set(e.key, e),
}))
const { sendPending } = await import('../../src/offline/sender')
const { setUnauthenticatedHandler } = await import('../../src/api/http')

const base = {
  groupId: 'g-1',
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
const visitBody = {
  stringId: 9,
  failedFound: 1,
  replaced: 1,
  fuseReplaced: false,
  darkOnArrival: false,
  leaveMadeSafe: false,
  visitedAt: '2026-12-03T20:00:00+00:00',
}

function queueOneSave(): void {
  const entries: OutboxEntry[] = [
    { ...base, kind: 'isolation', key: 'iso-key', seq: 1, body: { stringId: 9, steps: [] } },
    { ...base, kind: 'visit', key: 'visit-key', seq: 2, body: visitBody, draft: {} as never, result: null },
    {
      ...base,
      kind: 'photo',
      key: 'photo-key',
      seq: 3,
      visitKey: 'visit-key',
      fileName: 'a.jpg',
      file: new Blob(['x']),
      result: null,
    },
  ]
  for (const e of entries) store.set(e.key, e)
}

const hooks = (progress: [string, number | null][]) => ({
  userId: 5,
  onProgress: (key: string, f: number | null) => void progress.push([key, f]),
  onChange: () => undefined,
  onVisitSent: () => undefined,
})

describe('the outbox sender over the one HTTP client', () => {
  beforeEach(() => {
    store.clear()
    FakeXhr.sent = []
    vi.stubGlobal('XMLHttpRequest', FakeXhr)
  })
  afterEach(() => vi.unstubAllGlobals())

  it('sends isolation, visit, then photo, each under its own key, with photo progress', async () => {
    queueOneSave()
    const posted: { url: string; key: string }[] = []
    vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
      posted.push({ url, key: (init.headers as Record<string, string>)['Idempotency-Key'] })
      const body = url.endsWith('/visits') ? { id: 41, string: { id: 9 } } : { id: 40 }
      return new Response(JSON.stringify(body), { status: 201 })
    })
    const progress: [string, number | null][] = []
    const pass = sendPending(hooks(progress))
    await vi.waitFor(() => expect(FakeXhr.sent).toHaveLength(1))
    const photo = FakeXhr.sent[0]
    photo.progress(1, 2)
    photo.answer(201, { items: [{ id: 1 }] })
    const outcome = await pass

    expect(posted).toEqual([
      { url: '/api/v1/isolations', key: 'iso-key' },
      { url: '/api/v1/visits', key: 'visit-key' },
    ])
    expect(photo.url).toBe('/api/v1/visits/41/photos')
    expect(photo.headers['Idempotency-Key']).toBe('photo-key')
    expect(progress).toEqual([
      ['photo-key', 0],
      ['photo-key', 0.5],
      ['photo-key', null],
    ])
    expect(outcome).toMatchObject({ sent: 3, failed: 0, stoppedBy: null })
    expect([...store.values()].every((e) => e.state === 'sent')).toBe(true)
  })

  it('stops at an ended session without sending the person to sign in', async () => {
    queueOneSave()
    const ended = vi.fn()
    setUnauthenticatedHandler(ended)
    vi.stubGlobal('fetch', async () => {
      const body = { error: { code: 'unauthenticated', message: 'Sign in again' } }
      return new Response(JSON.stringify(body), { status: 401 })
    })
    const outcome = await sendPending(hooks([]))
    expect(outcome.stoppedBy).toBe('session')
    expect(ended).not.toHaveBeenCalled()
    expect(store.get('iso-key')?.state).toBe('pending')
  })
})
