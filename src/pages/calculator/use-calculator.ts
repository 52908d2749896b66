import { computed, onBeforeUnmount, ref, shallowRef, watch } from 'vue'
import { forecast } from '../../../shared/engine/index'
import type { AssessResponse, ForecastResponse } from '../../../shared/schemas/engine'
import { engineInput, shuntedLampCount, stringStatus, type StringStatus } from '../../../shared/string-status'
import {
  CUSTOM_DEFAULT,
  PRESETS,
  customPreset,
  type CustomSpec,
  type LampPreset,
} from '../../components/calculator/presets'
import { today } from '../../dates'

// Enough simulated runs for a stable summary that still finishes within a frame on a phone.
const TRIALS = 1000
// Typing 2-3-0 should not run the engine three times.
const DEBOUNCE_MS = 150

export interface CalcResult {
  status: StringStatus
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

  const preset = computed<LampPreset>(() =>
    presetId.value === 'custom'
      ? customPreset(custom.value)
      : (PRESETS.find((p) => p.id === presetId.value) ?? PRESETS[0]),
  )
  const maxOut = computed(() => shuntedLampCount(preset.value))
  const hasFuseLamp = computed(
    () => preset.value.wiring === 'series' && preset.value.classes.some((c) => !c.shunted),
  )

  // A new type brings its own supply; editing a custom type keeps the voltage the user set.
  watch(presetId, () => {
    supplyVolts.value = preset.value.supplyVolts
  })
  watch([maxOut, hasFuseLamp], () => {
    lampsOut.value = Math.min(lampsOut.value, maxOut.value)
    if (!hasFuseLamp.value) fuseFailed.value = false
  })

  const inputError = computed(() => {
    const v = supplyVolts.value
    if (v === null || !Number.isFinite(v) || v <= 0 || v > 1000)
      return 'Enter a supply voltage from 1 to 1000 V.'
    if (presetId.value !== 'custom') return null
    if (!Number.isInteger(custom.value.count) || custom.value.count < 1 || custom.value.count > 10000)
      return 'Enter a lamp count from 1 to 10,000.'
    if (!(custom.value.ratedVolts > 0 && custom.value.ratedVolts <= 1000))
      return 'Enter the lamp rating in volts, up to 1000 V.'
    if (!(custom.value.ratedAmps > 0 && custom.value.ratedAmps <= 100))
      return 'Enter the lamp rating in amps, up to 100 A.'
    if (!(custom.value.ratedLifeHours > 0)) return 'Enter the rated life in hours.'
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
    // The same rules the server uses for the state marks on the map and string pages.
    const { status, result: assessment } = stringStatus({ ...p, supplyVolts: supply }, condition)
    const req = engineInput(p, condition, supply)
    result.value = {
      status,
      preset: p,
      assessment,
      forecast: forecast({
        ...req,
        ratedLifeHours: p.ratedLifeHours,
        weibullShape: p.weibullShape,
        shuntFailProbability: p.shuntFailProbability,
        startDate: today(),
        trials: TRIALS,
      }),
    }
  }

  watch(
    [preset, supplyVolts, lampsOut, fuseFailed],
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
    preset,
    maxOut,
    hasFuseLamp,
    inputError,
    result,
    computing,
  }
}
