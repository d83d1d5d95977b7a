import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { assertSkaterAccess, listAccessibleSkaterIds } from '../../server/services/access.service'
import { shareSchema, skaterSummarySchema } from '../../shared/schemas/sharing'
import { signedInAs, waitForMail } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('skaters, coach and shop sharing, the access helper', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let app: ReturnType<typeof createApp>

  beforeAll(async () => {
    ctx = await createTestContext()
    app = createApp(ctx)
  })
  afterAll(() => ctx.dispose())

  async function skaterWithProfile(name = 'Mia') {
    const owner = await signedInAs(app, ctx, ['skater'], { label: 'parent' })
    const { body } = await owner.client.post('/api/skaters').send({ name }).expect(201)
    return { ...owner, skaterId: body.id as string }
  }

  it('lets a skater account manage several profiles and see only its own', async () => {
    const parent = await skaterWithProfile('Mia')
    await parent.client.post('/api/skaters').send({ name: 'Leo' }).expect(201)
    const other = await skaterWithProfile('Someone else')
    const list = (await parent.client.get('/api/skaters').expect(200)).body.map((s: unknown) => skaterSummarySchema.parse(s))
    expect(list.map((s: { name: string }) => s.name)).toEqual(['Leo', 'Mia'])
    expect(list.every((s: { via: string[] }) => s.via.join() === 'owner')).toBe(true)
    await parent.client.get(`/api/skaters/${other.skaterId}`).expect(404)
    await parent.client.get('/api/skaters/00000000-0000-4000-8000-000000000000').expect(404)
  })

  it('refuses skater profiles to an account without the skater role', async () => {
    const coach = await signedInAs(app, ctx, ['coach'])
    await coach.client.post('/api/skaters').send({ name: 'Nope' }).expect(403)
  })

  it('shares with a coach by e-mail invitation; the coach accepts, sees the skater, and either side ends it', async () => {
    const owner = await skaterWithProfile('Mia')
    const coach = await signedInAs(app, ctx, ['coach'])
    const invited = await owner.client.post(`/api/skaters/${owner.skaterId}/shares/coach`).send({ email: coach.email.toUpperCase() }).expect(201)
    const share = shareSchema.parse(invited.body)
    expect(share).toMatchObject({ kind: 'coach', status: 'pending', coachEmail: coach.email })
    const mail = await waitForMail(app, coach.email, /shared Mia with you/)
    expect(mail.links[0]).toBe(new URL('/sharing', ctx.config.PUBLIC_URL).toString())

    await coach.client.get(`/api/skaters/${owner.skaterId}`).expect(404) // pending grants nothing
    const stranger = await signedInAs(app, ctx, ['coach'])
    await stranger.client.post(`/api/shares/${share.id}/accept`).expect(404) // addressed to someone else

    const mine = (await coach.client.get('/api/shares').expect(200)).body
    expect(mine.map((s: { id: string }) => s.id)).toEqual([share.id])
    await coach.client.post(`/api/shares/${share.id}/accept`).expect(200)
    const roster = (await coach.client.get('/api/roster').expect(200)).body
    expect(roster.map((s: { name: string; via: string[] }) => [s.name, s.via])).toEqual([['Mia', ['coach']]])
    await coach.client.get(`/api/skaters/${owner.skaterId}`).expect(200)

    await coach.client.delete(`/api/shares/${share.id}`).expect(204)
    await coach.client.get(`/api/skaters/${owner.skaterId}`).expect(404)
    expect((await coach.client.get('/api/roster').expect(200)).body).toEqual([])
    await owner.client.delete(`/api/shares/${share.id}`).expect(404) // already ended
  })

  it('lets the owner end a coach share with effect on the coach’s next request', async () => {
    const owner = await skaterWithProfile('Ava')
    const coach = await signedInAs(app, ctx, ['coach'])
    const share = (await owner.client.post(`/api/skaters/${owner.skaterId}/shares/coach`).send({ email: coach.email }).expect(201)).body
    await owner.client.post(`/api/skaters/${owner.skaterId}/shares/coach`).send({ email: coach.email }).expect(409)
    await coach.client.post(`/api/shares/${share.id}/accept`).expect(200)
    await coach.client.get(`/api/skaters/${owner.skaterId}`).expect(200)
    await owner.client.delete(`/api/shares/${share.id}`).expect(204)
    await coach.client.get(`/api/skaters/${owner.skaterId}`).expect(404)
  })

  it('keeps unverified accounts from sharing and from accepting', async () => {
    const owner = await signedInAs(app, ctx, ['skater'], { verified: false })
    const { body } = await owner.client.post('/api/skaters').send({ name: 'Zoe' }).expect(201)
    const res = await owner.client.post(`/api/skaters/${body.id}/shares/coach`).send({ email: 'coach@example.test' }).expect(403)
    expect(res.body.error.code).toBe('EMAIL_NOT_VERIFIED')
    const verifiedOwner = await skaterWithProfile('Kai')
    const coach = await signedInAs(app, ctx, ['coach'], { verified: false })
    const share = (await verifiedOwner.client.post(`/api/skaters/${verifiedOwner.skaterId}/shares/coach`).send({ email: coach.email }).expect(201)).body
    const refused = await coach.client.post(`/api/shares/${share.id}/accept`).expect(403)
    expect(refused.body.error.code).toBe('EMAIL_NOT_VERIFIED')
  })

  it('runs a shop: create, invite a technician by e-mail, share a skater, the technician sees it, either side ends it', async () => {
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'North Rink Edge Works' }).expect(201)).body
    expect((await shopAdmin.client.get('/api/auth/me')).body.roles).toEqual(['shop_admin'])

    const tech = await signedInAs(app, ctx, [], { label: 'tech' })
    await tech.client.post(`/api/shops/${shop.id}/invitations`).send({ email: tech.email }).expect(404) // not its admin
    const invitation = (await shopAdmin.client.post(`/api/shops/${shop.id}/invitations`).send({ email: tech.email }).expect(201)).body
    await waitForMail(app, tech.email, /invites you to its Rockerbook bench/)
    expect((await tech.client.get('/api/shop-invitations').expect(200)).body.map((i: { id: string }) => i.id)).toEqual([invitation.id])
    await tech.client.post(`/api/shop-invitations/${invitation.id}/accept`).expect(200)
    expect((await tech.client.get('/api/auth/me')).body.roles).toEqual(['technician'])
    const members = (await shopAdmin.client.get(`/api/shops/${shop.id}/members`).expect(200)).body
    expect(members.map((m: { role: string }) => m.role)).toEqual(['admin', 'technician'])

    const owner = await skaterWithProfile('Noor')
    await tech.client.get(`/api/skaters/${owner.skaterId}`).expect(404)
    const share = (await owner.client.post(`/api/skaters/${owner.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)).body
    expect(share).toMatchObject({ kind: 'shop', status: 'active', shopName: 'North Rink Edge Works' })
    expect((await tech.client.get(`/api/shops/${shop.id}/skaters`).expect(200)).body.map((s: { name: string }) => s.name)).toEqual(['Noor'])
    expect((await tech.client.get(`/api/skaters/${owner.skaterId}`).expect(200)).body.via).toEqual(['shop'])

    await tech.client.delete(`/api/shares/${share.id}`).expect(204)
    await tech.client.get(`/api/skaters/${owner.skaterId}`).expect(404)
    await shopAdmin.client.delete(`/api/shops/${shop.id}/members/${tech.account.id}`).expect(204)
    expect((await tech.client.get('/api/auth/me')).body.roles).toEqual([])
    await tech.client.get(`/api/shops/${shop.id}/skaters`).expect(404)
  })

  it('applies the policy in the access helper: coach reads and annotates, shop reads and writes, owner does all', async () => {
    const owner = await skaterWithProfile('Ines')
    const coach = await signedInAs(app, ctx, ['coach'])
    const share = (await owner.client.post(`/api/skaters/${owner.skaterId}/shares/coach`).send({ email: coach.email }).expect(201)).body
    await coach.client.post(`/api/shares/${share.id}/accept`).expect(200)
    const asCoach = { id: coach.account.id, roles: coach.account.roles }
    await expect(assertSkaterAccess(ctx, asCoach, owner.skaterId, 'read')).resolves.toMatchObject({ name: 'Ines' })
    await expect(assertSkaterAccess(ctx, asCoach, owner.skaterId, 'annotate')).resolves.toBeTruthy()
    await expect(assertSkaterAccess(ctx, asCoach, owner.skaterId, 'write')).rejects.toMatchObject({ status: 404 })
    await expect(assertSkaterAccess(ctx, asCoach, owner.skaterId, 'manage')).rejects.toMatchObject({ status: 404 })
    // Losing the coach role voids the share even though it is still active.
    await expect(assertSkaterAccess(ctx, { ...asCoach, roles: [] }, owner.skaterId, 'read')).rejects.toMatchObject({ status: 404 })
    await expect(assertSkaterAccess(ctx, asCoach, 'not-a-uuid', 'read')).rejects.toMatchObject({ status: 404 })
    expect(await listAccessibleSkaterIds(ctx, asCoach)).toEqual([owner.skaterId])
    const asOwner = { id: owner.account.id, roles: owner.account.roles }
    for (const mode of ['read', 'write', 'annotate', 'manage'] as const) await expect(assertSkaterAccess(ctx, asOwner, owner.skaterId, mode)).resolves.toBeTruthy()

    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Blade Corner' }).expect(201)).body
    await owner.client.post(`/api/skaters/${owner.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    const asShop = { id: shopAdmin.account.id, roles: ['shop_admin' as const] }
    await expect(assertSkaterAccess(ctx, asShop, owner.skaterId, 'write')).resolves.toBeTruthy()
    await expect(assertSkaterAccess(ctx, asShop, owner.skaterId, 'annotate')).rejects.toMatchObject({ status: 404 })
  })
})
