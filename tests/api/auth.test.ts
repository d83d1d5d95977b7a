import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { meSchema, sessionInfoSchema } from '../../shared/schemas/auth'
import { agent, signedInAs, TEST_PASSWORD, tokenFrom, uniqueEmail, waitForMail } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('accounts: sign-up, verification, sign-in/out, reset, password change, sessions', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let app: ReturnType<typeof createApp>

  beforeAll(async () => {
    ctx = await createTestContext()
    app = createApp(ctx)
  })
  afterAll(() => ctx.dispose())

  it('signs up, is signed in unverified, then verifies through the link mailed to the SMTP fake', async () => {
    const email = uniqueEmail('signup')
    const client = agent(app, ctx)
    const res = await client.post('/api/auth/sign-up').send({ email: email.toUpperCase(), password: TEST_PASSWORD, name: 'Ada Skater', coaches: true }).expect(201)
    expect(meSchema.parse(res.body)).toMatchObject({ email, roles: ['skater', 'coach'], emailVerified: false })
    const cookie = res.headers['set-cookie'][0]
    expect(cookie).toMatch(/^rb_session=/)
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(cookie).not.toMatch(/Secure/i) // PUBLIC_URL is http:// in tests

    const mail = await waitForMail(app, email, /Confirm your e-mail/)
    expect(mail.text).toContain('Hello Ada Skater')
    const link = new URL(mail.links[0])
    expect(link.origin + link.pathname).toBe(new URL('/verify', ctx.config.PUBLIC_URL).toString())
    await request(app).post('/api/auth/verify').set('Origin', link.origin).send({ token: tokenFrom(mail) }).expect(204)
    expect((await client.get('/api/auth/me').expect(200)).body.emailVerified).toBe(true)
    const again = await request(app).post('/api/auth/verify').set('Origin', link.origin).send({ token: tokenFrom(mail) }).expect(400)
    expect(again.body.error.code).toBe('TOKEN_INVALID')
  })

  it('refuses a second account on the same address, whatever its case', async () => {
    const { email } = await signedInAs(app, ctx, ['skater'])
    const res = await agent(app, ctx).post('/api/auth/sign-up').send({ email: email.toUpperCase(), password: TEST_PASSWORD, name: 'Twin' }).expect(409)
    expect(res.body.error.code).toBe('EMAIL_TAKEN')
  })

  it('answers 400 with the failing paths and the shared schema messages', async () => {
    const res = await agent(app, ctx).post('/api/auth/sign-up').send({ email: 'not-an-address', password: 'short', name: '' }).expect(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path).sort()
    expect(paths).toEqual(['email', 'name', 'password'])
    expect(res.body.error.details.find((d: { path: string }) => d.path === 'password').message).toBe('Use at least 10 characters.')
  })

  it('gives the same answer for an unknown address and a wrong password', async () => {
    const { email } = await signedInAs(app, ctx, ['skater'])
    const wrong = await agent(app, ctx).post('/api/auth/sign-in').send({ email, password: 'not the password' }).expect(401)
    const unknown = await agent(app, ctx).post('/api/auth/sign-in').send({ email: uniqueEmail('nobody'), password: 'not the password' }).expect(401)
    expect(unknown.body).toEqual(wrong.body)
    expect(wrong.headers['set-cookie']).toBeUndefined()
  })

  it('signs out: the session stops working and the cookie is cleared', async () => {
    const { client } = await signedInAs(app, ctx, ['coach'])
    await client.get('/api/auth/me').expect(200)
    const out = await client.post('/api/auth/sign-out').expect(204)
    expect(out.headers['set-cookie'][0]).toMatch(/rb_session=;/)
    await client.get('/api/auth/me').expect(401)
  })

  it('replaces the browser’s earlier session when it signs in again', async () => {
    const { client, email } = await signedInAs(app, ctx, ['skater'])
    await client.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(200)
    expect((await client.get('/api/auth/sessions').expect(200)).body).toHaveLength(1)
  })

  it('resets a forgotten password through a single-use mailed link and ends every session', async () => {
    const { client, email } = await signedInAs(app, ctx, ['skater'])
    await agent(app, ctx).post('/api/auth/reset-request').send({ email }).expect(202)
    const mail = await waitForMail(app, email, /new Rockerbook password/)
    expect(new URL(mail.links[0]).pathname).toBe('/reset-password')
    const token = tokenFrom(mail)
    await agent(app, ctx).post('/api/auth/reset').send({ token, password: 'a brand new passphrase' }).expect(204)
    await client.get('/api/auth/me').expect(401)
    await agent(app, ctx).post('/api/auth/reset').send({ token, password: 'yet another passphrase' }).expect(400)
    await agent(app, ctx).post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(401)
    await agent(app, ctx).post('/api/auth/sign-in').send({ email, password: 'a brand new passphrase' }).expect(200)
  })

  it('answers a reset request for an unknown address exactly as for a known one, and mails nobody', async () => {
    const nobody = uniqueEmail('nobody')
    const res = await agent(app, ctx).post('/api/auth/reset-request').send({ email: nobody }).expect(202)
    expect(res.body).toEqual({ sent: true })
    await expect(waitForMail(app, nobody, /./, 1_000)).rejects.toThrow(/No mail/)
  })

  it('refuses an expired reset link', async () => {
    const { email, account } = await signedInAs(app, ctx, ['skater'])
    await agent(app, ctx).post('/api/auth/reset-request').send({ email }).expect(202)
    const token = tokenFrom(await waitForMail(app, email, /new Rockerbook password/))
    await ctx.db.query(`UPDATE email_tokens SET expires_at = now() - interval '1 second' WHERE account_id = $1`, [account.id])
    const res = await agent(app, ctx).post('/api/auth/reset').send({ token, password: 'a brand new passphrase' }).expect(400)
    expect(res.body.error.code).toBe('TOKEN_INVALID')
  })

  it('changes the password, keeping this session and ending the others', async () => {
    const { client, email } = await signedInAs(app, ctx, ['skater'])
    const other = agent(app, ctx)
    await other.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(200)
    const wrong = await client.post('/api/auth/password').send({ currentPassword: 'nope', newPassword: 'the next passphrase' }).expect(400)
    expect(wrong.body.error.code).toBe('WRONG_PASSWORD')
    await client.post('/api/auth/password').send({ currentPassword: TEST_PASSWORD, newPassword: 'the next passphrase' }).expect(204)
    await client.get('/api/auth/me').expect(200)
    await other.get('/api/auth/me').expect(401)
  })

  it('lists its own sessions and revokes one; another person’s handle is not found', async () => {
    const { client, email } = await signedInAs(app, ctx, ['skater'])
    const second = agent(app, ctx)
    await second.post('/api/auth/sign-in').set('User-Agent', 'second-browser').send({ email, password: TEST_PASSWORD }).expect(200)
    const list = (await client.get('/api/auth/sessions').expect(200)).body.map((s: unknown) => sessionInfoSchema.parse(s))
    expect(list).toHaveLength(2)
    expect(list.filter((s: { current: boolean }) => s.current)).toHaveLength(1)
    const target = list.find((s: { userAgent: string | null }) => s.userAgent === 'second-browser')
    const stranger = await signedInAs(app, ctx, ['skater'])
    await stranger.client.delete(`/api/auth/sessions/${target.id}`).expect(404)
    await second.get('/api/auth/me').expect(200)
    await client.delete(`/api/auth/sessions/${target.id}`).expect(204)
    await second.get('/api/auth/me').expect(401)
  })

  it('refuses a state-changing request without the app’s Origin', async () => {
    const res = await request(app).post('/api/auth/sign-in').send({ email: 'a@example.test', password: 'x' }).expect(403)
    expect(res.body.error.code).toBe('ORIGIN_MISMATCH')
    await request(app).post('/api/auth/sign-in').set('Origin', 'https://elsewhere.example').send({}).expect(403)
    await request(app).get('/api/health').expect((r) => expect(r.status).not.toBe(403))
  })

  it('marks the cookie Secure when the app is served over https', async () => {
    const httpsApp = createApp({ ...ctx, config: { ...ctx.config, PUBLIC_URL: 'https://rockerbook.example' } })
    const { email } = await signedInAs(app, ctx, ['skater'])
    const res = await request(httpsApp).post('/api/auth/sign-in').set('Origin', 'https://rockerbook.example').send({ email, password: TEST_PASSWORD }).expect(200)
    expect(res.headers['set-cookie'][0]).toMatch(/; Secure/)
  })
})
