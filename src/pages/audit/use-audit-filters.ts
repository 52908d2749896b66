// The audit page's filters live in the URL (?entity=&entityId=&userId=&from=&to=&page=), so a view
// can be bookmarked, shared and reached from a record's history panel.
import { computed } from 'vue'
import { useRoute, useRouter, type LocationQuery } from 'vue-router'
import type { AuditFilters } from '../../api/audit'

const text = (v: LocationQuery[string]) => (typeof v === 'string' && v !== '' ? v : undefined)
const num = (v: LocationQuery[string]) => {
  const n = Number(text(v))
  return Number.isInteger(n) && n > 0 ? n : undefined
}
const day = (v: LocationQuery[string]) => {
  const s = text(v)
  return s && /^\d{4}-\d{2}-\d{2}$/.test(s) ? s : undefined
}

export function useAuditFilters() {
  const route = useRoute()
  const router = useRouter()
  const filters = computed<AuditFilters>(() => ({
    entity: text(route.query.entity),
    entityId: num(route.query.entityId),
    userId: num(route.query.userId),
    from: day(route.query.from),
    to: day(route.query.to),
  }))
  const page = computed(() => num(route.query.page) ?? 1)

  /** Changes some filters and goes back to page 1; an empty value removes the filter. */
  function set(change: Partial<Record<keyof AuditFilters, string | number | null | undefined>>) {
    const query: Record<string, string> = {}
    const merged = { ...filters.value, ...change }
    for (const [k, v] of Object.entries(merged))
      if (v !== undefined && v !== null && v !== '') query[k] = String(v)
    // An id means nothing without its kind of record.
    if (!query.entity) delete query.entityId
    void router.replace({ query })
  }
  const setPage = (p: number) =>
    void router.replace({ query: { ...route.query, page: p > 1 ? String(p) : undefined } })
  const clear = () => void router.replace({ query: {} })
  return { filters, page, set, setPage, clear }
}
