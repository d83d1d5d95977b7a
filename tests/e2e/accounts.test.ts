import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { DevMail } from '../../shared/schemas/dev-mail'
import { baseUrl, launchBrowser } from '../support/browser'

const PASSWORD = 'skates on thin steel'

/** A verified coach made through the public API, as another person would on their own device. */
async function createVerifiedCoach(email: string): Promise<void> {
  const headers = { 'Content-Type': 'application/json', Origin: new URL(baseUrl()).origin }
  const signUp = await fetch(`${baseUrl()}/api/auth/sign-up`, { method: 'POST', headers, body: JSON.stringify({ email, password: PASSWORD, name: 'Coach Ilka', skates: false, coaches: true }) })
  expect(signUp.status).toBe(201)
  const mail = await waitForMailTo(email)
  const token = new URL(mail.links[0]).searchParams.get('token')
  expect((await fetch(`${baseUrl()}/api/auth/verify`, { method: 'POST', headers, body: JSON.stringify({ token }) })).status).toBe(204)
}

async function waitForMailTo(email: string): Promise<DevMail> {
  for (let i = 0; i < 50; i++) {
    const mails = (await (await fetch(`${baseUrl()}/api/dev/mail`)).json()) as DevMail[]
    const found = mails.find((m) => m.to.includes(email))
    if (found) return found
    await new Promise((r) => setTimeout(r, 200))
  }
  throw new Error(`no mail to ${email}`)
}

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${baseUrl()}/sign-in`)
  await page.locator('input[name=email]').fill(email)
  await page.locator('input[name=password]').fill(PASSWORD)
  await page.getByRole('button', { name: 'Sign in', exact: true }).last().click()
  await page.getByTestId('signed-in-as').waitFor()
}

describe('accounts and sharing in a real browser', () => {
  let browser: Awaited<ReturnType<typeof launchBrowser>>

  beforeAll(async () => {
    browser = await launchBrowser()
  })
  afterAll(() => browser.dispose())

  it('signs up, verifies from the mailbox page, signs in, shares a skater with a coach, and the coach sees them', async () => {
    const stamp = Date.now()
    const skaterEmail = `e2e-skater-${stamp}@example.test`
    const coachEmail = `e2e-coach-${stamp}@example.test`
    const page = await browser.newPage()

    await page.goto(`${baseUrl()}/sign-up`)
    await page.locator('input[name=name]').fill('Rhea Skater')
    await page.locator('input[name=email]').fill(skaterEmail)
    await page.locator('input[name=password]').fill('short')
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.getByText('Use at least 10 characters.').waitFor() // the shared schema's message
    await page.locator('input[name=password]').fill(PASSWORD)
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.getByTestId('verify-notice').waitFor()

    await page.goto(`${baseUrl()}/mailbox`)
    const message = page.locator('[data-mail-id]', { hasText: skaterEmail })
    await message.waitFor()
    await message.locator('a[href*="/verify?token="]').click()
    await page.getByText('Address confirmed').waitFor()

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/sign-in/)
    await signIn(page, skaterEmail)
    expect(await page.getByTestId('verify-notice').count()).toBe(0)

    await page.goto(`${baseUrl()}/skaters`)
    await page.locator('input[name=skater-name]').fill('Elin Skater')
    await page.getByRole('button', { name: 'Add skater' }).click()
    await page.locator('td', { hasText: 'Elin Skater' }).waitFor()

    await createVerifiedCoach(coachEmail)
    await page.goto(`${baseUrl()}/sharing`)
    await page.getByTestId('share-skater').click()
    await page.locator('.n-base-select-option', { hasText: 'Elin Skater' }).click()
    await page.locator('input[name=coach-email]').fill(coachEmail)
    await page.getByRole('button', { name: 'Send the invitation' }).click()
    await page.getByText('waiting for the coach to accept').waitFor()

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/sign-in/)
    await signIn(page, coachEmail)
    await page.goto(`${baseUrl()}/roster`)
    await page.getByText('No skaters share with you yet.').waitFor()
    await page.goto(`${baseUrl()}/sharing`)
    await page.getByRole('button', { name: 'Accept' }).click()
    await page.goto(`${baseUrl()}/roster`)
    await page.locator('td', { hasText: 'Elin Skater' }).waitFor()
    expect(await page.locator('td', { hasText: 'Rhea Skater' }).count()).toBe(1)
    await page.close()
  })

  it('sends a signed-out visitor to sign in with the way back, and a skater away from the admin page', async () => {
    const page = await browser.newPage()
    await page.context().clearCookies()
    await page.goto(`${baseUrl()}/roster`)
    await page.waitForURL(/\/sign-in\?redirect=(%2F|\/)roster$/)
    // Signing up through the page's own request context gives the browser the session cookie.
    const res = await page.request.post(`${baseUrl()}/api/auth/sign-up`, {
      headers: { Origin: new URL(baseUrl()).origin },
      data: { email: `e2e-plain-${Date.now()}@example.test`, password: PASSWORD, name: 'Plain Skater' },
    })
    expect(res.status()).toBe(201)
    await page.goto(`${baseUrl()}/admin`)
    await page.getByText('No access').first().waitFor()
    expect(await page.getByRole('link', { name: 'Admin' }).count()).toBe(0)
    await page.close()
  })
})
