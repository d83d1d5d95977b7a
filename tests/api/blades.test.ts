import type { Express } from 'express'
import request from 'supertest'
import { describe, expect, it } from 'vitest'
import { bladeSchema, pairSchema, sharpeningSchema } from '../../shared/schemas/blades'
import { skaterWithPair } from '../factories/records'
import { signedInAs } from '../support/accounts'
import { withTestApp, type TestContext } from '../support/test-app'

describe('pairs, blades and sharpenings', () => {
  let ctx: TestContext
  let app: Express
  withTestApp((c, a) => ([ctx, app] = [c, a]))

  it('creates a pair with its left and right blade, each with the pair size and discipline', async () => {
    const { client } = await signedInAs(app, ctx, ['skater'])
    const skater = await client.post('/api/skaters').send({ name: 'Pair Owner' }).expect(201)
    const res = await client.post(`/api/skaters/${skater.body.id}/pairs`)
      .send({ label: 'Competition skates', sizeIn: 9.25, discipline: 'dance' }).expect(201)
    const pair = pairSchema.parse(res.body)
    expect(pair.label).toBe('Competition skates')
    expect(pair.blades.map((b) => b.side).sort()).toEqual(['left', 'right'])
    for (const blade of pair.blades) {
      expect(blade).toMatchObject({ sizeIn: 9.25, discipline: 'dance', status: 'in_use', sharpeningsAtRegistration: 0 })
    }
    const listed = await client.get(`/api/skaters/${skater.body.id}/pairs`).expect(200)
    expect(listed.body.map((p: { id: string }) => p.id)).toEqual([pair.id])
  })

  it('answers 401 without a session', async () => {
    await request(app).get('/api/pairs').expect(401)
    const res = await request(app).get('/api/blades/00000000-0000-4000-8000-000000000000').expect(401)
    expect(res.body.error.code).toBe('UNAUTHORIZED')
  })

  it('answers 400 with the failing paths for a size off the 1/4 in steps and an unknown discipline', async () => {
    const { client } = await signedInAs(app, ctx, ['skater'])
    const skater = await client.post('/api/skaters').send({ name: 'Bad Input' }).expect(201)
    const res = await client.post(`/api/skaters/${skater.body.id}/pairs`)
      .send({ label: 'x', sizeIn: 9.3, discipline: 'hockey' }).expect(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toEqual(expect.arrayContaining(['sizeIn', 'discipline']))
    await client.get('/api/blades/not-a-uuid').expect(400)
  })

  it('answers 404 for another owner\'s skater, pair and blade, and for a made-up id alike', async () => {
    const owner = await signedInAs(app, ctx, ['skater'], { label: 'owner' })
    const other = await signedInAs(app, ctx, ['skater'], { label: 'other' })
    const ids = await skaterWithPair(owner.client)
    await other.client.post(`/api/skaters/${ids.skaterId}/pairs`).send({ label: 'Mine now', sizeIn: 9, discipline: 'freestyle' }).expect(404)
    const notYours = await other.client.get(`/api/blades/${ids.leftId}`).expect(404)
    const missing = await other.client.get('/api/blades/00000000-0000-4000-8000-000000000000').expect(404)
    expect(notYours.body).toEqual(missing.body)
    await other.client.patch(`/api/blades/${ids.leftId}`).send({ status: 'retired' }).expect(404)
    await other.client.delete(`/api/pairs/${ids.pairId}`).expect(404)
    await other.client.get(`/api/blades/${ids.leftId}/analyses`).expect(404)
    const list = await other.client.get('/api/pairs').expect(200)
    expect(list.body).toEqual([])
  })

  it('updates a blade and records sharpenings in 1/16 in, newest first', async () => {
    const { client } = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(client)
    const updated = await client.patch(`/api/blades/${ids.rightId}`)
      .send({ modelLabel: 'Club runner', mountedOn: '2026-09-01', sharpeningsAtRegistration: 3, notes: 'left a bit loose' })
      .expect(200)
    expect(bladeSchema.parse(updated.body)).toMatchObject({ modelLabel: 'Club runner', mountedOn: '2026-09-01', sharpeningsAtRegistration: 3 })
    await client.post(`/api/blades/${ids.rightId}/sharpenings`).send({ sharpenedOn: '2026-10-01', rootRadiusSixteenths: 7, shop: 'Rink shop' }).expect(201)
    await client.post(`/api/blades/${ids.rightId}/sharpenings`).send({ sharpenedOn: '2026-11-15', rootRadiusSixteenths: 8 }).expect(201)
    const list = await client.get(`/api/blades/${ids.rightId}/sharpenings`).expect(200)
    const rows = list.body.map((s: unknown) => sharpeningSchema.parse(s))
    expect(rows.map((s: { sharpenedOn: string }) => s.sharpenedOn)).toEqual(['2026-11-15', '2026-10-01'])
    const bad = await client.post(`/api/blades/${ids.rightId}/sharpenings`)
      .send({ sharpenedOn: '2026-11-16', analysisBeforeId: '00000000-0000-4000-8000-000000000000' }).expect(400)
    expect(bad.body.error.message).toMatch(/analysisBeforeId/)
    await client.delete(`/api/sharpenings/${rows[0].id}`).expect(204)
    expect((await client.get(`/api/blades/${ids.rightId}/sharpenings`).expect(200)).body).toHaveLength(1)
  })

  it('lets a coach with an accepted share read the blades but not change them', async () => {
    const owner = await signedInAs(app, ctx, ['skater'], { label: 'owner' })
    const coach = await signedInAs(app, ctx, ['coach'], { label: 'coach' })
    const ids = await skaterWithPair(owner.client)
    const share = await owner.client.post(`/api/skaters/${ids.skaterId}/shares/coach`).send({ email: coach.email }).expect(201)
    await coach.client.post(`/api/shares/${share.body.id}/accept`).expect(200)
    await coach.client.get(`/api/blades/${ids.leftId}`).expect(200)
    await coach.client.patch(`/api/blades/${ids.leftId}`).send({ status: 'retired' }).expect(404)
    const pairs = await coach.client.get('/api/pairs').expect(200)
    expect(pairs.body.map((p: { id: string }) => p.id)).toEqual([ids.pairId])
  })

  it('deletes a pair with both blades after the owner confirms', async () => {
    const { client } = await signedInAs(app, ctx, ['skater'])
    const ids = await skaterWithPair(client)
    await client.delete(`/api/pairs/${ids.pairId}`).expect(204)
    await client.get(`/api/blades/${ids.leftId}`).expect(404)
    await client.get(`/api/pairs/${ids.pairId}`).expect(404)
  })
})

describe('GET /api/card/:paper.:format', () => {
  let app: Express
  withTestApp((_, a) => (app = a))

  it('serves the card as PDF, PNG and JSON without signing in', async () => {
    const pdf = await request(app).get('/api/card/a4.pdf').buffer(true).expect(200)
    expect(pdf.headers['content-type']).toBe('application/pdf')
    expect(Buffer.from(pdf.body).subarray(0, 5).toString()).toBe('%PDF-')
    const json = await request(app).get('/api/card/letter.json').expect(200)
    expect(json.body.paper).toBe('letter')
    const png = await request(app).get('/api/card/a4.png?dpi=100').buffer(true).expect(200)
    // PNG signature, from the PNG specification (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A.
    expect(Buffer.from(png.body).subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a')
    const oddDpi = await request(app).get('/api/card/a4.png?dpi=137').expect(400)
    expect(oddDpi.body.error.details[0].path).toBe('dpi')
    const bad = await request(app).get('/api/card/a3.pdf').expect(400)
    expect(bad.body.error.details[0].path).toBe('paper')
  })
})
