import { useMessage } from 'naive-ui'
import { ref } from 'vue'
import { useMutationState } from './useMutationState'

/**
 * An action on one row of a list (revoke a session, change an account, end a share): which row waits, and the API's
 * message as a toast when it fails, since a row has no room for an alert of its own.
 */
export function useRowAction() {
  const message = useMessage()
  const { error, run: runAction } = useMutationState()
  const busyId = ref<string | null>(null)

  async function run(id: string, action: () => Promise<unknown>): Promise<void> {
    busyId.value = id
    await runAction(action)
    busyId.value = null
    if (error.value) message.error(error.value)
  }

  return { busyId, run }
}
