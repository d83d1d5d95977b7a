import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { authRateLimits } from '../../server/middleware/rate-limits'
import { agent, signedInAs, TEST_PASSWORD, uniqueEmail } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('rate limits on sign-in, sign-up and reset', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>

  beforeAll(async () => {
    ctx = await createTestContext()
  })
  afterAll(() => ctx.dispose())

  it('locks an account after repeated wrong passwords, even for the right one, while others still sign in', async () => {
    const app = createApp(ctx)
    const { email } = await signedInAs(app, ctx, ['skater'])
    for (let i = 0; i < authRateLimits.signInPerAccount.limit; i++) {
      await agent(app, ctx).post('/api/auth/sign-in').send({ email, password: `wrong ${i}` }).expect(401)
    }
    const locked = await agent(app, ctx).post('/api/auth/sign-in').send({ email: email.toUpperCase(), password: TEST_PASSWORD }).expect(429)
    expect(locked.body.error.code).toBe('RATE_LIMITED')
    const other = await signedInAs(app, ctx, ['skater'])
    await other.client.get('/api/auth/me').expect(200)
  })

  it('counts only failed sign-ins, so people who get in are not slowed down', async () => {
    const app = createApp(ctx)
    const { email } = await signedInAs(app, ctx, ['skater'])
    for (let i = 0; i <= authRateLimits.signInPerAccount.limit; i++) {
      await agent(app, ctx).post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(200)
    }
  })

  it('limits sign-in attempts per client address across accounts', async () => {
    const app = createApp(ctx)
    for (let i = 0; i < authRateLimits.signInPerAddress.limit; i++) {
      await agent(app, ctx).post('/api/auth/sign-in').send({ email: `probe-${i}@example.test`, password: '' }).expect(400)
    }
    await agent(app, ctx).post('/api/auth/sign-in').send({ email: 'one-more@example.test', password: 'x' }).expect(429)
  })

  it('limits sign-ups per client address and per e-mail address', async () => {
    const app = createApp(ctx)
    const email = uniqueEmail('signup-limit')
    for (let i = 0; i < authRateLimits.signUpPerAccount.limit; i++) {
      await agent(app, ctx).post('/api/auth/sign-up').send({ email, password: 'short', name: 'X' }).expect(400)
    }
    await agent(app, ctx).post('/api/auth/sign-up').send({ email, password: TEST_PASSWORD, name: 'X' }).expect(429)
    const remaining = authRateLimits.signUpPerAddress.limit - authRateLimits.signUpPerAccount.limit - 1
    for (let i = 0; i < remaining; i++) {
      await agent(app, ctx).post('/api/auth/sign-up').send({ email: `many-${i}@example.test`, password: 'short', name: 'X' }).expect(400)
    }
    await agent(app, ctx).post('/api/auth/sign-up').send({ email: uniqueEmail('fresh'), password: TEST_PASSWORD, name: 'X' }).expect(429)
  })

  it('limits reset requests per e-mail address, known or not', async () => {
    const app = createApp(ctx)
    const email = uniqueEmail('reset-limit')
    for (let i = 0; i < authRateLimits.resetPerAccount.limit; i++) {
      await agent(app, ctx).post('/api/auth/reset-request').send({ email }).expect(202)
    }
    const res = await agent(app, ctx).post('/api/auth/reset-request').send({ email }).expect(429)
    expect(res.headers['ratelimit-policy'] ?? res.headers['ratelimit']).toBeDefined()
    await agent(app, ctx).post('/api/auth/reset-request').send({ email: uniqueEmail('other') }).expect(202)
  })
})
