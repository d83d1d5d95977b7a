import { ref } from 'vue'

/** Busy flag and user-facing error for one action, so forms show a wait and a message without repeating try/catch. */
export function useMutationState() {
  const busy = ref(false)
  const error = ref<string | null>(null)

  async function run<T>(action: () => Promise<T>): Promise<T | undefined> {
    busy.value = true
    error.value = null
    try {
      return await action()
    } catch (e) {
      error.value = (e as Error).message
      return undefined
    } finally {
      busy.value = false
    }
  }

  return { busy, error, run }
}
