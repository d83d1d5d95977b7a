import type { FormInst } from 'naive-ui'
import { ref, type Ref } from 'vue'

/**
 * The submit flow every account form shares: validate against the schema rules, show the wait, run the action, and
 * turn a failure into the message the API client already wrote for people.
 */
export function useFormSubmit(form: Ref<FormInst | null>, action: () => Promise<unknown>) {
  const busy = ref(false)
  const error = ref<string | null>(null)

  async function submit(): Promise<void> {
    await form.value?.validate()
    busy.value = true
    error.value = null
    try {
      await action()
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      busy.value = false
    }
  }

  return { busy, error, submit }
}
