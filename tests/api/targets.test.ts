import type { Express } from 'express'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { bladeTargetsSchema, type ResolvedTargetDto } from '../../shared/schemas/targets'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { withTestApp, type TestContext } from '../support/test-app'

const byMetric = (targets: ResolvedTargetDto[], metric: string) => targets.find((t) => t.metric === metric)!

describe('target bands', () => {
  let ctx: TestContext
  let app: Express
  withTestApp((c, a) => ([ctx, app] = [c, a]))

  it('answers 401 without a session', async () => {
    await request(app).get('/api/blades/00000000-0000-4000-8000-000000000000/targets').expect(401)
    await request(app).get('/api/skaters/00000000-0000-4000-8000-000000000000/targets').expect(401)
  })

  it('gives the platform defaults, with the long-blade rule from the blade size', async () => {
    const owner = await signedInAs(app, ctx, ['skater'])
    const short = await skaterWithPair(owner.client, { sizeIn: 9.5 })
    const long = await skaterWithPair(owner.client, { sizeIn: 11 })
    const a = bladeTargetsSchema.parse((await owner.client.get(`/api/blades/${short.leftId}/targets`).expect(200)).body)
    // DESIGN.md §5 (common practice, no published source): 35–45 mm; over 10.5 in, +2 mm per 1/4 in (our rule).
    expect(byMetric(a.targets, 'touchPointMm')).toMatchObject({ layer: 'platform', band: { min: 35, max: 45 }, setBy: null })
    const b = bladeTargetsSchema.parse((await owner.client.get(`/api/blades/${long.leftId}/targets`).expect(200)).body)
    expect(byMetric(b.targets, 'touchPointMm').band).toEqual({ min: 35, max: 49 })
    expect(a.shop).toBeNull()
  })

  it('answers 400 with the failing paths for a crossed band and an unknown metric', async () => {
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client)
    const crossed = await owner.client.put(`/api/blades/${ids.leftId}/targets/touchPointMm`).send({ min: 45, max: 35 }).expect(400)
    expect(crossed.body.error.details.map((d: { path: string }) => d.path)).toContain('min')
    const unknown = await owner.client.put(`/api/blades/${ids.leftId}/targets/shoeSize`).send({ min: 1, max: 2 }).expect(400)
    expect(unknown.body.error.details.map((d: { path: string }) => d.path)).toContain('metric')
    await owner.client.put(`/api/skaters/${ids.skaterId}/targets/heelLiftMm`).send({ min: null, max: null }).expect(400)
  })

  it('layers shop < skater < blade, keeping who set each band, in what capacity and when', async () => {
    const owner = await signedInAs(app, ctx, ['skater'], { label: 'owner' })
    const ids = await skaterWithPair(owner.client)
    const coach = await signedInAs(app, ctx, ['coach'], { label: 'coach' })
    const share = (await owner.client.post(`/api/skaters/${ids.skaterId}/shares/coach`).send({ email: coach.email }).expect(201)).body
    await coach.client.post(`/api/shares/${share.id}/accept`).expect(200)
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Target Test Grinders' }).expect(201)).body
    await owner.client.post(`/api/skaters/${ids.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)

    await shopAdmin.client.put(`/api/shops/${shop.id}/targets/heelLiftMm`).send({ min: 18, max: 30 }).expect(200)
    await shopAdmin.client.put(`/api/shops/${shop.id}/targets/touchPointMm`).send({ min: 36, max: 44 }).expect(200)
    const set = await coach.client.put(`/api/skaters/${ids.skaterId}/targets/touchPointMm`)
      .send({ min: 38, max: 42, note: 'Balance further forward for spins' }).expect(200)
    expect(set.body).toMatchObject({ setBy: { displayName: 'Test coach', role: 'coach' }, note: 'Balance further forward for spins' })
    await owner.client.put(`/api/blades/${ids.leftId}/targets/contactLengthMm`).send({ min: null, max: 4 }).expect(200)

    const left = bladeTargetsSchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/targets`).expect(200)).body)
    expect(left.shop).toEqual({ id: shop.id, name: 'Target Test Grinders' })
    expect(byMetric(left.targets, 'heelLiftMm')).toMatchObject({ layer: 'shop', band: { min: 18, max: 30 }, setBy: { role: 'shop admin' } })
    expect(byMetric(left.targets, 'touchPointMm')).toMatchObject({ layer: 'skater', band: { min: 38, max: 42 } })
    expect(byMetric(left.targets, 'contactLengthMm')).toMatchObject({ layer: 'blade', band: { min: null, max: 4 }, setBy: { role: 'skater' } })
    expect(Date.parse(byMetric(left.targets, 'contactLengthMm').setAt!)).toBeGreaterThan(Date.now() - 60_000)
    const right = bladeTargetsSchema.parse((await coach.client.get(`/api/blades/${ids.rightId}/targets`).expect(200)).body)
    expect(byMetric(right.targets, 'contactLengthMm').layer).toBe('platform') // the blade preference is the left blade's

    await owner.client.delete(`/api/skaters/${ids.skaterId}/targets/touchPointMm`).expect(204)
    const after = bladeTargetsSchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/targets`).expect(200)).body)
    expect(byMetric(after.targets, 'touchPointMm')).toMatchObject({ layer: 'shop', band: { min: 36, max: 44 } })
    await owner.client.delete(`/api/skaters/${ids.skaterId}/targets/touchPointMm`).expect(404)
  })

  it('answers 404 alike for another owner\u2019s blade or skater, a shop one does not work at, and made-up ids', async () => {
    const owner = await signedInAs(app, ctx, ['skater'], { label: 'owner' })
    const other = await signedInAs(app, ctx, ['skater', 'coach'], { label: 'other' })
    const ids = await skaterWithPair(owner.client)
    const notYours = await other.client.get(`/api/blades/${ids.leftId}/targets`).expect(404)
    const missing = await other.client.get('/api/blades/00000000-0000-4000-8000-000000000000/targets').expect(404)
    expect(notYours.body).toEqual(missing.body)
    await other.client.put(`/api/blades/${ids.leftId}/targets/touchPointMm`).send({ min: 30, max: 40 }).expect(404)
    await other.client.put(`/api/skaters/${ids.skaterId}/targets/touchPointMm`).send({ min: 30, max: 40 }).expect(404)
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Closed Shop' }).expect(201)).body
    await other.client.put(`/api/shops/${shop.id}/targets/touchPointMm`).send({ min: 30, max: 40 }).expect(404)
    await other.client.get(`/api/shops/${shop.id}/targets`).expect(404)
  })

  it('keeps a shop\u2019s minimum runner height for its members and shows it in the blade\u2019s history', async () => {
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Height Grinders' }).expect(201)).body
    expect((await shopAdmin.client.get(`/api/shops/${shop.id}/wear-settings`).expect(200)).body.minRunnerHeightMm).toBeNull()
    const bad = await shopAdmin.client.put(`/api/shops/${shop.id}/wear-settings`).send({ minRunnerHeightMm: 1 }).expect(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('minRunnerHeightMm')
    const set = await shopAdmin.client.put(`/api/shops/${shop.id}/wear-settings`).send({ minRunnerHeightMm: 22.5 }).expect(200)
    expect(set.body).toMatchObject({ minRunnerHeightMm: 22.5, setBy: 'Test shopadmin' })
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client)
    await owner.client.put(`/api/shops/${shop.id}/wear-settings`).send({ minRunnerHeightMm: 10 }).expect(404)
    await owner.client.post(`/api/skaters/${ids.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    const h = (await owner.client.get(`/api/blades/${ids.leftId}/history`).expect(200)).body
    expect(h.runnerHeight).toMatchObject({ measured: false, minMm: 22.5, shop: 'Height Grinders', latest: null })
    await request(app).get(`/api/shops/${shop.id}/wear-settings`).expect(401)
  })

  it('lets a shop\u2019s technician read the blade but not set the skater\u2019s preference', async () => {
    const owner = await signedInAs(app, ctx, ['skater'], { label: 'owner' })
    const ids = await skaterWithPair(owner.client)
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Bench Only' }).expect(201)).body
    await owner.client.post(`/api/skaters/${ids.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    await shopAdmin.client.get(`/api/blades/${ids.leftId}/targets`).expect(200)
    // Policy (server/services/policy.ts): setting preferred targets is the skater's and the coach's, not the shop's.
    await shopAdmin.client.put(`/api/skaters/${ids.skaterId}/targets/touchPointMm`).send({ min: 30, max: 40 }).expect(404)
  })
})
