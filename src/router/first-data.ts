// The first API answer a screen waits for, asked for as the app starts instead of once the page's code
// has arrived and run (issue 14: one round trip less before the crew's run or map draws). A
// `<link rel=preload as=fetch>` is the browser's own cache for this: the page's later fetch of the
// same address, with the same credentials, takes the preloaded answer. The session and the config,
// which every screen waits for, are preloaded by index.html itself.
import { API_BASE } from '../api/http'

/** Path → the GETs its page makes first (the same addresses as the page's api/ calls). */
const FIRST_DATA: Record<string, readonly string[]> = {
  '/run': ['/runs/mine'],
  '/map': ['/basemap'],
}

export function preloadFirstData(pathname: string): void {
  for (const path of FIRST_DATA[pathname.replace(/\/+$/, '') || '/'] ?? []) {
    const link = document.createElement('link')
    link.rel = 'preload'
    link.as = 'fetch'
    // The API client sends the session cookie (credentials: 'include'); the preload must match it.
    link.crossOrigin = 'use-credentials'
    link.href = `${API_BASE}${path}`
    document.head.append(link)
  }
}
