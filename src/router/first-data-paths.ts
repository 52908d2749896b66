// The first API answer each screen waits for, by the path the browser opens (the same addresses, with
// their query, as the page's own api/ calls make). Read by src/router/first-data.ts in the browser and
// by scripts/vite/route-html.ts at build time.
import { API_BASE } from '../api/base'

export const FIRST_DATA: Readonly<Record<string, readonly string[]>> = {
  '/run': [`${API_BASE}/runs/mine`],
  '/map': [`${API_BASE}/basemap`],
}
