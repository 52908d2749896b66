// A page whose title depends on what it shows ("Tomorrow's run") sets it here; the layout's header
// and the browser tab read it in place of the route's fixed title until the page goes.
import { onBeforeUnmount, readonly, ref, toValue, watchEffect, type MaybeRefOrGetter } from 'vue'

const current = ref<string | null>(null)

/** The title a page has set, or null (then the route's own). */
export const pageTitle = readonly(current)

export function usePageTitle(title: MaybeRefOrGetter<string | null>): void {
  watchEffect(() => (current.value = toValue(title)))
  onBeforeUnmount(() => (current.value = null))
}
