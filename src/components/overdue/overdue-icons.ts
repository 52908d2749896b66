// Icons of the manager's overdue screen, inline SVG from @quasar/extras like src/icons.ts; kept here
// so the feature stays inside its own folders.
export {
  mdiAlarmLightOutline as iconEmergency,
  mdiCalendarClock as iconDueSoon,
  mdiClockAlertOutline as iconLate,
  mdiFileDelimitedOutline as iconCsv,
} from '@quasar/extras/mdi-v7'
