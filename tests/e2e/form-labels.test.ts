import { randomBytes } from 'node:crypto'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseUrl, launchBrowser } from '../support/browser'
import { E2E_PASSWORD, createVerifiedPerson, signInPage } from '../support/e2e-people'

const tag = randomBytes(3).toString('hex')
const email = `labels-${tag}@example.test`

/**
 * How each visible control in the page's main area is named, in page order: by its own <label> (or the one its
 * group refers to) as the label's text, by an aria-label as "(aria-label) …", and "(unnamed)" where nothing names it.
 */
async function controlNames(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const text = (el: Element | null) => (el?.textContent ?? '').replace(/\s+/g, ' ').replace(/\s*\*$/, '').trim()
    const byIds = (ids: string) => ids.split(/\s+/).map((id) => text(document.getElementById(id))).join(' ')
    const shown = (el: Element) => {
      const box = el.getBoundingClientRect()
      return box.width > 0 && box.height > 0 && getComputedStyle(el).visibility !== 'hidden'
    }
    // NSelect renders no <input> when not filterable: its selection box is the control.
    const controls = [...document.querySelectorAll('main input:not([type=hidden]), main textarea, main [role=checkbox], main .n-base-selection')]
    return controls.filter(shown).map((el) => {
      const labels = (el as HTMLInputElement).labels
      if (labels?.length) return [...labels].map(text).join(' ')
      const own = el.getAttribute('aria-labelledby')
      if (own) return byIds(own)
      const group = el.closest('[role=group][aria-labelledby], [role=radiogroup][aria-labelledby]')
      if (group) return byIds(group.getAttribute('aria-labelledby')!)
      const ariaLabel = el.getAttribute('aria-label')
      return ariaLabel ? `(aria-label) ${ariaLabel}` : '(unnamed)'
    })
  })
}

describe('form labels name their controls, in a real browser', () => {
  let browser: Awaited<ReturnType<typeof launchBrowser>>

  beforeAll(async () => {
    browser = await launchBrowser()
    await createVerifiedPerson(email, 'Skater Tove', { skates: true, coaches: false })
  })
  afterAll(() => browser?.dispose())

  it('signs up through the labels alone', async () => {
    const page = await browser.newPage()
    await page.goto(`${baseUrl()}/sign-up`)
    await page.getByLabel('Your name', { exact: true }).waitFor()
    expect(await controlNames(page)).toEqual([
      'Your name', 'E-mail address', 'Password',
      'I skate, or I look after skaters’ blades (a parent or guardian)', 'I coach skaters',
    ])
    await page.getByLabel('Your name', { exact: true }).fill('Skater Lumi')
    await page.getByLabel('E-mail address', { exact: true }).fill(`labels-new-${tag}@example.test`)
    await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD)
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.getByTestId('verify-notice').waitFor()
    await page.context().clearCookies()
    await page.close()
  })

  it('signs in, adds a skater and a pair, and reads the blade page through the labels', async () => {
    const page = await browser.newPage()
    await page.goto(`${baseUrl()}/sign-in`)
    await page.getByLabel('E-mail address', { exact: true }).waitFor()
    expect(await controlNames(page)).toEqual(['E-mail address', 'Password'])
    await page.getByLabel('E-mail address', { exact: true }).fill(email)
    await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD)
    await page.getByRole('button', { name: 'Sign in', exact: true }).last().click()
    await page.getByTestId('signed-in-as').waitFor()

    await page.goto(`${baseUrl()}/skaters`)
    await page.getByLabel('Skater’s name', { exact: true }).fill('Tove')
    await page.getByRole('button', { name: 'Add skater' }).click()
    await page.getByRole('cell', { name: 'Tove', exact: true }).waitFor()

    await page.goto(`${baseUrl()}/blades`)
    await page.getByLabel('Name of the pair', { exact: true }).waitFor()
    expect(await controlNames(page)).toEqual([
      'Skater', 'Name of the pair', 'Blade size (in)', 'Discipline', 'Model (as written on the blade)',
      'Sharpenings so far (0 if new)', '(aria-label) Filter pairs',
    ])
    await page.getByLabel('Name of the pair', { exact: true }).fill('Test skates')
    await page.getByLabel('Blade size (in)', { exact: true }).fill('10')
    await page.getByLabel('Discipline', { exact: true }).click()
    await page.locator('.n-base-select-option', { hasText: 'dance' }).click()
    await page.getByLabel('Sharpenings so far (0 if new)', { exact: true }).fill('3')
    await page.getByRole('button', { name: 'Add pair' }).click()
    const row = page.locator('tr', { hasText: 'Test skates' })
    await row.waitFor()
    expect(await row.textContent()).toMatch(/Test skates.*Tove.*10.*dance/)

    await row.locator('[data-blade="Test skates:left"]').click()
    await page.getByRole('heading', { name: 'Left blade' }).waitFor()
    const names = await controlNames(page)
    expect(names.slice(0, 10)).toEqual([
      'Model', 'Mounted on', 'Sharpenings when registered', 'Status', 'Notes',
      'Date', 'Shop', 'Technician', 'Root radius', 'Notes',
    ])
    expect(names.filter((n) => n === '(unnamed)')).toEqual([])
    expect(await page.getByLabel('Sharpenings when registered', { exact: true }).inputValue()).toBe('3')
    await page.close()
  })

  it('changes the password on the Account page through the labels, showing the API’s message when it is refused', async () => {
    const page = await browser.newPage()
    await page.context().clearCookies()
    await signInPage(page, email)
    await page.goto(`${baseUrl()}/account`)
    const current = page.getByLabel('Current password', { exact: true })
    await current.waitFor()
    expect(await controlNames(page)).toEqual(['Current password', 'New password'])
    await current.fill('not the password at all')
    await page.getByLabel('New password', { exact: true }).fill(`${E2E_PASSWORD} again`)
    await page.getByRole('button', { name: 'Change password' }).click()
    await page.getByRole('alert').filter({ hasText: 'The current password is not right.' }).waitFor()

    await current.fill(E2E_PASSWORD)
    await page.getByRole('button', { name: 'Change password' }).click()
    await page.getByText('Password changed. Your other sessions are signed out.').waitFor()
    await expect.poll(() => current.inputValue()).toBe('')
    expect(await page.getByRole('alert').filter({ hasText: 'The current password is not right.' }).count()).toBe(0)
    await page.close()
  })
})
