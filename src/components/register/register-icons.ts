// Icons of the register and energy screens, inline SVG from @quasar/extras like src/icons.ts; kept
// here so the features stay inside their own folders.
export {
  mdiCalendarRange as iconSeason,
  mdiCashMultiple as iconTariff,
  mdiClockOutline as iconSchedule,
  mdiFileDelimitedOutline as iconCsv,
  mdiMagnify as iconSearch,
} from '@quasar/extras/mdi-v7'
