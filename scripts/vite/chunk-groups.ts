// Chunk groups for rolldown (build.rolldownOptions.output.codeSplitting). Left to itself the bundler
// makes one chunk per set of pages that share a module: ~180 files of 0.3–2 kB, and a crew's run page
// fetched ~70 of them one after another over Lighthouse's six connections (issue 14). The groups:
//
// - "base": what every screen draws with (Vue, the Quasar components on every screen, the API wrapper);
//   loaded with the entry by the sign-in page, the public report page and the signed-in layout alike.
// - "public": what the public pages (sign-in, invitations, password reset, fault report, not found)
//   share beyond the entry; a few kB, one request instead of ten.
// - "shell": what the signed-in layout and src/signed-in.ts need (stores, outbox, the words of
//   shared/vocab, dialogs, menus, the bell) and what the crew's first screens (run, map) share with other pages: a crew's
//   run is its page chunk plus this one.
// - "office": what the other signed-in pages share among themselves (tables, selects, pickers).
//
// A module only one page uses stays in that page's chunk; the heavy features (Leaflet, ECharts, QR
// reading, PDF, protomaps) keep their own chunks, loaded only where used.
import { resolve } from 'node:path'
import type { Rolldown } from 'vite'

type Group = NonNullable<
  Exclude<NonNullable<Rolldown.OutputOptions['codeSplitting']>, boolean>['groups']
>[number]
type NameFn = Extract<Group['name'], (...args: never[]) => unknown>
type Ctx = Parameters<NameFn>[1]

/** A path pattern from its parts, either slash matching. */
const path = (...parts: string[]) => parts.join(String.raw`[\\/]`)

// The Quasar components on every screen; the bundler adds the utilities they import (a group takes its
// modules' dependencies too, the option's default).
const EVERY_SCREEN = 'btn|icon|spinner|input|form|banner|page|space|layout|header|toolbar'

const BASE_PARTS = [
  path('node_modules', '@vue', ''),
  path('node_modules', 'quasar', 'src', 'components', `(${EVERY_SCREEN})`, ''),
  // Small modules every screen imports that otherwise sat in files of their own (< 1 kB each): Quasar's
  // default language pack (its Lang plugin imports it whatever APP_LOCALE is) and type tests, Vue's SFC
  // helper, the API wrapper and the role table.
  path('node_modules', 'quasar', 'lang', String.raw`en-US\.js$`),
  path('node_modules', 'quasar', 'src', 'utils', 'is', ''),
  'plugin-vue:export-helper',
  path('src', 'api', String.raw`http\.ts$`),
  path('shared', String.raw`roles\.ts$`),
]
const BASE = new RegExp(BASE_PARTS.join('|'))

/**
 * Large libraries one feature needs: never folded into a shared chunk. zod among them: screens take
 * their words and lists from shared/vocab, and only the estate forms build from a schema (their
 * defaults), so zod comes with the pages that open those forms, not with the shell.
 */
const FEATURE = new RegExp(
  path(
    'node_modules',
    '(leaflet|@vue-leaflet|echarts|zrender|vue-echarts|jsqr|qrcode|pdfmake|pdfkit|pmtiles|protomaps-leaflet|@protomaps|zod)',
    '',
  ),
)
// Modules loaded on demand inside a page (a chart, a basemap, a panel opened later) stay their own
// chunks too, with everything only they use; so do the per-locale packs.
const ON_DEMAND = new RegExp(
  [
    path('components', 'string', String.raw`ForecastChart\.vue`),
    path('components', 'map', String.raw`pmtiles-layer\.ts`),
    path('node_modules', 'dayjs', 'locale', ''),
    path('node_modules', 'quasar', 'lang', ''),
  ].join('|'),
)

const SRC = resolve(import.meta.dirname, '..', '..', 'src')
const ENTRY = resolve(SRC, 'main.ts')
// The public pages people open first (the invitation and password pages are rare, and share the
// signed-in chunks: the new-password fields and the auth store).
const PUBLIC_PAGES = new RegExp(
  [
    path('src', 'layouts', String.raw`PublicLayout\.vue$`),
    path('src', 'pages', 'auth', String.raw`SignInPage\.vue$`),
    path('src', 'pages', 'report', ''),
    path('src', 'pages', String.raw`NotFoundPage\.vue$`),
  ].join('|'),
)
const SHELL_ROOTS = new RegExp(
  [path('src', String.raw`signed-in\.ts$`), path('src', 'layouts', String.raw`MainLayout\.vue$`)].join('|'),
)
// A crew's first screens: what they share with any other page comes with the shell.
const FIRST_SCREENS = new RegExp(
  [
    path('src', 'pages', 'run', String.raw`RunPage\.vue$`),
    path('src', 'pages', 'map', String.raw`MapPage\.vue$`),
  ].join('|'),
)

