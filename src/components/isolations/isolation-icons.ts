// Icons of the safety officer's screens, inline SVG from @quasar/extras like src/icons.ts; kept here
// so the feature stays inside its own folders.
export {
  mdiAlertOctagonOutline as iconSerious,
  mdiAlertOutline as iconMinor,
  mdiCheckCircleOutline as iconApproved,
  mdiCheckboxMarkedCircleOutline as iconStepDone,
  mdiCircleOffOutline as iconStepMissing,
  mdiCloseCircleOutline as iconRejected,
  mdiClockOutline as iconPending,
  mdiKeyVariant as iconLock,
  mdiLockOpenAlertOutline as iconNoIsolation,
  mdiMeterElectricOutline as iconTester,
} from '@quasar/extras/mdi-v7'
