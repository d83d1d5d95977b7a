import type { Express } from 'express'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { comparisonSchema } from '../../shared/schemas/comparison'
import { resultOf, storeMeasured } from '../factories/analysis-results'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { withTestApp, type TestContext } from '../support/test-app'

describe('shop reference profiles', () => {
  let ctx: TestContext
  let app: Express
  withTestApp((c, a) => ([ctx, app] = [c, a]))

  it('answers 401 without a session', async () => {
    const id = '00000000-0000-4000-8000-000000000000'
    await request(app).get(`/api/shops/${id}/reference-profiles`).expect(401)
    await request(app).get(`/api/analyses/${id}/compare-reference`).expect(401)
  })

  it('keeps a new blade\u2019s profile for its model and size, and compares another customer\u2019s blade with it', async () => {
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Reference Grinders' }).expect(201)).body
    const first = await signedInAs(app, ctx, ['skater'])
    const a = await skaterWithPair(first.client, { sizeIn: 10 })
    await first.client.patch(`/api/blades/${a.leftId}`).send({ modelLabel: 'Test Model A' }).expect(200)
    await first.client.post(`/api/skaters/${a.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    const fresh = await storeMeasured(ctx, a.leftId, resultOf({ heelLiftMm: 25 }), new Date('2026-10-01T10:00:00Z'))
    const saved = await shopAdmin.client.post(`/api/shops/${shop.id}/reference-profiles`).send({ analysisId: fresh }).expect(201)
    expect(saved.body).toMatchObject({ modelLabel: 'Test Model A', sizeIn: 10, sourceAnalysisId: fresh, savedBy: 'Test shopadmin' })
    expect((await shopAdmin.client.get(`/api/shops/${shop.id}/reference-profiles`).expect(200)).body).toHaveLength(1)

    const second = await signedInAs(app, ctx, ['skater'])
    const b = await skaterWithPair(second.client, { sizeIn: 10 })
    await second.client.patch(`/api/blades/${b.rightId}`).send({ modelLabel: ' test model a ' }).expect(200)
    await second.client.post(`/api/skaters/${b.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    const worn = await storeMeasured(ctx, b.rightId, resultOf({ model: { sizeIn: 10, toe: 'right' }, removedMm: 0.3, heelLiftMm: 24 }), new Date())
    const cmp = comparisonSchema.parse((await second.client.get(`/api/analyses/${worn}/compare-reference`).expect(200)).body)
    expect(cmp.kind).toBe('reference')
    // 0.3 mm ground off the generated blade (by construction), against the shop's new-condition copy.
    for (const s of cmp.steelRemoved) if (s.removedMm !== null) expect(s.removedMm).toBeCloseTo(0.3, 2)
    expect(cmp.notes[0]).toMatch(/Reference: Test Model A, 10 in, kept by Reference Grinders/)
  })

  it('refuses a blade without a model label (400), a non-member (404), and a blade with no reference (409)', async () => {
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Strict Grinders' }).expect(201)).body
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client)
    await owner.client.post(`/api/skaters/${ids.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    const id = await storeMeasured(ctx, ids.leftId, resultOf(), new Date())
    const bad = await shopAdmin.client.post(`/api/shops/${shop.id}/reference-profiles`).send({ analysisId: id }).expect(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('analysisId')
    await owner.client.post(`/api/shops/${shop.id}/reference-profiles`).send({ analysisId: id }).expect(404)
    await owner.client.get(`/api/shops/${shop.id}/reference-profiles`).expect(404)
    await owner.client.get(`/api/analyses/${id}/compare-reference`).expect(409)
    const stranger = await signedInAs(app, ctx, ['skater'])
    await stranger.client.get(`/api/analyses/${id}/compare-reference`).expect(404)
  })
})
