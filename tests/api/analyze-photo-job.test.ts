import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Analysis } from '../../server/entities/analysis.entity'
import { SkaterProfile } from '../../server/entities/skater-profile.entity'
import { queuePolicy } from '../../server/queue/queue.service'
import { createAccount } from '../../server/services/auth.service'
import { createPair, findBlade } from '../../server/services/blade.service'
import { uploadPhoto } from '../../server/services/photo.service'
import type { StorageService } from '../../server/services/storage.service'
import { refusalCodeSchema } from '../../shared/schemas/analysis'
import { ALGORITHM_VERSION } from '../../workers/engine/analyze'
import { analyzePhotoJob } from '../../workers/analyze-photo'
import { uniqueEmail } from '../support/accounts'
import { createTestContext } from '../support/test-context'

describe('photo.analyze handler', () => {
  let ctx: Awaited<ReturnType<typeof createTestContext>>
  let bladeId: string

  beforeAll(async () => {
    ctx = await createTestContext()
    const account = await createAccount(ctx, { email: uniqueEmail('job'), password: 'a long test password', name: 'Job Owner', roles: ['skater'], verified: true })
    const skater = await ctx.db.getRepository(SkaterProfile).save({ ownerAccountId: account.id, name: 'Job Skater' })
    const pair = await createPair(ctx, skater.id, { label: 'Job pair', sizeIn: 9.5, discipline: 'freestyle', sharpeningsAtRegistration: 0 })
    bladeId = pair.blades[0].id
  })
  afterAll(() => ctx.dispose())

  /** A plain grey photo: readable, but with no card and no blade in it, so the engine refuses it quickly. */
  async function queuedAnalysis(shade: number): Promise<string> {
    const buffer = await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: shade, g: shade, b: shade } } }).jpeg().toBuffer()
    return (await uploadPhoto(ctx, { blade: await findBlade(ctx, bladeId), buffer, userId: null })).analysisId
  }
  const row = (id: string) => ctx.db.getRepository(Analysis).findOneByOrFail({ id })

  it('records a refusal, and a second run for the same algorithm version changes nothing', async () => {
    const id = await queuedAnalysis(120)
    expect(await analyzePhotoJob.handle(ctx, { analysisId: id })).toBe('failed')
    const first = await row(id)
    expect(first).toMatchObject({ status: 'refused', algorithmVersion: ALGORITHM_VERSION, attempts: 1, result: null })
    // Which refusal the engine gives a featureless photo is its call; it must be one of its published codes.
    expect(refusalCodeSchema.options).toContain(first.errorCode)
    expect(await analyzePhotoJob.handle(ctx, { analysisId: id })).toBe('skipped')
    expect(await row(id)).toEqual(first)
  })

  it('throws on a storage failure so the queue retries, and gives up with a reason after the last retry', async () => {
    const id = await queuedAnalysis(130)
    const down = { getBuffer: () => Promise.reject(Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' })) }
    const flaky = { ...ctx, storage: down as unknown as StorageService }
    for (let attempt = 1; attempt <= queuePolicy.retryLimit; attempt++) {
      await expect(analyzePhotoJob.handle(flaky, { analysisId: id })).rejects.toThrow(/ECONNREFUSED/)
      expect(await row(id)).toMatchObject({ status: 'running', attempts: attempt })
    }
    expect(await analyzePhotoJob.handle(flaky, { analysisId: id })).toBe('failed')
    expect(await row(id)).toMatchObject({ status: 'failed', errorCode: 'RETRIES_EXHAUSTED' })
  })

  it('ends failed with a reason when the stored photo is gone', async () => {
    const id = await queuedAnalysis(140)
    const [{ storage_key: key }] = await ctx.db.query(`SELECT p.storage_key FROM photos p JOIN analyses a ON a.photo_id = p.id WHERE a.id = $1`, [id])
    await ctx.storage.remove(key)
    expect(await analyzePhotoJob.handle(ctx, { analysisId: id })).toBe('failed')
    expect(await row(id)).toMatchObject({ status: 'failed', errorCode: 'PHOTO_MISSING' })
  })

  it('skips an analysis that does not exist', async () => {
    expect(await analyzePhotoJob.handle(ctx, { analysisId: '00000000-0000-4000-8000-000000000000' })).toBe('skipped')
  })
})
