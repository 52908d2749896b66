// The first API answer a screen waits for, asked for as the app starts instead of once the page's code
// has arrived and run (issue 14: one round trip less before the crew's run or map draws). A
// `<link rel=preload as=fetch>` is the browser's own cache for this: the page's later fetch of the
// same address, with the same credentials, takes the preloaded answer. The session and the config,
// which every screen waits for, are preloaded by index.html itself.
import { FIRST_DATA } from './first-data-paths'

export function preloadFirstData(pathname: string): void {
  for (const href of FIRST_DATA[pathname.replace(/\/+$/, '') || '/'] ?? []) {
    // The copies of index.html for the first screens (scripts/vite/route-html.ts) name it already.
    if (document.head.querySelector(`link[rel="preload"][href="${href}"]`)) continue
    const link = document.createElement('link')
    link.rel = 'preload'
    link.as = 'fetch'
    // The API client sends the session cookie (credentials: 'include'); the preload must match it.
    link.crossOrigin = 'use-credentials'
    link.href = href
    document.head.append(link)
  }
}