interface Graph {
  /** The entry's static closure: already loaded on every screen. */
  entry: Set<string>
  /** Modules that import a large feature library, directly or not (map pieces draw with Leaflet). */
  heavy: Set<string>
  /** Module → the lazily loaded roots (pages, layouts) whose static closure holds it. */
  owners: Map<string, Set<string>>
}

function staticClosure(ctx: Ctx, root: string, stopAt: Set<string>): Set<string> {
  const seen = new Set<string>()
  const todo = [root]
  while (todo.length) {
    const id = todo.pop()!
    if (seen.has(id) || stopAt.has(id)) continue
    seen.add(id)
    for (const dep of ctx.getModuleInfo(id)?.importedIds ?? []) todo.push(dep)
  }
  return seen
}

function buildGraph(ctx: Ctx): Graph {
  const entry = staticClosure(ctx, ENTRY, new Set())
  // Every module reachable at all, and the targets of dynamic imports among them.
  const roots = new Set<string>()
  const seen = new Set<string>()
  const todo = [ENTRY]
  while (todo.length) {
    const id = todo.pop()!
    if (seen.has(id)) continue
    seen.add(id)
    const info = ctx.getModuleInfo(id)
    for (const dep of info?.importedIds ?? []) todo.push(dep)
    for (const dep of info?.dynamicallyImportedIds ?? []) {
      roots.add(dep)
      todo.push(dep)
    }
  }
  const owners = new Map<string, Set<string>>()
  for (const root of roots)
    for (const id of staticClosure(ctx, root, entry)) {
      let set = owners.get(id)
      if (!set) owners.set(id, (set = new Set()))
      set.add(root)
    }
  const heavy = new Set<string>()
  const checked = new Set<string>()
  const reachesFeature = (id: string): boolean => {
    if (FEATURE.test(id)) return true
    if (checked.has(id)) return heavy.has(id)
    checked.add(id)
    const found = (ctx.getModuleInfo(id)?.importedIds ?? []).some(reachesFeature)
    if (found) heavy.add(id)
    return found
  }
  for (const id of owners.keys()) reachesFeature(id)
  return { entry, heavy, owners }
}

// One graph per chunking pass: the pass hands out the same module-info objects throughout.
let graph: Graph | null = null
let graphFor: unknown = null

/** The shared chunk a module belongs in, or null to leave it where the bundler puts it. */
function sharedChunk(id: string, ctx: Ctx): string | null {
  const pass = ctx.getModuleInfo(ENTRY)
  if (graphFor !== pass || !graph) {
    graph = buildGraph(ctx)
    graphFor = pass
  }
  if (graph.entry.has(id) || BASE.test(id) || ON_DEMAND.test(id) || FEATURE.test(id) || graph.heavy.has(id))
    return null
  const owners = [...(graph.owners.get(id) ?? [])].filter((o) => !ON_DEMAND.test(o))
  if (owners.some((o) => PUBLIC_PAGES.test(o))) return owners.length > 1 ? 'public' : null
  if (owners.some((o) => SHELL_ROOTS.test(o))) return 'shell'
  if (owners.length < 2) return null
  return owners.some((o) => FIRST_SCREENS.test(o)) ? 'shell' : 'office'
}

// Leaflet, its Vue wrapper and the marker images the wrapper imports on demand as the map mounts: one
// chunk, so the map does not wait a further round trip for three 2 kB image modules.
const LEAFLET = new RegExp(path('node_modules', '(leaflet|@vue-leaflet)', ''))

export const chunkGroups: Group[] = [
  { name: 'base', test: BASE, priority: 2 },
  // Not their dependencies: the bundler's preload helper, which the entry uses too, would move here.
  { name: 'leaflet', test: LEAFLET, priority: 2, includeDependenciesRecursively: false },
  { name: sharedChunk, debugName: 'shared', priority: 1, includeDependenciesRecursively: false },
]
