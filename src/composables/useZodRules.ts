import type { FormItemRule, FormRules } from 'naive-ui'
import type { ZodObject, ZodRawShape, ZodType } from 'zod'

/**
 * Naive UI form rules from a shared zod object schema, so the browser shows the same messages the server answers
 * with. Each field is checked on its own; `extra` adds rules that span fields (a repeated password).
 */
export function useZodRules<S extends ZodRawShape>(schema: ZodObject<S>, extra: FormRules = {}): FormRules {
  const rules: FormRules = {}
  for (const [field, fieldSchema] of Object.entries(schema.shape)) {
    const rule: FormItemRule = {
      trigger: ['blur', 'input'],
      validator: (_rule, value: unknown) => {
        const result = (fieldSchema as unknown as ZodType).safeParse(value)
        return result.success ? true : new Error(result.error.issues[0]?.message ?? 'Check this field.')
      },
    }
    rules[field] = rule
  }
  return { ...rules, ...extra }
}
