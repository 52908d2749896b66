// One long-lived worker thread that re-encodes photos in turn, so uploads never block the event loop.
import { Worker } from 'node:worker_threads'
import { HttpError } from '../../errors'
import type { AcceptedMime } from './checks'
import type { Encoded } from './image'

interface Pending {
  resolve: (e: Encoded) => void
  reject: (err: Error) => void
}

let worker: Worker | undefined
let nextId = 1
const pending = new Map<number, Pending>()

/** A dead worker fails its jobs; the next upload starts a fresh one. */
function failAll(w: Worker, err: Error) {
  if (worker !== w) return // an 'exit' after 'error': already handled
  for (const p of pending.values()) p.reject(err)
  pending.clear()
  worker = undefined
}

// Buffers arrive as plain Uint8Arrays after structured cloning.
const asBuffer = (u: Uint8Array) => Buffer.from(u.buffer, u.byteOffset, u.byteLength)

function getWorker(): Worker {
  if (worker) return worker
  // The worker is TypeScript, and on Node 20 a worker's entry file is loaded without the tsx hook even
  // with --import tsx (ERR_UNKNOWN_FILE_EXTENSION), so a one-line script loads it through tsx's API.
  const tsx = import.meta.resolve('tsx/esm/api')
  const entry = new URL('./reencode-worker.ts', import.meta.url).href
  const boot = `import(${JSON.stringify(tsx)}).then((m) => m.tsImport(${JSON.stringify(entry)}, ${JSON.stringify(entry)}))`
  const w = new Worker(boot, { eval: true })
  w.on(
    'message',
    (m: {
      id: number
      ok?: Encoded
      err?: { status: number; code: string; message: string; details?: unknown }
    }) => {
      const p = pending.get(m.id)
      if (!p) return
      pending.delete(m.id)
      if (m.ok) p.resolve({ ...m.ok, full: asBuffer(m.ok.full), thumb: asBuffer(m.ok.thumb) })
      else p.reject(new HttpError(m.err!.status, m.err!.code, m.err!.message, m.err!.details))
      if (!pending.size) w.unref()
    },
  )
  w.on('error', (err) => failAll(w, err))
  w.on('exit', (code) => failAll(w, new Error(`photo worker stopped (exit ${code})`)))
  worker = w
  return w
}

export function reencodeOffThread(bytes: Uint8Array, mime: AcceptedMime, name: string): Promise<Encoded> {
  const w = getWorker()
  const id = nextId++
  return new Promise<Encoded>((resolve, reject) => {
    pending.set(id, { resolve, reject })
    w.ref()
    w.postMessage({ id, bytes, mime, name })
  })
}
