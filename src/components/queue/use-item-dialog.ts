import type { Ref } from 'vue'
import type { QueueItem } from '../../api/queue'
import { useDialogSubmit } from '../../composables/use-dialog-submit'

/**
 * A dialog about one queue item (snooze, close). A new item starts from `reset`; opening it again for
 * the same item keeps what was typed, until a save succeeds.
 */
export function useItemDialog(
  open: Ref<boolean>,
  item: () => QueueItem | null,
  failed: string,
  reset: () => void,
) {
  const { busy, errorText, submit, clearError } = useDialogSubmit(open, failed)
  let preparedFor: number | null = null

  function prepare(): void {
    if (item()?.id === preparedFor) return
    preparedFor = item()?.id ?? null
    reset()
    clearError()
  }

  async function submitFor(action: (item: QueueItem) => Promise<void>): Promise<void> {
    const current = item()
    if (current && (await submit(() => action(current)))) preparedFor = null
  }

  return { busy, errorText, prepare, submit: submitFor }
}
