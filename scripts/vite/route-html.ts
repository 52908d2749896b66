// Vite plugin: a copy of index.html per first screen (dist/routes/<name>.html) that also names the
// screen's own code, styles and first API answer, so the browser fetches them with the entry instead
// of one round trip later, once the entry has run and the router has matched the path (issue 14).
// server/static.ts sends the copy for its path; every other path (and the service worker, offline)
// gets index.html, where src/router/first-data.ts and the router's own preloading do the same a
// little later.
import type { Plugin, Rollup } from 'vite'
import { FIRST_DATA } from '../../src/router/first-data-paths'
import { routeHtmlFile } from '../../shared/route-html'

export interface RouteScreen {
  /** The path as the browser asks for it ('/', '/report'). */
  path: string
  /** Source files (relative to the project) of the layout and page the path draws. */
  modules: string[]
}

export function routeHtml(root: string, screens: RouteScreen[]): Plugin {
  return {
    name: 'lampwright:route-html',
    apply: 'build',
    enforce: 'post',
    generateBundle(_options, bundle) {
      const index = bundle['index.html']
      if (!index || index.type !== 'asset') return
      const html = String(index.source)
      const chunks = Object.values(bundle).filter((c): c is Rollup.OutputChunk => c.type === 'chunk')
      // A layout may sit inside a shared chunk (scripts/vite/chunk-groups.ts), not a chunk of its own.
      const byModule = new Map(chunks.flatMap((c) => c.moduleIds.map((id) => [id, c] as const)))
      const byFile = new Map(chunks.map((c) => [c.fileName, c]))
      for (const screen of screens) {
        const scripts = new Set<string>()
        const styles = new Set<string>()
        const visit = (chunk: Rollup.OutputChunk | undefined) => {
          if (!chunk || scripts.has(chunk.fileName)) return
          scripts.add(chunk.fileName)
          for (const css of chunk.viteMetadata?.importedCss ?? []) styles.add(css)
          for (const dep of chunk.imports) visit(byFile.get(dep))
        }
        for (const m of screen.modules) {
          const chunk = byModule.get(`${root}/${m}`)
          if (!chunk) throw new Error(`route-html: no chunk for ${m}`)
          visit(chunk)
        }
        // What index.html loads already stays as it is there.
        const links = [
          ...[...styles]
            .filter((f) => !html.includes(`/${f}"`))
            .map((f) => `<link rel="stylesheet" crossorigin href="/${f}">`),
          ...[...scripts]
            .filter((f) => !html.includes(`/${f}"`))
            .map((f) => `<link rel="modulepreload" crossorigin href="/${f}">`),
          ...(FIRST_DATA[screen.path] ?? []).map(
            (api) => `<link rel="preload" href="${api}" as="fetch" crossorigin="use-credentials">`,
          ),
        ]
        this.emitFile({
          type: 'asset',
          fileName: routeHtmlFile(screen.path),
          source: html.replace(/\s*<\/head>/, `\n    ${links.join('\n    ')}\n  </head>`),
        })
      }
    },
  }
}
