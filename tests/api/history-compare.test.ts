import type { Express } from 'express'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { comparisonSchema } from '../../shared/schemas/comparison'
import { CSV_COLUMNS, bladeHistorySchema } from '../../shared/schemas/history'
import { resultOf, storeMeasured } from '../factories/analysis-results'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { withTestApp, type TestContext } from '../support/test-app'

const day = (n: number) => new Date(Date.UTC(2026, 9, 1 + n, 10))
const photo2 = { scale: 1, rotationRad: (1.5 * Math.PI) / 180, tx: 12, ty: -5 }

describe('history, wear, baseline, CSV and comparisons', () => {
  let ctx: TestContext
  let app: Express
  withTestApp((c, a) => ([ctx, app] = [c, a]))

  /** A pair whose left blade was measured new, then after sharpenings that each took 0.1 mm and moved T back. */
  async function wornPair() {
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client, { sizeIn: 10 })
    const left: string[] = []
    for (let k = 0; k <= 4; k++) {
      if (k > 0) {
        await owner.client.post(`/api/blades/${ids.leftId}/sharpenings`)
          .send({ sharpenedOn: day(2 * k - 1).toISOString().slice(0, 10), rootRadiusSixteenths: k === 4 ? 9 : 7 }).expect(201)
      }
      const r = resultOf({ removedMm: 0.1 * k, placement: k % 2 ? photo2 : undefined, touchPointMm: 40 + 1.6 * k, heelLiftMm: 25, seed: k })
      left.push(await storeMeasured(ctx, ids.leftId, r, day(2 * k)))
    }
    const right = await storeMeasured(ctx, ids.rightId, resultOf({ model: { sizeIn: 10, toe: 'right' }, removedMm: 0.2, touchPointMm: 43 }), day(3))
    return { owner, ids, left, right }
  }

  it('answers 401 without a session', async () => {
    const id = '00000000-0000-4000-8000-000000000000'
    for (const path of [`/api/blades/${id}/history`, `/api/blades/${id}/history.csv`, `/api/skaters/${id}/history.csv`,
      `/api/blades/${id}/compare/baseline`, `/api/pairs/${id}/compare`, `/api/analyses/${id}/compare/${id}`]) {
      await request(app).get(path).expect(401)
    }
  })

  it('lists a blade\u2019s history read against its targets, with sharpenings so far and a wear projection', async () => {
    const { owner, ids, left } = await wornPair()
    const h = bladeHistorySchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/history`).expect(200)).body)
    expect(h.rows.map((r) => r.sharpeningsSoFar)).toEqual([0, 1, 2, 3, 4])
    expect(h.baseline).toMatchObject({ analysisId: left[0], kind: 'first analysis' })
    expect(h.rows[0].baseline).toBe(true)
    expect(h.rows.map((r) => r.status)).toEqual(['on target', 'on target', 'on target', 'near limit', 'off target'])
    expect(h.rows[4].statusText).toBe('off target (touch point)')
    expect(h.rows[4].rootRadiusSixteenths).toBe(9)
    expect(h.sharpenings.find((s) => s.rootRadiusSixteenths === 9)?.hockeyGrind).toBe(true)
    // Touch point 40 + 1.6 k against 35–45 mm (DESIGN.md §5): the Theil–Sen line is exact here, and at k = 4 it is
    // already past 45, so no sharpening remains; the state is re-profile (runner height unknown).
    const tp = h.projections.find((p) => p.metric === 'touchPointMm')!
    expect(tp.line!.slope).toBeCloseTo(1.6, 9)
    expect(tp.remaining).toBe(0)
    expect(h.wear.state).toBe('re-profile')
    expect(h.wearRule).toMatch(/Replace when the runner height/)
  })

  it('exports the documented CSV columns, one row per analysis, for a blade and for a skater', async () => {
    const { owner, ids } = await wornPair()
    const res = await owner.client.get(`/api/blades/${ids.leftId}/history.csv`).expect(200)
    expect(res.headers['content-type']).toMatch(/text\/csv/)
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="?blade-left-/)
    const lines = res.text.trimEnd().split('\r\n')
    expect(lines[0].split(',')).toEqual(CSV_COLUMNS.map(([name]) => name))
    expect(lines[0]).toMatch(/^date,skater,pair,blade_id,side,size_in,sharpenings_so_far,root_radius_16ths_in,touch_point_mm,/)
    expect(lines).toHaveLength(6)
    const cells = lines[5].split(',')
    const col = (name: string) => cells[CSV_COLUMNS.findIndex(([n]) => n === name)]
    expect(col('side')).toBe('left')
    expect(col('sharpenings_so_far')).toBe('4')
    expect(col('touch_point_mm')).toBe('46.4')
    expect(col('status')).toBe('off target (touch point)')
    const skater = await owner.client.get(`/api/skaters/${ids.skaterId}/history.csv`).expect(200)
    expect(skater.text.trimEnd().split('\r\n')).toHaveLength(7)
  })

  it('compares the latest analysis with the baseline: steel removed along the blade and metric changes', async () => {
    const { owner, ids, left } = await wornPair()
    const cmp = comparisonSchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/compare/baseline`).expect(200)).body)
    expect([cmp.first.analysisId, cmp.second.analysisId]).toEqual([left[0], left[4]])
    const removed = cmp.steelRemoved.map((s) => s.removedMm).filter((v): v is number => v !== null)
    expect(removed.length).toBeGreaterThan(15)
    for (const v of removed) expect(v).toBeCloseTo(0.4, 3) // 4 × 0.1 mm put in by construction
    const tp = cmp.changes.find((c) => c.metric === 'touchPointMm')!
    expect(tp).toMatchObject({ from: 40, insideNoise: false })
    expect(tp.change).toBeCloseTo(6.4, 9)
    expect(tp.plusMinus).toBeCloseTo(Math.hypot(1.2, 1.2), 9)
    const mid = cmp.changes.find((c) => c.metric === 'middleRadiusMm')!
    expect(mid.insideNoise).toBe(true)
  })

  it('compares two analyses of one blade, and the two blades of a pair (mirrored through their blade frames)', async () => {
    const { owner, ids, left } = await wornPair()
    const two = comparisonSchema.parse((await owner.client.get(`/api/analyses/${left[1]}/compare/${left[3]}`).expect(200)).body)
    for (const s of two.steelRemoved) if (s.removedMm !== null) expect(s.removedMm).toBeCloseTo(0.2, 2)
    const pair = comparisonSchema.parse((await owner.client.get(`/api/pairs/${ids.pairId}/compare`).expect(200)).body)
    expect([pair.first.side, pair.second.side]).toEqual(['left', 'right'])
    // Right blade: 0.2 mm removed; latest left: 0.4 mm. Right minus left is −0.2 mm along the blade.
    for (const s of pair.steelRemoved) if (s.removedMm !== null) expect(s.removedMm).toBeCloseTo(-0.2, 2)
    expect(pair.notes[0]).toMatch(/mirrors/)
    // |46.4 − 43| = 3.4 mm against our left-vs-right rule of 3 mm (DESIGN.md §5): 0.4 mm over, beyond 10 % of 3 mm.
    const tpDiff = pair.pairReadings!.find((r) => r.metric === 'pairTouchPointDiffMm')!
    expect(tpDiff.value).toBeCloseTo(3.4, 9)
    expect(tpDiff.status).toBe('off target')
  })

  it('compares before and after a sharpening, and lets a reference analysis be marked', async () => {
    const { owner, ids, left } = await wornPair()
    const s = (await owner.client.post(`/api/blades/${ids.leftId}/sharpenings`)
      .send({ sharpenedOn: '2026-10-20', analysisBeforeId: left[2], analysisAfterId: left[3] }).expect(201)).body
    const cmp = comparisonSchema.parse((await owner.client.get(`/api/sharpenings/${s.id}/compare`).expect(200)).body)
    expect(cmp.kind).toBe('sharpening')
    const marked = await owner.client.put(`/api/blades/${ids.leftId}/baseline`).send({ analysisId: left[2] }).expect(200)
    expect(marked.body).toMatchObject({ analysisId: left[2], kind: 'marked reference' })
    const base = comparisonSchema.parse((await owner.client.get(`/api/blades/${ids.leftId}/compare/baseline`).expect(200)).body)
    expect(base.first.analysisId).toBe(left[2])
    const bad = await owner.client.put(`/api/blades/${ids.leftId}/baseline`).send({ analysisId: 'nope' }).expect(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('analysisId')
    await owner.client.put(`/api/blades/${ids.rightId}/baseline`).send({ analysisId: left[2] }).expect(400)
  })

  it('answers 404 for another owner\u2019s blade, pair and analyses, and 409 when there is nothing to compare', async () => {
    const { ids, left } = await wornPair()
    const other = await signedInAs(app, ctx, ['skater'])
    await other.client.get(`/api/blades/${ids.leftId}/history`).expect(404)
    await other.client.get(`/api/blades/${ids.leftId}/history.csv`).expect(404)
    await other.client.get(`/api/skaters/${ids.skaterId}/history.csv`).expect(404)
    await other.client.get(`/api/pairs/${ids.pairId}/compare`).expect(404)
    await other.client.get(`/api/analyses/${left[0]}/compare/${left[1]}`).expect(404)
    await other.client.put(`/api/blades/${ids.leftId}/baseline`).send({ analysisId: left[0] }).expect(404)
    const fresh = await skaterWithPair(other.client)
    await other.client.get(`/api/pairs/${fresh.pairId}/compare`).expect(409)
    await other.client.get(`/api/blades/${fresh.leftId}/compare/baseline`).expect(409)
  })
})
