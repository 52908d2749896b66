import { computed, ref } from 'vue'
import { isApiError } from '../../api/http'
import { useDialogSubmit } from '../../composables/use-dialog-submit'
import { fieldProblems } from '../../api/public-reports'
import {
  certificateKindLabel,
  certificatesApi,
  type CertificateCreated,
  type CertificateKind,
  type CertificateRecord,
} from '../../api/safety'
import {
  KINDS_FOR_SUBJECT,
  RESULT_LABEL,
  judgedByReadings,
  parseReadings,
  previewResult,
  sameIntervalDue,
  type ReadingKey,
  type Result,
} from './certificate-format'
import { today } from '../../dates'
import { insulationRequirement } from '../../../shared/test-limits'

/**
 * The settings of a new test (RCD type and rating, voltages) start from the circuit as recorded, else
 * from the last test; the measured values never carry over. Older readings without an RCD type were
 * general type.
 */
function startingSettings(row: CertificateRecord): Partial<Record<ReadingKey, string>> {
  const previous = (row.readings ?? {}) as Record<string, unknown>
  const c = row.circuit
  const circuitVolts = c?.supplyVolts ?? (previous.circuitVolts as number | undefined)
  const text = (v: unknown) => (v === undefined || v === null ? '' : String(v))
  return {
    rcdType: c?.rcdType ?? (previous.rcdType === 'S' ? 'S' : 'general'),
    ratedMa: text(c?.rcdMa ?? previous.ratedMa ?? 30),
    circuitVolts: text(circuitVolts),
    testVolts: text(previous.testVolts ?? insulationRequirement(circuitVolts).testVolts),
  }
}

/** The "Record new test" form: starts from a certificate row and saves a new test on its subject. */
export function useRecordTest(base: () => CertificateRecord | null) {
  const kind = ref<CertificateKind>('rcd_test')
  const doneOn = ref(today())
  const nextDue = ref('')
  const typed = ref<Partial<Record<ReadingKey, string>>>({})
  const result = ref<Result | null>(null)
  const reference = ref('')
  const inspector = ref('')
  const notes = ref('')
  const { busy, errorText, submit, clearError } = useDialogSubmit(null, 'The test was not saved. Try again.')
  const problems = ref<Record<string, string>>({})

  const kindOptions = computed(() => {
    const row = base()
    return (row ? KINDS_FOR_SUBJECT[row.subjectType] : []).map((value) => ({
      value,
      label: certificateKindLabel[value],
    }))
  })
  const resultOptions = (['pass', 'advisory', 'fail'] as const).map((value) => ({
    value,
    label: RESULT_LABEL[value],
  }))
  const parsed = computed(() => parseReadings(kind.value, typed.value))
  const bad = computed(() => parsed.value.bad)
  const judged = computed(() => previewResult(kind.value, parsed.value.readings))
  const nextDueHint = computed(() => {
    const row = base()
    return row?.nextDue && row.kind === kind.value ? 'Set at the same interval as the last test' : undefined
  })

  // Same subject and kind as the row picked, with the earlier settings as a starting point.
  function prepare(): void {
    const row = base()
    if (!row) return
    kind.value = row.kind
    doneOn.value = today()
    nextDue.value = sameIntervalDue(row, doneOn.value)
    typed.value = startingSettings(row)
    result.value = null
    reference.value = ''
    inspector.value = row.inspector ?? ''
    notes.value = ''
    clearError()
    problems.value = {}
  }

  /** Saves and answers the server's result, or null when something needs fixing (what was typed stays). */
  async function save(): Promise<CertificateCreated | null> {
    const row = base()
    if (!row || bad.value.length) return null
    problems.value = {}
    if (!judged.value && !result.value) {
      problems.value = {
        result: judgedByReadings(kind.value) ? 'Enter readings or choose a result.' : 'Choose a result.',
      }
      return null
    }
    const readings = parsed.value.readings
    let created: CertificateCreated | null = null
    await submit(
      async () => {
        created = await certificatesApi.record({
          kind: kind.value,
          subjectType: row.subjectType,
          subjectId: row.subjectId,
          doneOn: doneOn.value,
          nextDue: nextDue.value || undefined,
          readings: Object.keys(readings).length ? readings : undefined,
          // Judged kinds get their result from the readings on the server, as in the preview.
          result: judged.value ? undefined : (result.value ?? undefined),
          reference: reference.value.trim() || undefined,
          inspector: inspector.value.trim() || undefined,
          notes: notes.value.trim() || undefined,
        })
      },
      (err) => {
        if (!isApiError(err)) return undefined
        if (err.code === 'validation_failed') problems.value = fieldProblems(err.details)
        return `${err.message} ${Object.values(problems.value).join(' ')}`.trim()
      },
    )
    return created
  }

  return {
    kind,
    doneOn,
    nextDue,
    typed,
    result,
    reference,
    inspector,
    notes,
    busy,
    errorText,
    problems,
    kindOptions,
    resultOptions,
    bad,
    judged,
    nextDueHint,
    prepare,
    save,
  }
}
