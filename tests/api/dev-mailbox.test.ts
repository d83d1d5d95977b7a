import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { devMailSchema } from '../../shared/schemas/dev-mail'
import { createTestContext } from '../support/test-context'

describe('GET /api/dev/mail', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('lists a message sent through the real SMTP fake, with its links', async () => {
    const to = `mailbox-${Date.now()}@example.test`
    await ctx.mail.send({ to, subject: 'Mailbox check', text: 'Open https://rockerbook.test/verify?token=abc123. Thanks' })
    const res = await request(createApp(ctx)).get('/api/dev/mail').expect(200)
    const mine = res.body.map((m: unknown) => devMailSchema.parse(m)).find((m: { to: string[] }) => m.to.includes(to))
    expect(mine.subject).toBe('Mailbox check')
    expect(mine.links).toEqual(['https://rockerbook.test/verify?token=abc123'])
  })

  it('does not exist when a real relay is configured (no mailbox folder)', async () => {
    const app = createApp({ ...ctx, config: { ...ctx.config, DEV_MAILBOX_DIR: undefined } })
    await request(app).get('/api/dev/mail').expect(404)
  })
})
