import { computed, onBeforeUnmount, ref, shallowRef, watch } from 'vue'
import { assess, forecast } from '../../../shared/engine/index'
import type { AssessRequest, AssessResponse, ForecastResponse } from '../../../shared/schemas/engine'
import { shuntedLampCount } from '../../../shared/string-status'
import type { StringStatus } from '../../../shared/vocab/string-states'
import {
  CUSTOM_DEFAULT,
  PRESETS,
  customPreset,
  type CustomSpec,
  type LampPreset,
} from '../../components/calculator/presets'
import { today } from '../../dates'
import { NO_FAULTS, calcRequest, mainClass, type Faults } from '../../components/calculator/calc-request'

// Enough simulated runs for a stable summary that still finishes within a frame on a phone.
const TRIALS = 1000
// Typing 2-3-0 should not run the engine three times.
const DEBOUNCE_MS = 150

export interface CalcResult {
  status: StringStatus
  request: AssessRequest
  /** one per class of the request */
  labels: string[]
  assessment: AssessResponse
  forecast: ForecastResponse
  preset: LampPreset
}

export function useCalculator() {
  const presetId = ref<string>(PRESETS[0].id)
  const custom = ref<CustomSpec>({ ...CUSTOM_DEFAULT })
  const supplyVolts = ref<number | null>(PRESETS[0].supplyVolts)
  const lampsOut = ref(0)
  const fuseFailed = ref(false)
  const faults = ref<Faults>({ ...NO_FAULTS })

  const preset = computed<LampPreset>(() =>
    presetId.value === 'custom'
      ? customPreset(custom.value)
      : (PRESETS.find((p) => p.id === presetId.value) ?? PRESETS[0]),
  )
  const maxOut = computed(() => shuntedLampCount(preset.value))
  /** lamps of the main class over every chain: the most that can be open or missing */
  const maxMissing = computed(() => {
    const p = preset.value
    return p.classes[mainClass(p)].count * Math.max(1, p.branches ?? 1)
  })
  const hasFuseLamp = computed(
    () =>
      preset.value.wiring === 'series' &&
      preset.value.technology !== 'led' &&
      preset.value.classes.some((c) => !c.shunted),
  )

  // A new type brings its own supply; editing a custom type keeps the voltage the user set.
  watch(presetId, () => {
    supplyVolts.value = preset.value.supplyVolts
  })
  watch([maxOut, hasFuseLamp], () => {
    lampsOut.value = Math.min(lampsOut.value, maxOut.value)
    if (!hasFuseLamp.value) fuseFailed.value = false
  })
  watch(presetId, () => {
    faults.value = { ...NO_FAULTS }
  })

  const inputError = computed(() => {
    const v = supplyVolts.value
    if (v === null || !Number.isFinite(v) || v <= 0 || v > 1000)
      return 'Enter a supply voltage from 1 to 1000 V.'
    const f = faults.value
    if (
      f.wrongCount > 0 &&
      !(f.wrongVolts > 0 && f.wrongVolts <= 1000 && f.wrongAmps > 0 && f.wrongAmps <= 100)
    )
      return "Enter the other lamp's rating: up to 1000 V and 100 A."
    if (presetId.value !== 'custom') return null
    if (!Number.isInteger(custom.value.count) || custom.value.count < 1 || custom.value.count > 10000)
      return 'Enter a lamp count from 1 to 10,000.'
    if (!(custom.value.ratedVolts > 0 && custom.value.ratedVolts <= 1000))
      return 'Enter the lamp rating in volts, up to 1000 V.'
    if (!(custom.value.ratedAmps > 0 && custom.value.ratedAmps <= 100))
      return 'Enter the lamp rating in amps, up to 100 A.'
    if (!(custom.value.ratedLifeHours > 0)) return 'Enter the rated life in hours.'
    if (!Number.isInteger(custom.value.branches) || custom.value.branches < 1 || custom.value.branches > 100)
      return 'Enter the chains side by side, from 1 to 100.'
    return null
  })

  const result = shallowRef<CalcResult | null>(null)
  const computing = ref(false)
  let timer: ReturnType<typeof setTimeout> | undefined

  function run(): void {
    computing.value = false
    if (inputError.value) return
    const p = preset.value
    const supply = supplyVolts.value as number
    const condition = { lampsOut: lampsOut.value, fuseFailed: fuseFailed.value, dark: false, isolated: false }
    // The same engine the server uses for the state marks on the map and string pages.
    const { request, labels } = calcRequest(p, supply, condition, faults.value)
    const assessment = assess(request)
    result.value = {
      status: assessment.state,
      preset: p,
      request,
      labels,
      assessment,
      forecast: forecast({
        ...request,
        ratedLifeHours: p.ratedLifeHours,
        weibullShape: p.weibullShape,
        shuntFailProbability: p.shuntFailProbability,
        startDate: today(),
        trials: TRIALS,
      }),
    }
  }

  watch(
    [preset, supplyVolts, lampsOut, fuseFailed, faults],
    () => {
      computing.value = true
      clearTimeout(timer)
      timer = setTimeout(run, DEBOUNCE_MS)
    },
    { deep: true },
  )
  run()
  onBeforeUnmount(() => clearTimeout(timer))

  return {
    presetId,
    custom,
    supplyVolts,
    lampsOut,
    fuseFailed,
    faults,
    preset,
    maxOut,
    maxMissing,
    hasFuseLamp,
    inputError,
    result,
    computing,
  }
}
