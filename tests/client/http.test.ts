import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { ApiError, request, setUnauthenticatedHandler } from '../../src/api/http'
import { FakeXhr, fakeFetch } from './fake-xhr'

// Status codes and the error shape are the app's own contract (DEVELOPERS.md, "Errors"); the rest is
// common practice, no source.
describe('the one HTTP client', () => {
  const ended = vi.fn()
  beforeEach(() => {
    FakeXhr.sent = []
    vi.stubGlobal('XMLHttpRequest', FakeXhr)
    setUnauthenticatedHandler(ended)
    ended.mockReset()
  })
  afterEach(() => {
    vi.unstubAllGlobals()
    vi.useRealTimers()
  })

  it('sends JSON with the caller’s headers and reads the answer', async () => {
    const { fn, calls } = fakeFetch(201, { id: 7 })
    vi.stubGlobal('fetch', fn)
    const res = await request<{ id: number }>('POST', '/visits', {
      body: { stringId: 3 },
      headers: { 'Idempotency-Key': 'k-1' },
    })
    expect(res).toEqual({ id: 7 })
    expect(calls[0].url).toBe('/api/v1/visits')
    expect(calls[0].init.credentials).toBe('include')
    expect(calls[0].init.headers).toMatchObject({
      'Idempotency-Key': 'k-1',
      'Content-Type': 'application/json',
    })
    expect(calls[0].init.body).toBe('{"stringId":3}')
  })

  it('turns the server’s error body into an ApiError with its code', async () => {
    const body = { error: { code: 'validation_failed', message: 'Bad count', details: { fields: [] } } }
    vi.stubGlobal('fetch', fakeFetch(400, body).fn)
    const err = await request('POST', '/visits', { body: {} }).catch((e: unknown) => e)
    expect(err).toBeInstanceOf(ApiError)
    expect(err).toMatchObject({ status: 400, code: 'validation_failed', message: 'Bad count' })
  })

  it('reports no connection as status 0, network_error', async () => {
    vi.stubGlobal('fetch', () => Promise.reject(new TypeError('Failed to fetch')))
    await expect(request('GET', '/strings/1')).rejects.toMatchObject({ status: 0, code: 'network_error' })
  })

  it('gives up after timeoutMs as a network error, so the outbox retries', async () => {
    vi.useFakeTimers()
    vi.stubGlobal('fetch', (_url: string, init: RequestInit) => {
      return new Promise((_resolve, reject) => {
        init.signal?.addEventListener('abort', () => reject(new DOMException('Aborted', 'AbortError')))
      })
    })
    const pending = request('POST', '/visits', { body: {}, timeoutMs: 30_000 }).catch((e: unknown) => e)
    await vi.advanceTimersByTimeAsync(30_000)
    expect(await pending).toMatchObject({ status: 0, code: 'network_error' })
  })

  it('lets the caller’s own abort through as an abort', async () => {
    vi.stubGlobal('fetch', (_url: string, init: RequestInit) => {
      return new Promise((_resolve, reject) => {
        init.signal?.addEventListener('abort', () => reject(new DOMException('Aborted', 'AbortError')))
      })
    })
    const ctrl = new AbortController()
    const pending = request('GET', '/strings', { signal: ctrl.signal }).catch((e: unknown) => e)
    ctrl.abort()
    expect(await pending).toMatchObject({ name: 'AbortError' })
  })

  it('reports an ended session, except where the caller says it will', async () => {
    const body = { error: { code: 'unauthenticated', message: 'Sign in' } }
    vi.stubGlobal('fetch', fakeFetch(401, body).fn)
    await expect(request('GET', '/queue')).rejects.toMatchObject({ status: 401 })
    expect(ended).toHaveBeenCalledTimes(1)
    await expect(request('POST', '/visits', { reportSessionEnd: false })).rejects.toMatchObject({
      status: 401,
    })
    await expect(request('GET', '/auth/me')).rejects.toMatchObject({ status: 401 })
    expect(ended).toHaveBeenCalledTimes(1)
  })

  it('says so when a success answer is not JSON', async () => {
    vi.stubGlobal('fetch', async () => new Response('<html>', { status: 200 }))
    await expect(request('GET', '/config')).rejects.toMatchObject({ code: 'bad_response' })
  })

  it('uploads a form with progress, leaving the multipart type to the browser', async () => {
    const seen: number[] = []
    const form = new FormData()
    form.append('photo', new Blob(['x']), 'a.jpg')
    const pending = request<{ items: unknown[] }>('POST', '/visits/4/photos', {
      body: form,
      headers: { 'Idempotency-Key': 'p-1' },
      onUploadProgress: (f) => seen.push(f),
    })
    const xhr = FakeXhr.sent[0]
    expect(xhr.url).toBe('/api/v1/visits/4/photos')
    expect(xhr.withCredentials).toBe(true)
    expect(xhr.body).toBe(form)
    expect(xhr.headers['Idempotency-Key']).toBe('p-1')
    expect(xhr.headers['Content-Type']).toBeUndefined()
    xhr.progress(50, 200)
    xhr.progress(200, 200)
    xhr.answer(201, { items: [] })
    expect(await pending).toEqual({ items: [] })
    expect(seen).toEqual([0.25, 1])
  })

  it('reads upload failures the same way as any other answer', async () => {
    const pending = request('POST', '/visits/4/photos', { body: new FormData(), onUploadProgress: () => {} })
    FakeXhr.sent[0].answer(413, { error: { code: 'file_too_large', message: 'Too big' } })
    await expect(pending).rejects.toMatchObject({ status: 413, code: 'file_too_large' })
    const dropped = request('POST', '/visits/4/photos', { body: new FormData(), onUploadProgress: () => {} })
    FakeXhr.sent[1].onerror?.()
    await expect(dropped).rejects.toMatchObject({ status: 0, code: 'network_error' })
  })
})
