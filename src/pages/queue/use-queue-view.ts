// The queue page's list: one page at a time from the server, with the filters and the page kept in
// the address (queue-url.ts), so a view can be shared and Back returns to it.
import { computed, ref, watch } from 'vue'
import { useRoute, useRouter } from 'vue-router'
import { QUEUE_PAGE_DEFAULT, queuePageApi } from '../../api/queue-page'
import type { QueueFilterModel } from '../../components/queue/queue-format'
import { useRequest } from '../../composables/use-request'
import { queryFromQueueView, queueViewFromQuery } from './queue-url'
import { formatNumber } from '../../dates'

export function useQueueView() {
  const route = useRoute()
  const router = useRouter()
  // The filters and the page are kept in the address: a view can be shared, and Back returns to it.
  const start = queueViewFromQuery(route.query)
  const filter = ref<QueueFilterModel>(start.filter)
  const page = ref(start.page)
  const pageSize = QUEUE_PAGE_DEFAULT
  const list = useRequest(() =>
    queuePageApi.list({
      state: filter.value.state,
      kind: filter.value.kind ?? undefined,
      clientId: filter.value.clientId ?? undefined,
      siteId: filter.value.siteId ?? undefined,
      crewId: filter.value.crewId ?? undefined,
      page: page.value,
      pageSize,
    }),
  )
  const here = () => JSON.stringify(queryFromQueueView({ filter: filter.value, page: page.value }))
  const inAddress = () => JSON.stringify(queryFromQueueView(queueViewFromQuery(route.query)))
  function show(): void {
    if (here() !== inAddress())
      void router.replace({ query: queryFromQueueView({ filter: filter.value, page: page.value }) })
    void list.reload()
  }
  // Another filter starts again from the first page (unless the address itself just changed).
  watch(
    filter,
    () => {
      if (here() === inAddress()) void list.reload()
      else if (page.value === 1) show()
      else page.value = 1
    },
    { deep: true },
  )
  watch(page, show)
  // Back and forward move through the address: follow it.
  watch(
    () => route.query,
    (q) => {
      const v = queueViewFromQuery(q)
      if (JSON.stringify(queryFromQueueView(v)) === here()) return
      filter.value = v.filter
      page.value = v.page
    },
  )
  const items = computed(() => list.data.value?.items ?? [])
  const total = computed(() => list.data.value?.total ?? 0)
  // A page emptied by closing its last items: show the last page that still has some.
  watch(
    () => list.data.value,
    (d) => {
      if (d && !d.items.length && d.total > 0 && page.value > 1) page.value = Math.ceil(d.total / pageSize)
    },
  )
  const pages = computed(() => Math.max(1, Math.ceil(total.value / pageSize)))
  const firstRank = computed(() => (page.value - 1) * pageSize + 1)
  const shownText = computed(() => {
    const last = Math.min(total.value, firstRank.value + items.value.length - 1)
    return `Showing ${formatNumber(firstRank.value)}–${formatNumber(last)} of ${formatNumber(total.value)}`
  })
  return { filter, page, pageSize, list, items, total, pages, firstRank, shownText }
}
