import { createHash } from 'node:crypto'
import type { Express } from 'express'
import request from 'supertest'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { analysisSchema, type AnalysisDto } from '../../shared/schemas/analyses'
import { analyzePhoto } from '../../workers/engine/analyze'
import { generatedPhoto, jpegWithExif, measurablePhoto, pngBomb } from '../factories/photos'
import { skaterWithPair } from '../factories/records'
import { signedInAs, waitForMail } from '../support/accounts'
import { waitForAnalysis } from '../support/analyses'
import { createTestContext } from '../support/test-context'
import { startWorker, type WorkerProcess } from '../support/worker-process'

describe('photo upload → queue → worker → analysis', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let app: Express
  let worker: WorkerProcess
  let owner: Awaited<ReturnType<typeof signedInAs>>
  let ids: Awaited<ReturnType<typeof skaterWithPair>>
  let noCard: Awaited<ReturnType<typeof generatedPhoto>>

  beforeAll(async () => {
    ctx = await createTestContext()
    app = createApp(ctx)
    ;[worker, noCard] = await Promise.all([startWorker(ctx), generatedPhoto(5, { refusal: 'no-card' })])
    owner = await signedInAs(app, ctx, ['skater'], { label: 'owner' })
    ids = await skaterWithPair(owner.client)
  })
  afterAll(async () => {
    await worker?.stop()
    await ctx?.dispose()
  })

  let measured: AnalysisDto
  let refusedId: string
  let measuredIds: Awaited<ReturnType<typeof skaterWithPair>>

  it('measures a generated photo: 202, queued, then measured with the engine\'s numbers on the stored photo', async () => {
    const photo = await measurablePhoto()
    measuredIds = await skaterWithPair(owner.client, { sizeIn: photo.scene.blade.nominalSizeIn, discipline: photo.scene.blade.discipline })
    const res = await owner.client.post(`/api/blades/${measuredIds.leftId}/photos`).attach('photo', photo.jpeg, 'blade.jpg').expect(202)
    expect(Object.keys(res.body)).toEqual(['analysisId'])
    measured = await waitForAnalysis(owner.client, res.body.analysisId, ['measured', 'refused', 'failed'])
    expect(measured.error).toBeNull()
    expect(measured.status).toBe('measured')
    expect(measured.result!.landmarks.touchPoint.alongMm).toBe(measured.result!.touchPointMm)
    // Every number shown must be the engine's on the very photo stored: run the engine here on the stored bytes.
    const stored = await owner.client.get(`/api/analyses/${measured.id}/photo`).buffer(true).expect(200)
    const direct = await analyzePhoto(Buffer.from(stored.body), {
      sizeIn: photo.scene.blade.nominalSizeIn, discipline: photo.scene.blade.discipline,
    })
    expect(direct.ok).toBe(true)
    if (direct.ok) expect(measured.result!.touchPointMm).toBeCloseTo(direct.result.touchPointMm, 6)
    expect(measured.durationMs).toBeGreaterThan(0)
  }, 300_000)

  it('records a refusal with its code and what to do', async () => {
    const res = await owner.client.post(`/api/blades/${ids.rightId}/photos`).attach('photo', noCard.jpeg, 'blade.jpg').expect(202)
    const refused = await waitForAnalysis(owner.client, res.body.analysisId, ['measured', 'refused', 'failed'])
    refusedId = refused.id
    const notMeasured = await owner.client.put(`/api/analyses/${refused.id}/landmarks`).send({ heelEndAlongMm: 200 }).expect(409)
    expect(notMeasured.body.error.code).toBe('NOT_MEASURED')
    expect(refused.status).toBe('refused')
    expect(refused.result).toBeNull()
    expect(refused.error!.message.length).toBeGreaterThan(20)
    // Recorded exactly as the engine refuses the stored photo.
    const stored = await owner.client.get(`/api/analyses/${refused.id}/photo`).buffer(true).expect(200)
    const direct = await analyzePhoto(Buffer.from(stored.body), { sizeIn: noCard.scene.blade.nominalSizeIn, discipline: noCard.scene.blade.discipline })
    expect(direct.ok ? null : direct.error).toEqual(refused.error)
  })

  it('moves the heel end, recomputes from the stored edge, records who did it, and restores the detected one', async () => {
    const before = measured.result!
    const heelAt = before.landmarks.heelEnd.alongMm - 15
    const moved = analysisSchema.parse((await owner.client.put(`/api/analyses/${measured.id}/landmarks`)
      .send({ heelEndAlongMm: heelAt }).expect(200)).body)
    // E snaps to the traced edge point nearest the requested station, so it lands near it, not exactly on it.
    const movedHeel = moved.result!.landmarks.heelEnd.alongMm
    expect(Math.abs(movedHeel - heelAt)).toBeLessThan(Math.abs(before.landmarks.heelEnd.alongMm - heelAt))
    expect(moved.result!.heelLiftMm).not.toBeCloseTo(before.heelLiftMm, 3)
    expect(moved.result!.edge.cardMm).toEqual(before.edge.cardMm)
    expect(moved.landmarkChanges).toMatchObject([{ action: 'moved', byName: owner.account.name, heelEndAlongMm: heelAt }])
    const restored = analysisSchema.parse((await owner.client.delete(`/api/analyses/${measured.id}/landmarks`).expect(200)).body)
    expect(restored.result!.heelLiftMm).toBeCloseTo(before.heelLiftMm, 9)
    expect(restored.result!.overrides).toBeNull()
    expect(restored.landmarkChanges.map((c) => c.action)).toEqual(['moved', 'restored'])
    const bad = await owner.client.put(`/api/analyses/${measured.id}/landmarks`).send({}).expect(400)
    expect(bad.body.error.code).toBe('VALIDATION')
  })

  it('lets a coach pin a note and mails the skater; replies and resolving work', async () => {
    const coach = await signedInAs(app, ctx, ['coach'], { label: 'coach' })
    const share = await owner.client.post(`/api/skaters/${measuredIds.skaterId}/shares/coach`).send({ email: coach.email }).expect(201)
    await coach.client.post(`/api/shares/${share.body.id}/accept`).expect(200)
    const note = await coach.client.post(`/api/analyses/${measured.id}/annotations`)
      .send({ text: 'Heel looks flattened after the last sharpening', alongMm: 180 }).expect(201)
    const mail = await waitForMail(app, owner.email, /left a note/, 20_000)
    expect(mail.text).toContain('Heel looks flattened')
    expect(mail.links.some((l) => l.endsWith(`/analyses/${measured.id}`))).toBe(true)
    await owner.client.post(`/api/annotations/${note.body.id}/replies`).send({ text: 'Will ask the shop' }).expect(201)
    await owner.client.patch(`/api/annotations/${note.body.id}`).send({ resolved: true }).expect(200)
    const list = await coach.client.get(`/api/analyses/${measured.id}/annotations`).expect(200)
    expect(list.body).toMatchObject([{ alongMm: 180, resolved: true, replies: [{ text: 'Will ask the shop' }] }])
    await coach.client.post(`/api/blades/${measuredIds.leftId}/photos`).attach('photo', noCard.jpeg, 'blade.jpg').expect(404)
  })

  it('answers 404 for another owner\'s blade and analysis, and 401 without a session', async () => {
    const other = await signedInAs(app, ctx, ['skater'], { label: 'other' })
    await other.client.post(`/api/blades/${ids.leftId}/photos`).attach('photo', noCard.jpeg, 'blade.jpg').expect(404)
    await other.client.get(`/api/analyses/${refusedId}`).expect(404)
    await other.client.get(`/api/analyses/${refusedId}/photo`).expect(404)
    await other.client.put(`/api/analyses/${refusedId}/landmarks`).send({ heelEndAlongMm: 200 }).expect(404)
    await other.client.post(`/api/analyses/${refusedId}/annotations`).send({ text: 'hi', alongMm: 3 }).expect(404)
    await request(app).get(`/api/analyses/${refusedId}`).expect(401)
  })

  it('stores the photo upright, without its metadata, under a key made of its sha256', async () => {
    const upload = await jpegWithExif(300, 200)
    expect((await sharp(upload).metadata()).exif).toBeDefined()
    const res = await owner.client.post(`/api/blades/${ids.rightId}/photos`).attach('photo', upload, 'phone.jpg').expect(202)
    const stored = Buffer.from((await owner.client.get(`/api/analyses/${res.body.analysisId}/photo`).buffer(true).expect(200)).body)
    const meta = await sharp(stored).metadata()
    expect([meta.width, meta.height, meta.exif, meta.orientation]).toEqual([200, 300, undefined, undefined])
    const [row] = await ctx.db.query(`SELECT storage_key, sha256 FROM photos p JOIN analyses a ON a.photo_id = p.id WHERE a.id = $1`, [res.body.analysisId])
    expect(row.sha256).toBe(createHash('sha256').update(stored).digest('hex'))
    expect(row.storage_key).toContain(row.sha256)
  })

  it('keeps an upright JPEG\'s own pixels, dropping its EXIF but not its colour profile', async () => {
    const upload = await sharp({ create: { width: 320, height: 240, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 30 } } })
      .withExif({ IFD0: { Make: 'Test camera' } }).withIccProfile('srgb').jpeg({ quality: 85 }).toBuffer()
    const res = await owner.client.post(`/api/blades/${ids.rightId}/photos`).attach('photo', upload, 'phone.jpg').expect(202)
    const stored = Buffer.from((await owner.client.get(`/api/analyses/${res.body.analysisId}/photo`).buffer(true).expect(200)).body)
    const meta = await sharp(stored).metadata()
    expect(meta.exif).toBeUndefined()
    expect(meta.icc).toBeDefined()
    // Decoded by sharp (libjpeg), an independent reader: the same pixels, so no re-encoding loss reaches the engine.
    const [sent, kept] = await Promise.all([sharp(upload).raw().toBuffer(), sharp(stored).raw().toBuffer()])
    expect(kept.equals(sent)).toBe(true)
  })

  describe('bad uploads get a 4xx with a clear message and leave nothing behind', () => {
    const counts = async () => {
      const [{ photos, analyses }] = await ctx.db.query(
        `SELECT (SELECT count(*)::int FROM photos) AS photos, (SELECT count(*)::int FROM analyses) AS analyses`)
      return { photos, analyses, objects: (await ctx.storage.listKeys('photos/')).length }
    }
    const cases: [string, () => Promise<Buffer> | Buffer, number, RegExp][] = [
      ['an empty file', () => Buffer.alloc(0), 400, /empty/],
      ['a text file renamed .jpg', () => Buffer.from('This is a note, not a photo.\n'.repeat(20)), 415, /JPEG, PNG or WebP/],
      ['a truncated JPEG', () => noCard.jpeg.subarray(0, Math.floor(noCard.jpeg.length / 2)), 400, /incomplete or damaged/],
      ['a 20000 × 20000 PNG', () => pngBomb(20_000, 20_000), 413, /megapixels/],
      ['a 30 MB file', () => Buffer.alloc(30 * 1024 * 1024, 0xff), 413, /larger than 25 MB/],
      // An ISO-BMFF ftyp box with the HEVC-coded HEIF major brand (ISO/IEC 23008-12), as an iPhone writes first.
      ['a HEIC photo', () => Buffer.concat([Buffer.from([0, 0, 0, 24]), Buffer.from('ftypheic\0\0\0\0mif1heic', 'latin1'), Buffer.alloc(64)]), 415, /HEIC.*JPEG/],
      ['an AVIF image', () => sharp({ create: { width: 40, height: 30, channels: 3, background: 'grey' } }).avif().toBuffer(), 415, /JPEG, PNG or WebP/],
    ]
    for (const [what, make, status, message] of cases) {
      it(what, async () => {
        const before = await counts()
        const res = await owner.client.post(`/api/blades/${ids.leftId}/photos`).attach('photo', await make(), 'photo.jpg')
        expect(res.status).toBe(status)
        expect(res.body.error.message).toMatch(message)
        expect(await counts()).toEqual(before)
      })
    }

    it('a form without the photo field', async () => {
      const res = await owner.client.post(`/api/blades/${ids.leftId}/photos`).field('checkBarMm', '100').expect(400)
      expect(res.body.error.details[0].path).toBe('photo')
    })
  })
})
