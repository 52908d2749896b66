// Icons of the certificate screens, inline SVG from @quasar/extras like src/icons.ts; kept here so
// the feature stays inside its own folders.
export {
  mdiAlertOutline as iconAdvisory,
  mdiCalendarAlert as iconOverdue,
  mdiCalendarClock as iconDue,
  mdiCheckCircleOutline as iconPass,
  mdiCloseOctagonOutline as iconFail,
  mdiMagnify as iconSearch,
  mdiPlusCircleOutline as iconRecord,
} from '@quasar/extras/mdi-v7'
