import { useId } from 'vue'

/**
 * Ties each form label to its control, so a screen reader announces a field by its visible label. Naive UI's NInput
 * and NInputNumber render a real <input> (or <textarea>) that takes an id through `input-props`, so the label points
 * at it with `for`. NSelect, NDatePicker and NRadioGroup render no labelable element and take no input props, so
 * their root becomes a group (or radio group) named by the label's id.
 */
export function useFieldLabels() {
  const prefix = useId()
  const controlId = (field: string) => `${prefix}-${field}`
  const labelId = (field: string) => `${prefix}-${field}-label`

  return {
    /** `label-props` of a field whose control is an <input> or <textarea>. */
    labelFor: (field: string) => ({ for: controlId(field) }),
    /** Spread into that control's `input-props`. */
    input: (field: string) => ({ id: controlId(field) }),
    /** `label-props` of a field whose control has no <input> of its own. */
    labelOf: (field: string) => ({ id: labelId(field) }),
    /** Bound on that control (`v-bind`) so its group carries the label's text as its name. */
    group: (field: string, role: 'group' | 'radiogroup' = 'group') => ({ role, 'aria-labelledby': labelId(field) }),
  }
}
