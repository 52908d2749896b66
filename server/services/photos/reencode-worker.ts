// Runs in a worker thread: jimp decodes and encodes in plain JavaScript (seconds for a phone photo),
// which would otherwise stall every other request on the server's one event loop.
import { parentPort } from 'node:worker_threads'
import { HttpError } from '../../errors'
import type { AcceptedMime } from './checks'
import { reencode } from './image'

interface Job {
  id: number
  bytes: Uint8Array
  mime: AcceptedMime
  name: string
}

parentPort?.on('message', async (job: Job) => {
  try {
    const out = await reencode(job.bytes, job.mime, job.name)
    // Copied, not transferred: a small Buffer may share Node's pool memory with other Buffers.
    parentPort!.postMessage({ id: job.id, ok: out })
  } catch (err) {
    const e =
      err instanceof HttpError ? err : new HttpError(500, 'internal', String((err as Error)?.message ?? err))
    parentPort!.postMessage({
      id: job.id,
      err: { status: e.status, code: e.code, message: e.message, details: e.details },
    })
  }
})
