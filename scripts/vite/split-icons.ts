// Vite plugin: each Material Design icon becomes a module of its own, so a page's chunk carries only
// the icons that page shows. @quasar/extras ships all of MDI as one module; a bundler places one module
// in one chunk, so without this every icon the app uses anywhere (36 kB) was loaded with the first page.
// Named imports and re-exports of '@quasar/extras/mdi-v7' (src/icons.ts, Quasar's SVG icon set) and
// of src/icons.ts itself are rewritten to default imports of `virtual:mdi/<name>`.
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import type { Plugin } from 'vite'

const PREFIX = 'virtual:mdi/'
const RESOLVED = '\0mdi/'
const MDI = '@quasar/extras/mdi-v7'
// `import { a, b as c } from '…'` and `export { a as c } from '…'`, across lines.
const NAMED = /\b(import|export)\s*\{([^}]*)\}\s*from\s*(['"])([^'"]+)\3;?/g

type Spec = { from: string; local: string }
const specs = (list: string): Spec[] =>
  list
    .replace(/\/\/[^\n]*|\/\*[\s\S]*?\*\//g, '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean)
    .map((s) => {
      const [from, local = from] = s.split(/\s+as\s+/)
      return { from: from.trim(), local: local.trim() }
    })

/** mdiName → SVG path, read once from @quasar/extras. */
function loadPaths(): Map<string, string> {
  const file = createRequire(import.meta.url).resolve(MDI)
  const paths = new Map<string, string>()
  for (const m of readFileSync(file, 'utf8').matchAll(/export const (\w+) = '([^']*)'/g))
    paths.set(m[1], m[2])
  return paths
}

/** src/icons.ts: app name (iconWarning) → MDI name (mdiAlertOutline). */
function loadAppIcons(iconsFile: string): Map<string, string> {
  const names = new Map<string, string>()
  for (const m of readFileSync(iconsFile, 'utf8').matchAll(NAMED))
    if (m[4] === MDI) for (const s of specs(m[2])) names.set(s.local, s.from)
  return names
}

function rewrite(kind: string, list: Spec[], mdiName: (s: Spec) => string | undefined): string | null {
  const out: string[] = []
  for (const s of list) {
    const name = mdiName(s)
    if (!name) return null
    out.push(
      kind === 'import'
        ? `import ${s.local} from '${PREFIX}${name}';`
        : `export { default as ${s.local} } from '${PREFIX}${name}';`,
    )
  }
  return out.join('\n')
}

export function splitIcons(iconsFile: string): Plugin {
  let paths: Map<string, string>
  let appIcons: Map<string, string>
  return {
    name: 'lampwright:split-icons',
    enforce: 'post',
    apply: 'build',
    buildStart() {
      paths = loadPaths()
      appIcons = loadAppIcons(iconsFile)
    },
    resolveId(id) {
      return id.startsWith(PREFIX) ? RESOLVED + id.slice(PREFIX.length) : null
    },
    load(id) {
      if (!id.startsWith(RESOLVED)) return null
      const path = paths.get(id.slice(RESOLVED.length))
      if (path === undefined) throw new Error(`no MDI icon ${id.slice(RESOLVED.length)}`)
      return { code: `export default ${JSON.stringify(path)}`, moduleSideEffects: false }
    },
    transform(code, id) {
      if (id.startsWith('\0') || !/\.(ts|js|mjs|vue)(\?|$)/.test(id) || !code.includes('from')) return null
      let changed = false
      const next = code.replace(NAMED, (all, kind: string, list: string, _q, from: string) => {
        let swapped: string | null = null
        if (from === MDI)
          swapped = rewrite(kind, specs(list), (s) => (paths.has(s.from) ? s.from : undefined))
        else if (/(^|\/)icons(\.ts)?$/.test(from) && from.startsWith('.') && !id.includes('node_modules'))
          swapped = rewrite(kind, specs(list), (s) => appIcons.get(s.from))
        if (swapped === null) return all
        changed = true
        return swapped
      })
      return changed ? { code: next, map: null } : null
    },
  }
}
