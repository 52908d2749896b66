// Where the copy of index.html built for a first screen lives in the client build: written by
// scripts/vite/route-html.ts, sent by server/static.ts. '/' → routes/index.html, '/report' →
// routes/report.html.
export const ROUTE_HTML_DIR = 'routes'

export const routeHtmlFile = (path: string): string =>
  `${ROUTE_HTML_DIR}/${path === '/' ? 'index' : path.slice(1)}.html`
