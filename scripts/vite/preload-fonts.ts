// Vite plugin: preloads the Roboto files the first screen draws with, so text appears once in its
// own face instead of in a fallback that then reflows (a layout shift Lighthouse counts; issue 14).
// Only the latin woff2 files of the weights named here; the build gives them hashed names.
import type { Plugin } from 'vite'

export function preloadFonts(weights: number[]): Plugin {
  const wanted = new RegExp(`roboto-latin-(${weights.join('|')})-normal-[\\w-]+\\.woff2$`)
  return {
    name: 'lampwright:preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        const files = Object.keys(ctx.bundle ?? {}).filter((f) => wanted.test(f))
        return files.map((f) => ({
          tag: 'link',
          attrs: { rel: 'preload', as: 'font', type: 'font/woff2', href: `/${f}`, crossorigin: '' },
          injectTo: 'head' as const,
        }))
      },
    },
  }
}
