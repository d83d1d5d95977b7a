import { randomBytes } from 'node:crypto'
import type { Express } from 'express'
import request from 'supertest'
import type TestAgent from 'supertest/lib/agent'
import type { Role } from '../../shared/schemas/auth'
import type { DevMail } from '../../shared/schemas/dev-mail'
import type { AppContext } from '../../server/context'
import { createAccount } from '../../server/services/auth.service'

export const TEST_PASSWORD = 'correct horse battery'

/** The app's public origin, which every state-changing request must carry (see middleware/origin-check.ts). */
export function appOrigin(ctx: AppContext): string {
  return new URL(ctx.config.PUBLIC_URL).origin
}

/** A cookie-keeping client that sends the app's Origin on every request, as the browser does. */
export function agent(app: Express, ctx: AppContext): TestAgent {
  return request.agent(app).set('Origin', appOrigin(ctx))
}

export function uniqueEmail(label: string): string {
  return `${label}-${randomBytes(4).toString('hex')}@example.test`
}

/** Creates an account straight through the service (no sign-up limits, no mail) and signs it in. */
export async function signedInAs(app: Express, ctx: AppContext, roles: Role[], options: { verified?: boolean; label?: string } = {}) {
  const email = uniqueEmail(options.label ?? roles.join('-') ?? 'user')
  const account = await createAccount(ctx, { email, password: TEST_PASSWORD, name: `Test ${options.label ?? roles.join(' ')}`, roles, verified: options.verified ?? true })
  const client = agent(app, ctx)
  await client.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(200)
  return { client, account, email }
}

/** Waits for the SMTP fake to hold a message to `to` whose subject matches, reading it as the app's mailbox does. */
export async function waitForMail(app: Express, to: string, subject: RegExp, timeoutMs = 10_000): Promise<DevMail> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const res = await request(app).get('/api/dev/mail').expect(200)
    const found = (res.body as DevMail[]).find((m) => m.to.includes(to) && subject.test(m.subject))
    if (found) return found
    if (Date.now() > until) throw new Error(`No mail to ${to} matching ${subject} within ${timeoutMs} ms`)
    await new Promise((r) => setTimeout(r, 150))
  }
}

/** The `token` query parameter of the first link in a message. */
export function tokenFrom(mail: DevMail): string {
  const link = mail.links.find((l) => new URL(l).searchParams.has('token'))
  if (!link) throw new Error(`No link with a token in "${mail.subject}"`)
  return new URL(link).searchParams.get('token')!
}
