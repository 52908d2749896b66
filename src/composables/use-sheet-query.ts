// The day and crew a printable sheet (run sheet, van load-out) shows, kept in the address so the sheet
// can be bookmarked or reopened to print again. A crew member sees their own crew's; office roles
// choose the crew.
import { computed, ref, watch } from 'vue'
import { storeToRefs } from 'pinia'
import { useRoute, useRouter } from 'vue-router'
import { useAuthStore } from '../stores/auth'

const validDay = (v: unknown) => (typeof v === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(v) ? v : null)

export function useSheetQuery(defaultDay: () => string) {
  const route = useRoute()
  const router = useRouter()
  const { role } = storeToRefs(useAuthStore())
  const isCrew = computed(() => role.value === 'crew')
  const date = ref(validDay(route.query.date) ?? defaultDay())
  const crew = ref<number | null>(Number(route.query.crew) || null)
  watch([date, crew], () => {
    void router.replace({ query: { date: date.value, ...(crew.value ? { crew: String(crew.value) } : {}) } })
  })
  return { isCrew, date, crew }
}
