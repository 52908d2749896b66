import { computed } from 'vue'
import { queueApi } from '../../api/queue'
import { runsApi } from '../../api/runs'
import { useRequest } from '../../composables/use-request'
import type { FilterOption } from '../../components/queue/queue-format'

/**
 * Choices for the queue filters. There is no client or site list in the API, so both are taken
 * from every queue item (open, snoozed and closed); crews come from /crews.
 */
export function useFilterOptions() {
  const all = useRequest(() => queueApi.list({ state: 'all' }))
  const crews = useRequest(() => runsApi.crews())

  const clients = computed<FilterOption[]>(() => {
    const seen = new Map<number, string>()
    for (const i of all.data.value?.items ?? []) if (i.client) seen.set(i.client.id, i.client.name)
    return sorted([...seen].map(([value, label]) => ({ value, label })))
  })
  const sites = computed<FilterOption[]>(() => {
    const seen = new Map<number, FilterOption>()
    for (const i of all.data.value?.items ?? []) {
      if (i.site) seen.set(i.site.id, { value: i.site.id, label: i.site.name, clientId: i.client?.id })
    }
    return sorted([...seen.values()])
  })
  const crewOptions = computed<FilterOption[]>(() =>
    (crews.data.value?.items ?? []).map((c) => ({ value: c.id, label: c.name })),
  )
  const crewNames = computed<Record<number, string>>(() =>
    Object.fromEntries((crews.data.value?.items ?? []).map((c) => [c.id, c.name])),
  )

  return { clients, sites, crewOptions, crewNames, reloadOptions: all.reload }
}

function sorted(options: FilterOption[]): FilterOption[] {
  return options.sort((a, b) => a.label.localeCompare(b.label))
}
