// WebP decoding for jimp. @jimp/wasm-webp's own format plugin re-initialises its codec on every call
// without arguments, and the codec then fetches its .wasm by file URL, which Node's fetch refuses. So the
// same codec (@jsquash/webp, installed with @jimp/wasm-webp) is started once here with the bytes.
import { readFile } from 'node:fs/promises'
import { createRequire } from 'node:module'
import decodeWebp, { init } from '@jsquash/webp/decode.js'

let ready: Promise<void> | undefined

function start(): Promise<void> {
  const require = createRequire(import.meta.url)
  return readFile(require.resolve('@jsquash/webp/codec/dec/webp_dec.wasm')).then((wasmBinary) =>
    init({ wasmBinary } as never),
  )
}

/** RGBA pixels of a WebP image, in the shape Jimp.fromBitmap takes. */
export async function decodeWebpBitmap(
  bytes: Uint8Array,
): Promise<{ data: Buffer; width: number; height: number }> {
  ready ??= start().catch((err: unknown) => {
    ready = undefined
    throw err
  })
  await ready
  const copy = new Uint8Array(bytes) // the codec wants a whole ArrayBuffer, not a view into multer's
  const img = await decodeWebp(copy.buffer)
  const data = Buffer.from(img.data.buffer, img.data.byteOffset, img.data.byteLength)
  return { data, width: img.width, height: img.height }
}
