import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { adminUserSchema } from '../../shared/schemas/admin'
import { agent, signedInAs, TEST_PASSWORD } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('admin users table', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let app: ReturnType<typeof createApp>

  beforeAll(async () => {
    ctx = await createTestContext()
    app = createApp(ctx)
  })
  afterAll(() => ctx.dispose())

  it('searches by name or e-mail, sets roles, and disabling ends the account’s sessions', async () => {
    const admin = await signedInAs(app, ctx, ['admin'])
    const target = await signedInAs(app, ctx, ['skater'], { label: 'findme' })
    const found = (await admin.client.get('/api/admin/users').query({ q: 'FINDME' }).expect(200)).body.map((u: unknown) => adminUserSchema.parse(u))
    expect(found.map((u: { id: string }) => u.id)).toEqual([target.account.id])
    expect((await admin.client.get('/api/admin/users').query({ q: '%' }).expect(200)).body).toEqual([])

    const updated = (await admin.client.patch(`/api/admin/users/${target.account.id}`).send({ roles: ['skater', 'coach'] }).expect(200)).body
    expect(updated.roles).toEqual(['skater', 'coach'])
    expect((await target.client.get('/api/auth/me').expect(200)).body.roles).toEqual(['skater', 'coach'])

    await admin.client.patch(`/api/admin/users/${target.account.id}`).send({ disabled: true }).expect(200)
    await target.client.get('/api/auth/me').expect(401)
    const refused = await agent(app, ctx).post('/api/auth/sign-in').send({ email: target.email, password: TEST_PASSWORD }).expect(403)
    expect(refused.body.error.code).toBe('ACCOUNT_DISABLED')
    await admin.client.patch(`/api/admin/users/${target.account.id}`).send({ disabled: false }).expect(200)
    await agent(app, ctx).post('/api/auth/sign-in').send({ email: target.email, password: TEST_PASSWORD }).expect(200)
  })

  it('keeps an admin from locking themselves out, and answers 404 for an unknown account', async () => {
    const admin = await signedInAs(app, ctx, ['admin'])
    await admin.client.patch(`/api/admin/users/${admin.account.id}`).send({ disabled: true }).expect(400)
    await admin.client.patch(`/api/admin/users/${admin.account.id}`).send({ roles: ['skater'] }).expect(400)
    await admin.client.patch('/api/admin/users/00000000-0000-4000-8000-000000000000').send({ disabled: true }).expect(404)
    const res = await admin.client.patch(`/api/admin/users/${admin.account.id}`).send({ roles: ['wizard'] }).expect(400)
    expect(res.body.error.details[0].path).toBe('roles.0')
  })

  it('grants admin to the first sign-up with FIRST_ADMIN_EMAIL while no admin exists', async () => {
    const email = `first-admin-${Date.now()}@example.test`
    const firstApp = createApp({ ...ctx, config: { ...ctx.config, FIRST_ADMIN_EMAIL: email } })
    await ctx.db.query(`UPDATE accounts SET roles = array_remove(roles, 'admin')`)
    const res = await agent(firstApp, ctx).post('/api/auth/sign-up').send({ email, password: TEST_PASSWORD, name: 'First Admin' }).expect(201)
    expect(res.body.roles).toEqual(['skater', 'admin'])
  })
})
