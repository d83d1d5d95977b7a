import type { Page } from 'playwright-core'
import type { DevMail } from '../../shared/schemas/dev-mail'
import { baseUrl } from './browser'

export const E2E_PASSWORD = 'rocker and heel lift'
const headers = () => ({ 'Content-Type': 'application/json', Origin: new URL(baseUrl()).origin })

/** Waits for the app's SMTP fake to hold a message to `to` whose subject matches. */
export async function waitForMailTo(to: string, subject: RegExp = /./, timeoutMs = 30_000): Promise<DevMail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const mails = (await (await fetch(`${baseUrl()}/api/dev/mail`)).json()) as DevMail[]
    const found = mails.find((m) => m.to.includes(to) && subject.test(m.subject))
    if (found) return found
    if (Date.now() > until) throw new Error(`no mail to ${to} matching ${subject}`)
    await new Promise((r) => setTimeout(r, 250))
  }
}

/** A verified account made through the public API, as the person would on their own device. */
export async function createVerifiedPerson(email: string, name: string, roles: { skates: boolean; coaches: boolean }) {
  const res = await fetch(`${baseUrl()}/api/auth/sign-up`, {
    method: 'POST', headers: headers(), body: JSON.stringify({ email, password: E2E_PASSWORD, name, ...roles }),
  })
  if (res.status !== 201) throw new Error(`sign-up answered ${res.status}`)
  const mail = await waitForMailTo(email)
  const token = new URL(mail.links[0]).searchParams.get('token')
  const verified = await fetch(`${baseUrl()}/api/auth/verify`, { method: 'POST', headers: headers(), body: JSON.stringify({ token }) })
  if (verified.status !== 204) throw new Error(`verify answered ${verified.status}`)
}

/** Signs in through the sign-in page; the page's context keeps the session cookie for later API calls too. */
export async function signInPage(page: Page, email: string): Promise<void> {
  await page.goto(`${baseUrl()}/sign-in`)
  await page.locator('input[name=email]').fill(email)
  await page.locator('input[name=password]').fill(E2E_PASSWORD)
  await page.getByRole('button', { name: 'Sign in', exact: true }).last().click()
  await page.getByTestId('signed-in-as').waitFor()
}

/** A JSON API call with the page's cookies and the app's Origin, as the app itself would make it. */
export async function api<T>(page: Page, method: 'GET' | 'POST' | 'PUT', path: string, data?: unknown): Promise<T> {
  const res = await page.request.fetch(`${baseUrl()}/api${path}`, { method, data, headers: { Origin: new URL(baseUrl()).origin } })
  if (!res.ok()) throw new Error(`${method} ${path} answered ${res.status()}: ${await res.text()}`)
  return (await res.json()) as T
}
