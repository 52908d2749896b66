import { computed, reactive, ref, shallowRef, watch } from 'vue'
import { useQuasar } from 'quasar'
import { useRoute } from 'vue-router'
import { ApiError } from '../../api/http'
import { queueApi } from '../../api/queue'
import { runsApi, type CrewRun, type PlanResult } from '../../api/runs'
import { useRequest } from '../../composables/use-request'
import {
  itemIdsOf,
  moveStop,
  pinnedItemIds,
  pinsOf,
  publishOrder,
  togglePin,
  type StopRef,
} from '../../components/plan/run-edit'
import { DEFAULT_TOP_N, idsFromQuery, topItems } from '../../components/plan/plan-items'
import { retime, type TravelSettings } from '../../components/plan/run-timing'
import { DEFAULT_DETOUR_FACTOR, DEFAULT_SPEED_KMH } from '../../../shared/routing/plan-model'
import { addDays, formatDate, plural, today } from '../../dates'

type Source = 'none' | 'proposal' | 'published'

export function usePlan() {
  const $q = useQuasar()
  const route = useRoute()

  const date = ref(addDays(today(), 1))
  const settings = reactive<TravelSettings>({
    speedKmh: DEFAULT_SPEED_KMH,
    detourFactor: DEFAULT_DETOUR_FACTOR,
  })
  const crews = useRequest(() => runsApi.crews().then((r) => r.items))
  const queue = useRequest(() => queueApi.list({ state: 'open' }).then((r) => r.items))

  const crewIds = ref<number[]>([])
  const itemIds = ref<number[]>(idsFromQuery(route.query.items))
  const fromQueue = itemIds.value.length > 0
  watch(crews.data, (list) => {
    if (list && crewIds.value.length === 0) crewIds.value = list.map((c) => c.id)
  })
  watch(queue.data, (list) => {
    if (list && itemIds.value.length === 0) itemIds.value = topItems(list, DEFAULT_TOP_N)
  })
  /** Chosen items that cannot go on a run: no longer open (closed, snoozed or merged since the queue
   * page) or without a location to drive to. They are left out of the plan, and the page says so. */
  const missing = computed(() => {
    const open = queue.data.value
    if (!open) return []
    return itemIds.value.filter((id) => {
      const item = open.find((i) => i.id === id)
      return !item || item.lat === null || item.lng === null
    })
  })

  const runs = ref<CrewRun[]>([])
  const unassigned = ref<PlanResult['unassigned']>([])
  const source = ref<Source>('none')
  const edited = ref(false)
  const justPublished = ref(false)
  const busy = ref<'optimise' | 'publish' | 'load' | null>(null)
  const error = shallowRef<ApiError | null>(null)

  function show(result: { runs: CrewRun[]; unassigned?: PlanResult['unassigned'] }, from: Source): void {
    runs.value = result.runs
    unassigned.value = result.unassigned ?? []
    source.value = from
    edited.value = false
  }

  async function run<T>(what: 'optimise' | 'publish' | 'load', work: () => Promise<T>): Promise<T | null> {
    busy.value = what
    error.value = null
    try {
      return await work()
    } catch (err) {
      error.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
      return null
    } finally {
      if (busy.value === what) busy.value = null
    }
  }

  // Bumped by every load, optimise and publish: a slow answer for an older request (say the
  // published runs of a date the user has since left) must not replace a newer plan.
  let generation = 0

  async function loadPublished(): Promise<void> {
    const mine = ++generation
    justPublished.value = false
    const result = await run('load', () => runsApi.published(date.value))
    if (mine !== generation || !result) return
    if (result.runs.length) show(result, 'published')
    else if (source.value === 'published') show({ runs: [] }, 'none')
  }
  watch(date, () => void loadPublished(), { immediate: true })

  /** First plan from the chosen crews and items; nothing is saved. */
  async function optimise(): Promise<void> {
    const mine = ++generation
    const result = await run('optimise', () =>
      runsApi.plan({
        date: date.value,
        crewIds: crewIds.value,
        itemIds: itemIds.value.filter((id) => !missing.value.includes(id)),
        pins: [],
        ...settings,
      }),
    )
    if (result && mine === generation) {
      justPublished.value = false
      show(result, 'proposal')
    }
  }

  /** Plans again keeping pinned stops on their crews in their order; the optimiser places the rest. */
  async function reoptimise(): Promise<void> {
    const mine = ++generation
    const result = await run('optimise', () =>
      runsApi.plan({
        date: date.value,
        crewIds: runs.value.map((r) => r.crewId),
        itemIds: itemIdsOf(runs.value, unassigned.value),
        pins: pinsOf(runs.value),
        ...settings,
      }),
    )
    if (result && mine === generation) {
      justPublished.value = false
      show(result, 'proposal')
    }
  }

  function edit(next: CrewRun[]): void {
    generation++
    // Only the runs that changed are timed again; the others keep the times the server gave.
    runs.value = next.map((r, i) => (r === runs.value[i] ? r : retime(r, settings)))
    edited.value = true
    justPublished.value = false
  }
  const move = (from: StopRef, to: StopRef) => edit(moveStop(runs.value, from, to))
  const pin = (at: StopRef) => edit(togglePin(runs.value, at))

  function publish(): void {
    const stops = runs.value.reduce((n, r) => n + r.stops.length, 0)
    $q.dialog({
      title: `Publish ${plural(runs.value.length, 'run')} for ${formatDate(date.value, 'weekday')}?`,
      message:
        `${plural(stops, 'stop')} in the order shown. Every crew member gets the run by e-mail; ` +
        'a crew whose run for this date was already published gets a “Changed” e-mail.',
      cancel: { flat: true, noCaps: true, label: 'Cancel' },
      ok: { color: 'primary', unelevated: true, noCaps: true, label: 'Publish' },
      persistent: true,
    }).onOk(async () => {
      const mine = ++generation
      const result = await run('publish', () =>
        runsApi.publish({
          date: date.value,
          runs: publishOrder(runs.value),
          pinnedItemIds: pinnedItemIds(runs.value),
          ...settings,
        }),
      )
      if (result && mine === generation) {
        show(result, 'published')
        justPublished.value = true
      }
    })
  }

  return {
    date,
    settings,
    crews,
    queue,
    crewIds,
    itemIds,
    fromQueue,
    missing,
    runs,
    unassigned,
    source,
    edited,
    justPublished,
    busy,
    error,
    optimise,
    reoptimise,
    move,
    pin,
    publish,
  }
}
