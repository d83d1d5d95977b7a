import type { FormItemRule } from 'naive-ui'
import { describe, expect, it } from 'vitest'
import { signUpBodySchema } from '../../../shared/schemas/auth'
import { useZodRules } from '../../../src/composables/useZodRules'

function check(rule: unknown, value: unknown): true | string {
  const result = (rule as FormItemRule).validator!(rule as FormItemRule, value, () => undefined, {}, {})
  return result === true ? true : (result as Error).message
}

describe('useZodRules', () => {
  const rules = useZodRules(signUpBodySchema)

  it('gives the browser the same messages the shared schema gives the server', () => {
    expect(check(rules.password, 'short')).toBe('Use at least 10 characters.')
    expect(check(rules.email, 'not-an-address')).toBe('Enter a valid e-mail address, like name@example.com.')
    expect(check(rules.name, '   ')).toBe('Enter your name.')
  })

  it('passes valid values, including an address typed in capitals', () => {
    expect(check(rules.password, 'long enough passphrase')).toBe(true)
    expect(check(rules.email, 'Someone@Example.TEST')).toBe(true)
  })
})
