import { describe, expect, it } from 'vitest'
import { existsSync, readFileSync, readdirSync } from 'node:fs'
import { dirname, join, resolve } from 'node:path'

// src/css/quasar.sass keeps only the parts of Quasar's stylesheet the app uses (issue 14). Each
// Quasar component the templates use must still find its styles there, else it draws unstyled. The
// component → stylesheet layout is Quasar's own (node_modules/quasar/src/components/<dir>/Q<Name>.sass,
// imported in that order by quasar/src/css/index.sass).
const ROOT = resolve(__dirname, '../..')
/** node_modules/quasar/src, from here or a folder above (a worktree shares its parent's packages). */
function quasarSrc(from: string): string {
  const here = join(from, 'node_modules', 'quasar', 'src')
  if (existsSync(here)) return here
  if (dirname(from) === from) throw new Error('quasar is not installed')
  return quasarSrc(dirname(from))
}
const QUASAR = quasarSrc(ROOT)
const kept = readFileSync(resolve(ROOT, 'src/css/quasar.sass'), 'utf8')

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? files(join(dir, e.name)) : /\.(vue|ts)$/.test(e.name) ? [join(dir, e.name)] : [],
  )
}

const pascal = (tag: string) => tag.replace(/(^|-)(\w)/g, (_m, _d, c: string) => c.toUpperCase())
/** Where Quasar keeps the component behind `<q-…>`: its .js file. */
function componentFile(tag: string): string | null {
  const name = pascal(tag) // q-item-section → QItemSection
  for (const dir of readdirSync(join(QUASAR, 'components'))) {
    const file = join(QUASAR, 'components', dir, `${name}.js`)
    if (existsSync(file)) return file
  }
  return null
}

// Components these draw with inside (Quasar's own imports), whose styles they need too.
const INNER = ['QField', 'QVirtualScroll', 'QRadio', 'QCheckbox', 'QToggle', 'QBtnGroup', 'QSeparator']

describe('the trimmed Quasar stylesheet', () => {
  const tags = new Set<string>()
  for (const f of files(resolve(ROOT, 'src')))
    for (const m of readFileSync(f, 'utf8').matchAll(/<(q-[a-z-]+)/g)) tags.add(m[1])

  it('finds the components the templates use', () => {
    expect(tags.has('q-btn')).toBe(true)
    expect(tags.size).toBeGreaterThan(20)
  })

  it('imports the stylesheet of every Quasar component the templates use', () => {
    const missing: string[] = []
    for (const tag of tags) {
      const file = componentFile(tag)
      if (!file) continue // not a Quasar component (or a directive-only name)
      const dir = dirname(file)
      const own = file.replace(/\.js$/, '.sass')
      // A part without a stylesheet of its own (q-item-section, q-td) is styled by its folder's.
      const needed = existsSync(own)
        ? [own]
        : readdirSync(dir)
            .filter((n) => n.endsWith('.sass'))
            .map((n) => join(dir, n))
            .slice(0, 1)
      for (const sheet of needed)
        if (!kept.includes(sheet.slice(QUASAR.length + 1))) missing.push(`${tag} → ${sheet}`)
    }
    expect(missing).toEqual([])
  })

  it('keeps the styles of the components those draw with inside', () => {
    for (const name of INNER) expect(kept).toMatch(new RegExp(`/${name}\\.sass'`))
  })

  it('keeps Quasar’s core, transitions, ripple, dialog and notify styles', () => {
    for (const part of [
      'core/flex',
      'core/typography',
      'core/transitions',
      'Ripple',
      'Notify',
      'DialogPlugin',
    ])
      expect(kept).toContain(part)
  })
})
