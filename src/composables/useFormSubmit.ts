import type { FormInst } from 'naive-ui'
import type { Ref } from 'vue'
import { useMutationState } from './useMutationState'

/**
 * The submit flow every form shares: validate against the schema rules, show the wait, run the action, and turn a
 * failure into the message the API client already wrote for people. The action runs only when the form is valid.
 */
export function useFormSubmit(form: Ref<FormInst | null>, action: () => Promise<unknown>) {
  const { busy, error, run } = useMutationState()

  async function submit(): Promise<void> {
    await form.value?.validate()
    await run(action)
  }

  return { busy, error, submit }
}
