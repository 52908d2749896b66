// Where the API answers, on the page's own origin. Its own module so build scripts can read it
// (scripts/vite/route-html.ts) without the HTTP client's browser code.
export const API_BASE = '/api/v1'
