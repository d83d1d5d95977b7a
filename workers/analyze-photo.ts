import type { AppContext } from '../server/context'
import type { Analysis } from '../server/entities/analysis.entity'
import { Blade } from '../server/entities/blade.entity'
import { Photo } from '../server/entities/photo.entity'
import { queuePolicy } from '../server/queue/queue.service'
import { claimAnalysis, recordOutcome, type AnalysisOutcome } from '../server/services/analysis.service'
import { jobPayloads } from '../shared/schemas/jobs'
import { ALGORITHM_VERSION, analyzePhoto } from './engine/analyze'
import { defineJob, type JobOutcome } from './job'

const FAULT_MESSAGE =
  'Rockerbook could not measure this photo because of a fault on our side. Try the photo again later; if it keeps ' +
  'happening, take a new photo.'

async function loadPhotoBytes(ctx: AppContext, photo: Photo): Promise<Buffer | null> {
  try {
    return await ctx.storage.getBuffer(photo.storageKey)
  } catch (error) {
    // A missing object will not come back by retrying; anything else (storage down, timeout) is worth a retry.
    if ((error as { code?: string }).code === 'NoSuchKey') return null
    throw error
  }
}

/** Runs the engine; a bug in it ends this analysis as failed instead of retrying the same crash five times. */
async function measure(ctx: AppContext, bytes: Buffer, blade: Blade, checkBarMm: number | null): Promise<AnalysisOutcome> {
  const base = { algorithmVersion: ALGORITHM_VERSION }
  try {
    const outcome = await analyzePhoto(bytes, { sizeIn: blade.sizeIn, discipline: blade.discipline, checkBarMm })
    if (outcome.ok) return { ...base, kind: 'measured', result: outcome.result }
    return { ...base, kind: 'refused', code: outcome.error.code, message: outcome.error.message }
  } catch (error) {
    ctx.logger.error({ err: error, bladeId: blade.id }, 'engine fault')
    return { ...base, kind: 'failed', code: 'ENGINE_FAULT', message: FAULT_MESSAGE }
  }
}

/** Loads the photo and the blade, measures, records. Storage and database errors propagate for a retry. */
async function run(ctx: AppContext, analysis: Analysis): Promise<JobOutcome> {
  const analysisId = analysis.id
  const started = performance.now()
  const photo = await ctx.db.getRepository(Photo).findOneBy({ id: analysis.photoId })
  const blade = await ctx.db.getRepository(Blade).findOneBy({ id: analysis.bladeId })
  const bytes = photo && blade ? await loadPhotoBytes(ctx, photo) : null
  if (!bytes || !blade) {
    const message = 'The photo is no longer stored. Upload it again.'
    await recordOutcome(ctx, analysisId, { kind: 'failed', code: 'PHOTO_MISSING', message, algorithmVersion: ALGORITHM_VERSION }, 0)
    return 'failed'
  }
  const outcome = await measure(ctx, bytes, blade, analysis.checkBarMm)
  await recordOutcome(ctx, analysisId, outcome, performance.now() - started)
  return outcome.kind === 'measured' ? 'done' : 'failed'
}

/**
 * `photo.analyze`: measures one uploaded photo. Idempotent: an analysis already ended for this algorithm version is
 * skipped; the result and the final status are written in one statement, last. Database and storage failures
 * throw, so the queue retries with backoff; a worker killed mid-job leaves the job to expire and be retried.
 */
export const analyzePhotoJob = defineJob({
  name: 'photo.analyze',
  payload: jobPayloads['photo.analyze'],
  // Two cores here: one analysis each; more would only queue inside the process.
  concurrency: 2,
  async handle(ctx, { analysisId }): Promise<JobOutcome> {
    const analysis = await claimAnalysis(ctx, analysisId, ALGORITHM_VERSION)
    if (!analysis) return 'skipped'
    try {
      return await run(ctx, analysis)
    } catch (error) {
      // The queue gives up after its last retry: say so on the analysis instead of leaving it "running" forever.
      if (analysis.attempts <= queuePolicy.retryLimit) throw error
      ctx.logger.error({ err: error, analysisId }, 'photo.analyze gave up')
      const message = 'Rockerbook could not reach its storage or database to measure this photo. Send the photo again later.'
      await recordOutcome(ctx, analysisId, { kind: 'failed', code: 'RETRIES_EXHAUSTED', message, algorithmVersion: ALGORITHM_VERSION }, 0)
      return 'failed'
    }
  },
})
