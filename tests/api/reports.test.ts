import type { Express } from 'express'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { Annotation } from '../../server/entities/annotation.entity'
import { resultOf, storeMeasured } from '../factories/analysis-results'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { withTestApp, type TestContext } from '../support/test-app'
import { binary, pdfText } from '../support/pdf'

describe('PDF reports', () => {
  let ctx: TestContext
  let app: Express
  withTestApp((c, a) => ([ctx, app] = [c, a]))

  it('answers 401 without a session', async () => {
    const id = '00000000-0000-4000-8000-000000000000'
    await request(app).get(`/api/analyses/${id}/report.pdf`).expect(401)
    await request(app).get(`/api/blades/${id}/report.pdf`).expect(401)
  })

  it('downloads an analysis report whose text holds the metrics, targets, statuses, notes and cautions', async () => {
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client, { sizeIn: 10 })
    const base = await storeMeasured(ctx, ids.leftId, resultOf({ touchPointMm: 40, heelLiftMm: 25 }), new Date('2026-10-01T10:00:00Z'))
    const now = await storeMeasured(ctx, ids.leftId, resultOf({ removedMm: 0.2, touchPointMm: 44.5, heelLiftMm: 24, seed: 2 }), new Date('2026-11-01T10:00:00Z'))
    await ctx.db.getRepository(Annotation).save({
      analysisId: now, parentId: null, authorId: null, authorName: 'Test coach', alongMm: 200, photoX: null, photoY: null,
      text: 'Check the heel after the next grind', resolvedAt: null,
    })
    const res = await owner.client.get(`/api/analyses/${now}/report.pdf`).buffer(true).parse(binary).expect(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    const body = res.body as Buffer
    expect(body.subarray(0, 5).toString()).toBe('%PDF-')
    const text = await pdfText(body)
    expect(text).toContain('Rockerbook blade analysis')
    // Values put in by construction, read against DESIGN.md §5 (touch point 35–45 mm; 44.5 ± 1.2 is near the limit).
    expect(text).toMatch(/Touch point 44\.5 ± 1\.2 mm/)
    expect(text).toContain('near limit')
    expect(text).toMatch(/Heel lift 24\.0 ± 0\.3 mm/)
    expect(text).toContain('Compared with the baseline')
    expect(text).toMatch(/Test coach, \d{4}-\d{2}-\d{2}, 200 mm behind the base pick: Check the heel after the next grind/)
    expect(text).toContain('hold the boot, never the blade')
    expect(base).not.toBe(now)
  })

  it('downloads a blade history report with every analysis, the wear rule and the baseline comparison', async () => {
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client, { sizeIn: 10 })
    for (let k = 0; k < 4; k++) {
      await storeMeasured(ctx, ids.rightId, resultOf({ model: { sizeIn: 10, toe: 'right' }, removedMm: 0.1 * k, touchPointMm: 40 + k, heelLiftMm: 25, seed: k }), new Date(Date.UTC(2026, 9, 1 + 7 * k)))
      await owner.client.post(`/api/blades/${ids.rightId}/sharpenings`).send({ sharpenedOn: new Date(Date.UTC(2026, 9, 4 + 7 * k)).toISOString().slice(0, 10), rootRadiusSixteenths: 7 }).expect(201)
    }
    const res = await owner.client.get(`/api/blades/${ids.rightId}/report.pdf`).buffer(true).parse(binary).expect(200)
    const text = await pdfText(res.body as Buffer)
    expect(text).toContain('Rockerbook blade history')
    expect(text).toMatch(/43\.0 ± 1\.2 mm/)
    expect(text).toContain('(baseline)')
    expect(text).toMatch(/Touch point: trend \+1\.00 mm per sharpening; about 2 sharpenings left inside 35–45 mm/)
    expect(text).toContain('Rule: Replace when the runner height')
    expect(text).toContain('7/16 in')
  })

  it('answers 404 for another owner\u2019s analysis and blade, 409 for an analysis not measured', async () => {
    const owner = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(owner.client)
    const id = await storeMeasured(ctx, ids.leftId, resultOf(), new Date())
    const other = await signedInAs(app, ctx, ['skater'])
    await other.client.get(`/api/analyses/${id}/report.pdf`).expect(404)
    await other.client.get(`/api/blades/${ids.leftId}/report.pdf`).expect(404)
    await ctx.db.query(`UPDATE analyses SET status = 'queued' WHERE id = $1`, [id])
    await owner.client.get(`/api/analyses/${id}/report.pdf`).expect(409)
  })
})
