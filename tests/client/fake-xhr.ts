// A stand-in for the browser's XMLHttpRequest: records what was sent and answers when the test says.
type Handler = (() => void) | null

export class FakeXhr {
  static sent: FakeXhr[] = []
  method = ''
  url = ''
  headers: Record<string, string> = {}
  withCredentials = false
  timeout = 0
  status = 0
  statusText = ''
  responseText = ''
  body: unknown = null
  upload: { onprogress: ((e: { lengthComputable: boolean; loaded: number; total: number }) => void) | null } =
    { onprogress: null }
  onload: Handler = null
  onerror: Handler = null
  ontimeout: Handler = null
  onabort: Handler = null

  open(method: string, url: string): void {
    this.method = method
    this.url = url
  }
  setRequestHeader(name: string, value: string): void {
    this.headers[name] = value
  }
  send(body: unknown): void {
    this.body = body
    FakeXhr.sent.push(this)
  }
  abort(): void {
    this.onabort?.()
  }

  progress(loaded: number, total: number): void {
    this.upload.onprogress?.({ lengthComputable: true, loaded, total })
  }
  answer(status: number, body: unknown): void {
    this.status = status
    this.responseText = body === undefined ? '' : JSON.stringify(body)
    this.onload?.()
  }
}

/** A fetch stand-in answering `status` with `body` as JSON, and keeping each call. */
export function fakeFetch(status: number, body?: unknown) {
  const calls: { url: string; init: RequestInit }[] = []
  const fn = async (url: string, init: RequestInit) => {
    calls.push({ url, init })
    return new Response(body === undefined ? null : JSON.stringify(body), { status })
  }
  return { fn, calls }
}
