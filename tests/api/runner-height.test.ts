import type { Express } from 'express'
import { describe, expect, it } from 'vitest'
import { comparisonSchema } from '../../shared/schemas/comparison'
import { CSV_COLUMNS, bladeHistorySchema } from '../../shared/schemas/history'
import { resultOf, storeMeasured } from '../factories/analysis-results'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { binary, pdfText } from '../support/pdf'
import { withTestApp, type TestContext } from '../support/test-app'

const day = (n: number) => new Date(Date.UTC(2026, 9, 1 + n, 10))
const photo2 = { scale: 1, rotationRad: (1.5 * Math.PI) / 180, tx: 12, ty: -5 }

/**
 * Runner height through the history, the wear state, the comparison, the CSV and the report. The fixture's runner
 * (fixtures/measured-result.ts) has a straight top edge 24 mm above L from 70 to 170 mm behind B over the blade
 * model's rocker; grinding raises the rocker by the amount put in and leaves the top edge alone. Touch point and heel
 * lift are held on target, so only the runner height can call for replacement.
 */
describe('runner height in a blade\u2019s history', () => {
  let ctx: TestContext
  let app: Express
  withTestApp((c, a) => ([ctx, app] = [c, a]))

  /** A blade measured new, then after grinding `removedMm`, shared with a shop whose minimum is `minMm`. */
  async function worn(removedMm: number, minMm: number) {
    const shopAdmin = await signedInAs(app, ctx, [], { label: 'shopadmin' })
    const shop = (await shopAdmin.client.post('/api/shops').send({ name: 'Glenmere Edge Works' }).expect(201)).body
    await shopAdmin.client.put(`/api/shops/${shop.id}/wear-settings`).send({ minRunnerHeightMm: minMm }).expect(200)
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client, { sizeIn: 10 })
    await owner.client.post(`/api/skaters/${ids.skaterId}/shares/shop`).send({ shopId: shop.id }).expect(201)
    const held = { touchPointMm: 40, heelLiftMm: 25, topEdgeAboveLMm: 24 }
    const base = await storeMeasured(ctx, ids.leftId, resultOf({ ...held, seed: 1 }), day(0))
    const now = await storeMeasured(ctx, ids.leftId, resultOf({ ...held, removedMm, placement: photo2, seed: 2 }), day(30))
    return { owner, ids, base, now }
  }

  it('reports the height now, at the baseline, the loss since and the shop minimum, and calls for replacement at it', async () => {
    const { owner, ids } = await worn(0.8, 19.5)
    const h = bladeHistorySchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/history`).expect(200)).body)
    const r = h.runnerHeight
    expect(r).toMatchObject({ measured: true, minMm: 19.5, shop: 'Glenmere Edge Works' })
    // 0.8 mm ground off by construction; the support line tilts with T by about 0.5°, which moves heights by microns.
    expect(r.lossStations.map((s) => s.alongMm)).toEqual([80, 90, 100, 110, 120, 130, 140, 150, 160])
    for (const s of r.lossStations) expect(Math.abs(s.lossMm - 0.8)).toBeLessThan(0.01)
    expect(r.loss!.meanMm).toBeCloseTo(0.8, 2)
    expect(r.latest!.heightMm).toBeCloseTo(r.baseline!.heightMm - 0.8, 2)
    // The rocker rises toward the heel under a top edge parallel to L: the lowest station is the last, 160 mm.
    expect(r.latest!.alongMm).toBe(160)
    expect(r.latest!.heightMm).toBeLessThan(19.5)
    expect(r.baseline!.heightMm).toBeGreaterThan(19.5)
    expect(h.rows.map((row) => row.status)).toEqual(['on target', 'on target'])
    expect(h.wear.state).toBe('replace')
    expect(h.wear.reasons[0]).toMatch(/The runner is 1\d\.\d\d mm high, at or below the shop\u2019s minimum of 19\.50 mm/)
    expect(h.rows[1].runnerHeightMm).toBeCloseTo(r.latest!.heightMm, 9)
    expect(h.wearRule).toMatch(/stations every 10 mm where the runner\u2019s top edge shows/)
  })

  it('says nothing about replacement while the runner stands above the minimum, and counts the steel removed', async () => {
    const { owner, ids } = await worn(0.3, 19)
    const h = bladeHistorySchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/history`).expect(200)).body)
    expect(h.wear.state).toBeNull()
    // Baseline lowest height minus the most height lost at any station (0.3 mm, to the microns the tilt moves it).
    expect(Math.abs(h.wear.heightAfterRestoreMm! - (h.runnerHeight.baseline!.heightMm - 0.3))).toBeLessThan(0.01)
  })

  it('registers the comparison on the top edge, lists the runner height change, and exports it to CSV and the report', async () => {
    const { owner, ids, now } = await worn(0.5, 15)
    const cmp = comparisonSchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/compare/baseline`).expect(200)).body)
    expect(cmp.registration.on).toEqual(['toe-pick teeth', 'runner top edge'])
    expect(cmp.notes.join(' ')).toMatch(/teeth and the runner\u2019s top edge/)
    for (const s of cmp.steelRemoved) if (s.removedMm !== null) expect(s.removedMm).toBeCloseTo(0.5, 2)
    expect(cmp.changes.find((c) => c.metric === 'runnerHeightMm')!.change).toBeCloseTo(-0.5, 2)
    const csv = (await owner.client.get(`/api/blades/${ids.leftId}/history.csv`).expect(200)).text.trimEnd().split('\r\n')
    const col = (line: string, name: string) => line.split(',')[CSV_COLUMNS.findIndex(([n]) => n === name)]
    const h = bladeHistorySchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/history`).expect(200)).body)
    expect(Number(col(csv[2], 'runner_height_mm'))).toBeCloseTo(h.runnerHeight.latest!.heightMm, 3)
    const pdf = await owner.client.get(`/api/analyses/${now}/report.pdf`).buffer(true).parse(binary).expect(200)
    expect(await pdfText(pdf.body as Buffer)).toMatch(/Runner height \d\d\.\d\d ± \d\.\d\d mm at 160 mm behind the base pick/)
  })

  it('says the runner height was not measured when the latest photo does not show the top edge', async () => {
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client, { sizeIn: 10 })
    await storeMeasured(ctx, ids.leftId, resultOf({ topEdgeAboveLMm: 24 }), day(0))
    await storeMeasured(ctx, ids.leftId, resultOf({ removedMm: 0.2 }), day(10))
    const h = bladeHistorySchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/history`).expect(200)).body)
    expect(h.runnerHeight).toMatchObject({ measured: false, latest: null, loss: null, lossStations: [] })
    expect(h.rows[1].runnerHeightMm).toBeNull()
    const cmp = comparisonSchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/compare/baseline`).expect(200)).body)
    expect(cmp.registration.on).toEqual(['toe-pick teeth'])
    expect(cmp.notes.join(' ')).toMatch(/top edge did not show in both photos/)
  })
})
