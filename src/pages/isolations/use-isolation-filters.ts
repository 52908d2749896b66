// The isolation list's filters and page live in the URL (?review=&findings=&sort=&from=&to=&page=), so the
// safety officer's view survives a reload and can be shared; a value left out is the default.
import { computed } from 'vue'
import { useRoute, useRouter, type LocationQuery } from 'vue-router'
import {
  findingFilters,
  isolationSorts,
  type IsolationFilters,
  type ReviewFilter,
} from '../../api/isolations'

const DEFAULTS: IsolationFilters = { review: 'pending', findings: 'all', sort: 'severity' }
const reviews: readonly ReviewFilter[] = ['pending', 'approved', 'rejected', 'all']

const day = (v: LocationQuery[string]) =>
  typeof v === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(v) ? v : undefined

function pick<T extends string>(v: LocationQuery[string], allowed: readonly T[], fallback: T): T {
  return typeof v === 'string' && (allowed as readonly string[]).includes(v) ? (v as T) : fallback
}

export function useIsolationFilters() {
  const route = useRoute()
  const router = useRouter()
  const filters = computed<IsolationFilters>(() => ({
    review: pick(route.query.review, reviews, DEFAULTS.review),
    findings: pick(route.query.findings, findingFilters, DEFAULTS.findings),
    sort: pick(route.query.sort, isolationSorts, DEFAULTS.sort),
    from: day(route.query.from),
    to: day(route.query.to),
  }))
  const page = computed(() => {
    const n = Number(route.query.page)
    return Number.isInteger(n) && n > 0 ? n : 1
  })

  /** Changes one filter and goes back to page 1; defaults are left out of the URL. */
  function set(change: Partial<IsolationFilters>) {
    const merged = { ...filters.value, ...change }
    const query: Record<string, string> = {}
    for (const k of Object.keys(merged) as (keyof IsolationFilters)[]) {
      const v = merged[k]
      if (v && v !== DEFAULTS[k]) query[k] = v
    }
    void router.replace({ query })
  }
  const setPage = (p: number) =>
    void router.replace({ query: { ...route.query, page: p > 1 ? String(p) : undefined } })
  return { filters, page, set, setPage }
}
