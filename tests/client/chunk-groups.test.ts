import { describe, expect, it } from 'vitest'
import { resolve } from 'node:path'
import { chunkGroups } from '../../scripts/vite/chunk-groups'

// The rules of scripts/vite/chunk-groups.ts (issue 14: few requests per first screen, nothing heavy
// folded into a shared chunk), run on a small module graph made up here in the shape the bundler
// hands over. The expected chunks are the rules as the file states them (common practice, no source).
const ROOT = resolve(import.meta.dirname, '..', '..')
const src = (p: string) => resolve(ROOT, 'src', p)
const nm = (p: string) => resolve(ROOT, 'node_modules', p)

const M = {
  entry: src('main.ts'),
  router: src('router/index.ts'),
  publicLayout: src('layouts/PublicLayout.vue'),
  signIn: src('pages/auth/SignInPage.vue'),
  report: src('pages/report/ReportFaultPage.vue'),
  mainLayout: src('layouts/MainLayout.vue'),
  run: src('pages/run/RunPage.vue'),
  map: src('pages/map/MapPage.vue'),
  queue: src('pages/queue/QueuePage.vue'),
  register: src('pages/register/RegisterPage.vue'),
  string: src('pages/string/StringPage.vue'),
  formCard: src('components/common/FormCard.vue'),
  kindPicker: src('components/report/KindPicker.vue'),
  notices: src('stores/notices.ts'),
  stateChip: src('components/common/StateChip.vue'),
  dataTable: src('components/common/DataTable.vue'),
  mapCanvas: src('components/map/MapCanvas.vue'),
  leaflet: nm('leaflet/dist/leaflet-src.js'),
  zod: nm('zod/v4/core/core.js'),
  quasarBtn: nm('quasar/src/components/btn/QBtn.js'),
  forecastChart: src('components/string/ForecastChart.vue'),
  chartOnly: src('components/string/chart-axis.ts'),
}

const imports: Record<string, { importedIds?: string[]; dynamicallyImportedIds?: string[] }> = {
  [M.entry]: {
    importedIds: [M.router],
    dynamicallyImportedIds: [
      M.publicLayout,
      M.signIn,
      M.report,
      M.mainLayout,
      M.run,
      M.map,
      M.queue,
      M.register,
      M.string,
    ],
  },
  [M.signIn]: { importedIds: [M.formCard, M.quasarBtn] },
  [M.report]: { importedIds: [M.formCard, M.kindPicker] },
  [M.mainLayout]: { importedIds: [M.notices] },
  [M.run]: { importedIds: [M.stateChip] },
  [M.map]: { importedIds: [M.mapCanvas] },
  [M.queue]: { importedIds: [M.stateChip, M.dataTable, M.router] },
  [M.register]: { importedIds: [M.dataTable, M.mapCanvas, M.zod] },
  [M.string]: { importedIds: [M.zod, M.notices], dynamicallyImportedIds: [M.forecastChart] },
  [M.mapCanvas]: { importedIds: [M.leaflet] },
  [M.forecastChart]: { importedIds: [M.chartOnly] },
}

/** A bundler context over the graph above: one object per module, as in one chunking pass. */
function context() {
  const infos = new Map<string, { importedIds: string[]; dynamicallyImportedIds: string[] }>()
  return {
    getModuleInfo(id: string) {
      if (!infos.has(id))
        infos.set(id, {
          importedIds: imports[id]?.importedIds ?? [],
          dynamicallyImportedIds: imports[id]?.dynamicallyImportedIds ?? [],
        })
      return infos.get(id)!
    },
  }
}

const shared = chunkGroups.find((g) => typeof g.name === 'function')!.name as (
  id: string,
  ctx: unknown,
) => string | null

describe('chunk groups', () => {
  const ctx = context()
  const chunk = (id: string) => shared(id, ctx)

  it('puts what two public pages share in one public chunk, and leaves one page its own modules', () => {
    expect(chunk(M.formCard)).toBe('public')
    expect(chunk(M.kindPicker)).toBeNull()
  })

  it("puts the signed-in layout's modules, and what a crew's first screen shares, in the shell", () => {
    expect(chunk(M.notices)).toBe('shell')
    expect(chunk(M.stateChip)).toBe('shell')
  })

  it('puts what only office pages share in the office chunk', () => {
    expect(chunk(M.dataTable)).toBe('office')
  })

  it('never folds a large feature, or what draws with one, into a shared chunk', () => {
    expect(chunk(M.leaflet)).toBeNull()
    expect(chunk(M.mapCanvas)).toBeNull()
    expect(chunk(M.zod)).toBeNull()
  })

  it("leaves the entry's own modules, Quasar's every-screen components and on-demand pieces alone", () => {
    expect(chunk(M.router)).toBeNull()
    expect(chunk(M.quasarBtn)).toBeNull()
    expect(chunk(M.forecastChart)).toBeNull()
  })

  it('names Quasar components every screen draws for the base chunk', () => {
    const base = chunkGroups.find((g) => g.name === 'base')!.test as RegExp
    expect(base.test(M.quasarBtn)).toBe(true)
    expect(base.test(nm('quasar/src/components/table/QTable.js'))).toBe(false)
  })
})
