// The visit form's state: the string (from the server or the phone's copy), the draft kept in
// IndexedDB as it is typed, the engine preview, and saving through the outbox.
import { computed, ref, shallowRef, watch } from 'vue'
import { conditionOf, shuntedLampCount, type Condition } from '../../../shared/string-status'
import { applyVisit, lampTotal } from '../../../shared/visit-rules'
import { ApiError } from '../../api/http'
import { formatDate } from '../../dates'
import type { StringDetail } from '../../api/strings'
import {
  checkDraft,
  newDraft,
  parseReading,
  type DraftErrors,
  type VisitDraft,
} from '../../components/visit/visit-draft'
import { previewForecast, previewState } from '../../components/visit/visit-preview'
import { clearDraft, draftFromOutbox, saveDraft, unsentDraft } from '../../offline/draft-store'
import type { EntryError, VisitEntry } from '../../offline/outbox-types'
import { loadString } from '../../offline/string-cache'
import { useOutboxStore } from '../../stores/outbox'

export type Phase = 'form' | 'outcome'

const FIELD_OF: Record<string, keyof DraftErrors> = {
  'body.failedFound': 'failedFound',
  'body.replaced': 'replaced',
  'body.brightLamps': 'brightLamps',
  'body.noIsolationReason': 'noIsolationReason',
  'body.isolationKey': 'isolation',
  'body.readings': 'readings',
}

export function useVisitForm(stringId: number, editGroup: string | null) {
  const outbox = useOutboxStore()
  const detail = shallowRef<StringDetail | null>(null)
  const savedAt = ref<string | null>(null)
  const loadError = shallowRef<ApiError | null>(null)
  const draft = ref<VisitDraft | null>(null)
  const phase = ref<Phase>('form')
  const groupId = ref<string | null>(null)
  const serverError = ref<EntryError | null>(null)
  const tried = ref(false)
  const saving = ref(false)

  let reopen = editGroup
  async function load(): Promise<void> {
    loadError.value = null
    try {
      const loaded = await loadString(stringId)
      detail.value = loaded.detail
      savedAt.value = loaded.savedAt ? formatDate(loaded.savedAt, 'dayMonthTime') : null
      // Only the first load reopens a refused save; "Log another visit" starts clean.
      const edited = reopen ? await draftFromOutbox(reopen, stringId) : null
      reopen = null
      if (edited) serverError.value = edited.lastError
      draft.value =
        edited?.draft ?? (await unsentDraft(stringId)) ?? newDraft(stringId, loaded.detail.assetTag)
    } catch (err) {
      loadError.value = err instanceof ApiError ? err : new ApiError(0, 'client_error', String(err))
    }
  }

  let timer: ReturnType<typeof setTimeout> | null = null
  function cancelDraftSave(): void {
    if (timer) clearTimeout(timer)
    timer = null
  }
  watch(
    draft,
    (d) => {
      if (!d || phase.value !== 'form') return
      cancelDraftSave()
      timer = setTimeout(() => void saveDraft(d).catch(() => undefined), 400)
    },
    { deep: true },
  )

  const pendingVisits = computed(() => outbox.pendingVisitsFor(stringId, draft.value?.groupId ?? null))
  /** The server's record, plus visits still waiting on this phone, in the order they were made. */
  const base = computed<Condition | null>(() => {
    const d = detail.value
    if (!d) return null
    return pendingVisits.value.reduce((c, v) => applyVisit(c, v.body), conditionOf(d))
  })
  const capacity = computed(() => (detail.value ? shuntedLampCount(detail.value.type) : 0))
  const lamps = computed(() => (detail.value ? lampTotal(detail.value.type) : 0))
  const hasFuseLamp = computed(() => !!detail.value?.type.classes.some((k) => !k.shunted))
  const before = computed(() =>
    detail.value && base.value ? previewState(detail.value.type, base.value) : null,
  )
  const after = computed(() => {
    const d = draft.value
    if (!detail.value || !base.value || !d) return null
    return previewState(detail.value.type, applyVisit(base.value, d), parseReading(d.readings.supplyVolts))
  })
  const afterForecast = computed(() => {
    const d = draft.value
    if (!detail.value || !base.value || !d) return null
    return previewForecast(detail.value, applyVisit(base.value, d))
  })
  const checks = computed<DraftErrors>(() =>
    draft.value && base.value
      ? checkDraft(draft.value, base.value.lampsOut, capacity.value, lamps.value)
      : {},
  )
  /** Count errors show at once (they explain a disabled +); the rest after a first try to save. */
  const errors = computed<DraftErrors>(() => {
    const server: DraftErrors = {}
    for (const f of serverError.value?.fields ?? []) server[FIELD_OF[f.path] ?? 'readings'] = f.message
    if (serverError.value?.code.startsWith('isolation_')) server.isolation = serverError.value.message
    const local = checks.value
    const shown: DraftErrors = {
      failedFound: local.failedFound,
      replaced: local.replaced,
      brightLamps: local.brightLamps,
    }
    return tried.value ? { ...server, ...local } : { ...server, ...shown }
  })

  async function save(): Promise<void> {
    tried.value = true
    const d = draft.value
    if (!d || Object.values(checks.value).some(Boolean) || saving.value) return
    saving.value = true
    // A draft write still waiting would bring the saved form back, keys and all, after it is cleared.
    cancelDraftSave()
    try {
      const group = await outbox.save(d)
      await clearDraft(stringId)
      groupId.value = group
      serverError.value = null
      phase.value = 'outcome'
      await outbox.flush()
      const visit = outbox.entries.find((e): e is VisitEntry => e.kind === 'visit' && e.groupId === group)
      if (visit?.state === 'failed') {
        // Refused: back to the form with the server's words, everything typed still there.
        serverError.value = visit.lastError
        d.groupId = group
        phase.value = 'form'
        await saveDraft(d)
      }
    } catch (err) {
      // Storage on the phone refused it (full, or private browsing): say so and keep the form.
      serverError.value = {
        status: -1,
        code: 'local_storage',
        message: `Could not save on this phone: ${String(err)}`,
        fields: [],
      }
      phase.value = 'form'
    } finally {
      saving.value = false
    }
  }

  /** A fresh form for the same string, over its state after the visit just saved. */
  async function startAgain(): Promise<void> {
    groupId.value = null
    serverError.value = null
    tried.value = false
    detail.value = null
    draft.value = null
    phase.value = 'form'
    await load()
  }

  /** The save just made was refused after all (it went while this page stayed open): reopen it. */
  async function reopenSaved(): Promise<void> {
    const edited = groupId.value ? await draftFromOutbox(groupId.value, stringId) : null
    if (!edited) return
    serverError.value = edited.lastError
    draft.value = edited.draft
    tried.value = true
    phase.value = 'form'
  }

  return {
    reopenSaved,
    detail,
    savedAt,
    loadError,
    draft,
    phase,
    groupId,
    serverError,
    saving,
    pendingVisits,
    capacity,
    lamps,
    hasFuseLamp,
    base,
    before,
    after,
    afterForecast,
    errors,
    load,
    save,
    startAgain,
  }
}
