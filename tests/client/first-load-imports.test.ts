import { describe, expect, it } from 'vitest'
import { existsSync, readFileSync } from 'node:fs'
import { dirname, join, relative, resolve } from 'node:path'

// Issue 14's budget: the public pages (sign-in, public fault report) load only what they need. This
// walks the static imports (not `import()`, which loads on demand) from the app's entry and from
// each public page, as the bundler does to decide what a page downloads, and lists the packages met.
const ROOT = resolve(__dirname, '../..')
const STATIC_IMPORT = /^\s*(?:import|export)\s+(?!type\b)(?:[\w*${}\s,]+?\s+from\s+)?['"]([^'"]+)['"]/gm

function scriptOf(file: string): string {
  const text = readFileSync(file, 'utf8')
  if (!file.endsWith('.vue')) return text
  return [...text.matchAll(/<script[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]).join('\n')
}

function resolveLocal(from: string, spec: string): string | null {
  const base = resolve(dirname(from), spec)
  for (const c of [base, `${base}.ts`, `${base}.vue`, join(base, 'index.ts')])
    if (existsSync(c) && /\.(ts|vue|js)$/.test(c)) return c
  return null // css, sass, json: no code
}

/** Packages reached through static imports from `starts`, each with one path that reaches it. */
function packagesReached(starts: string[]): Map<string, string> {
  return walk(starts).packages
}

function walk(starts: string[]): { packages: Map<string, string>; files: Set<string> } {
  const seen = new Set<string>()
  const packages = new Map<string, string>()
  const queue = starts.map((s) => ({ file: resolve(ROOT, s), via: s }))
  while (queue.length) {
    const { file, via } = queue.shift()!
    if (seen.has(file)) continue
    seen.add(file)
    for (const m of scriptOf(file).matchAll(STATIC_IMPORT)) {
      const spec = m[1]
      if (spec.startsWith('.')) {
        const next = resolveLocal(file, spec)
        if (next) queue.push({ file: next, via: `${via} → ${relative(ROOT, next)}` })
      } else {
        const name = spec.startsWith('@') ? spec.split('/').slice(0, 2).join('/') : spec.split('/')[0]
        if (!packages.has(name)) packages.set(name, via)
      }
    }
  }
  return { packages, files: new Set([...seen].map((f) => relative(ROOT, f))) }
}

// The heavy packages of the signed-in screens (package.json): maps, charts, QR reading, PDF, the
// phone's IndexedDB outbox. Their sizes are in /work/shared/toolchain.md (echarts ≈ 186 KB gz).
const HEAVY = [
  'leaflet',
  '@vue-leaflet/vue-leaflet',
  'protomaps-leaflet',
  'pmtiles',
  'supercluster',
  'echarts',
  'vue-echarts',
  'jsqr',
  'qrcode',
  'pdfmake',
  'idb',
]

const ENTRY = ['src/main.ts', 'src/App.vue', 'src/router/index.ts', 'src/layouts/PublicLayout.vue']

describe('what the public pages load first', () => {
  it.each([
    ['the sign-in page', 'src/pages/auth/SignInPage.vue'],
    ['the public fault report page', 'src/pages/report/ReportFaultPage.vue'],
  ])('%s and the app entry import no map, chart, QR, PDF or outbox package', (_name, page) => {
    const reached = packagesReached([...ENTRY, page])
    const heavy = HEAVY.filter((p) => reached.has(p)).map((p) => `${p} via ${reached.get(p)}`)
    expect(heavy).toEqual([])
    // The walk itself works: Vue and Quasar are always reached.
    expect(reached.has('vue')).toBe(true)
    expect(reached.has('quasar')).toBe(true)
  })

  it('keeps the signed-in extras (dialogs, outbox) out of the entry', () => {
    const { files } = walk(ENTRY)
    expect(files.has('src/router/routes.ts')).toBe(true)
    expect(files.has('src/signed-in.ts')).toBe(false)
    expect(files.has('src/offline/start-offline.ts')).toBe(false)
    expect(files.has('src/stores/outbox.ts')).toBe(false)
    // The signed-in layout does bring them, so the walk sees them where they are.
    expect(walk(['src/layouts/MainLayout.vue']).files.has('src/offline/start-offline.ts')).toBe(true)
  })
})
