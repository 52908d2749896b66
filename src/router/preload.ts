import type { RouteRecordRaw } from 'vue-router'

type Lazy = () => Promise<unknown>
/** A matched record (components) or a raw one from routes.ts (component). */
type ViewRecord = { component?: unknown; components?: Record<string, unknown> | null }

// vue-router's own test for a loaded component; anything else that is a function is a lazy import.
const isLazy = (view: unknown): view is Lazy =>
  typeof view === 'function' && !('displayName' in view) && !('props' in view) && !('__vccOpts' in view)

/**
 * Starts downloading a route's page and layout while the guard waits for the session and config
 * answers, instead of after them (issue 14: one round trip less before the first screen). The
 * browser keeps each module once, so vue-router's own import later reuses the same download.
 */
export function preloadViews(to: { matched: readonly ViewRecord[] }): void {
  for (const record of to.matched)
    for (const view of [record.component, ...Object.values(record.components ?? {})])
      if (isLazy(view)) view().catch(() => undefined)
}

/** The same for a route not yet navigated to, by name, from the route list. */
export function preloadNamed(routes: readonly RouteRecordRaw[], name: string): void {
  const chain = findChain(routes, name)
  if (chain) preloadViews({ matched: chain as ViewRecord[] })
}

function findChain(routes: readonly RouteRecordRaw[], name: string): RouteRecordRaw[] | null {
  for (const r of routes) {
    if (r.name === name) return [r]
    const below = r.children ? findChain(r.children, name) : null
    if (below) return [r, ...below]
  }
  return null
}
