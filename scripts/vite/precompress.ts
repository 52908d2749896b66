// Vite plugin: writes a brotli (.br, quality 11) and a gzip (.gz, level 9) twin beside every built
// asset that compresses, so server/static.ts sends the smallest file without compressing per request.
// Fonts (woff2 is brotli inside), images and tiny files are left alone.
import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { brotliCompressSync, constants, gzipSync } from 'node:zlib'
import type { Plugin } from 'vite'

const COMPRESSIBLE = /\.(js|mjs|css|html|svg|json|webmanifest|txt|map)$/
const MIN_BYTES = 1024

export function precompress(folder = 'assets'): Plugin {
  let outDir = 'dist'
  return {
    name: 'lampwright:precompress',
    apply: 'build',
    enforce: 'post',
    configResolved(config) {
      outDir = resolve(config.root, config.build.outDir)
    },
    closeBundle() {
      const dir = join(outDir, folder)
      let files: string[]
      try {
        files = readdirSync(dir)
      } catch {
        return // a build without assets (vite-plugin-pwa's service-worker pass)
      }
      for (const name of files) {
        if (!COMPRESSIBLE.test(name) || name.endsWith('.map')) continue
        const path = join(dir, name)
        if (statSync(path).size < MIN_BYTES) continue
        const raw = readFileSync(path)
        const br = brotliCompressSync(raw, {
          params: {
            [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY,
            [constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
          },
        })
        const gz = gzipSync(raw, { level: 9 })
        if (br.length < raw.length) writeFileSync(`${path}.br`, br)
        if (gz.length < raw.length) writeFileSync(`${path}.gz`, gz)
      }
    },
  }
}
