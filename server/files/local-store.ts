import { mkdir, readFile, readdir, rm, writeFile } from 'node:fs/promises'
import { basename, join, resolve } from 'node:path'
import type { FileStore } from './file-store'

/** Names are single path segments: nothing can be read or written outside the folder. */
export function safeName(name: string): string {
  if (!name || basename(name) !== name || name.startsWith('.')) throw new Error(`Bad file name "${name}"`)
  return name
}

export function localFileStore(dir: string): FileStore {
  const root = resolve(dir)
  return {
    where: `local folder ${root}`,
    async put(name, bytes) {
      await mkdir(root, { recursive: true })
      await writeFile(join(root, safeName(name)), bytes, { flag: 'wx' })
    },
    async get(name) {
      try {
        return await readFile(join(root, safeName(name)))
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null
        throw err
      }
    },
    async remove(name) {
      await rm(join(root, safeName(name)), { force: true })
    },
    async list() {
      try {
        return (await readdir(root, { withFileTypes: true })).filter((e) => e.isFile()).map((e) => e.name)
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return []
        throw err
      }
    },
  }
}
