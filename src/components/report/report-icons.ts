// Icons of the public report pages, inline SVG from @quasar/extras like src/icons.ts; kept here so
// the feature stays inside its own folders.
export {
  mdiAlertOctagonOutline as iconDanger,
  mdiCheckCircleOutline as iconSent,
  mdiClose as iconRemove,
  mdiCrosshairsGps as iconLocate,
  mdiMagnify as iconCheck,
  mdiMapMarkerCheckOutline as iconLocated,
} from '@quasar/extras/mdi-v7'
