import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { MailService } from '../../server/services/mail.service'
import { healthSchema } from '../../shared/schemas/health'
import { createTestContext } from '../support/test-context'

describe('GET /api/health', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('reports every real service up with its latency', async () => {
    const res = await request(createApp(ctx)).get('/api/health').expect(200)
    const health = healthSchema.parse(res.body)
    expect(health.status).toBe('up')
    for (const service of Object.values(health.services)) {
      expect(service.status).toBe('up')
      expect(service.latencyMs).toBeGreaterThanOrEqual(0)
    }
  })

  it('answers 503 and names the service that is down', async () => {
    // A mail server on a port where nothing listens: the check must fail, not hang.
    const deadMail = new MailService({ SMTP_URL: 'smtp://127.0.0.1:9', MAIL_FROM: 'x@example.test' })
    const res = await request(createApp({ ...ctx, mail: deadMail })).get('/api/health').expect(503)
    expect(res.body.status).toBe('down')
    expect(res.body.services.mail.status).toBe('down')
    expect(res.body.services.database.status).toBe('up')
  })
})

describe('API error shape', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('answers unknown API paths with a JSON 404, not the client app', async () => {
    const res = await request(createApp(ctx)).get('/api/no-such-thing').expect(404)
    expect(res.body.error.code).toBe('NOT_FOUND')
  })

  it('answers malformed JSON with a 400 and no stack trace', async () => {
    const res = await request(createApp(ctx))
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send('{"broken":')
      .expect(400)
    expect(res.body.error.message).toMatch(/not valid JSON/)
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/)
  })

  it('sets a request id header for log correlation', async () => {
    const res = await request(createApp(ctx)).get('/api/health')
    expect(res.headers['x-request-id']).toMatch(/[0-9a-f-]{36}/)
  })
})
