import { randomUUID } from 'node:crypto'
import sharp from 'sharp'
import type { AppContext } from '../context'
import { Account } from '../entities/account.entity'
import { Analysis } from '../entities/analysis.entity'
import { BladeBaseline } from '../entities/blade-baseline.entity'
import { Blade } from '../entities/blade.entity'
import { Photo } from '../entities/photo.entity'
import { Shop } from '../entities/shop.entity'
import { SkatePair } from '../entities/skate-pair.entity'
import { SkaterProfile } from '../entities/skater-profile.entity'
import { Sharpening } from '../entities/sharpening.entity'
import { setTarget } from '../services/target.service'
import { measuredResult } from '../../fixtures/measured-result'
import type { SeedStep } from './index'

const DAY_MS = 86_400_000

/**
 * A wear history for the demo: Tomas Reyvik's practice pair (registered after 6 sharpenings) measured five times
 * over five more, the left blade wearing faster than the right; its technician marks the first analysis as the
 * reference; his coach prefers a touch point of 38–44 mm and the shop keeps heel lift at 18–32 mm. Results are
 * generated from the blade model (invented geometry), stored as if measured over a plain stand-in image.
 */
export const demoWearStep: SeedStep = {
  name: 'demo-wear',
  signIns: [],
  async run(ctx: AppContext) {
    const tomas = await ctx.db.getRepository(SkaterProfile).findOneBy({ name: 'Tomas Reyvik' })
    const pair = tomas && (await ctx.db.getRepository(SkatePair).findOneBy({ skaterProfileId: tomas.id, label: 'Practice skates' }))
    const shop = await ctx.db.getRepository(Shop).findOneBy({ name: 'Glenmere Edge Bench' })
    const accounts = ctx.db.getRepository(Account)
    const [coach, tech] = await Promise.all([accounts.findOneBy({ name: 'Wren Aldane' }), accounts.findOneBy({ name: 'Sami Okoro' })])
    if (!tomas || !pair || !shop || !coach || !tech) return
    const blades = await ctx.db.getRepository(Blade).findBy({ pairId: pair.id })
    const start = Date.now() - 150 * DAY_MS
    for (const blade of blades) {
      const rate = blade.side === 'left' ? 1.1 : 0.6
      const ids: string[] = []
      for (let k = 0; k < 5; k++) {
        const takenAt = new Date(start + k * 30 * DAY_MS)
        if (k > 0) {
          await ctx.db.getRepository(Sharpening).save({
            bladeId: blade.id, sharpenedOn: new Date(takenAt.getTime() - 2 * DAY_MS).toISOString().slice(0, 10),
            shop: shop.name, technician: tech.name, rootRadiusSixteenths: k === 4 && blade.side === 'left' ? 9 : 7, recordedById: tech.id,
          })
        }
        const result = measuredResult({
          model: { sizeIn: blade.sizeIn, toe: blade.side === 'left' ? 'left' : 'right' }, removedMm: 0.08 * k * rate,
          touchPointMm: 39.5 + rate * k + (k % 2 ? 0.3 : -0.2), heelLiftMm: 24 - 0.9 * rate * k, noiseMm: 0.008, seed: k + (blade.side === 'left' ? 10 : 20),
        })
        ids.push(await storeResult(ctx, blade.id, result, takenAt))
      }
      await ctx.db.getRepository(BladeBaseline).save({ bladeId: blade.id, analysisId: ids[0], markedById: tech.id, markedByName: tech.name, markedAt: new Date(start) })
    }
    await setTarget(ctx, 'skater', tomas.id, 'touchPointMm', { min: 38, max: 44, note: 'Balance a touch further forward for spins' }, { id: coach.id, name: coach.name, role: 'coach' })
    await setTarget(ctx, 'shop', shop.id, 'heelLiftMm', { min: 18, max: 32 }, { id: tech.id, name: tech.name, role: 'technician' })
  },
}

/** A plain light-grey stand-in, so the Analysis page of a generated result has an image to draw its edge on. */
const placeholder = () => sharp({ create: { width: 400, height: 300, channels: 3, background: { r: 231, g: 236, b: 241 } } }).jpeg().toBuffer()

async function storeResult(ctx: AppContext, bladeId: string, result: ReturnType<typeof measuredResult>, takenAt: Date): Promise<string> {
  const key = `demo/generated-${randomUUID()}.jpg`
  const jpeg = await placeholder()
  await ctx.storage.put(key, jpeg, 'image/jpeg')
  const photo = await ctx.db.getRepository(Photo).save({
    bladeId, storageKey: key, sha256: randomUUID(), contentType: 'image/jpeg', width: 400, height: 300, bytes: jpeg.length,
    uploadedById: null, uploadedAt: takenAt,
  })
  const row = await ctx.db.getRepository(Analysis).save({
    bladeId, photoId: photo.id, status: 'measured', result, algorithmVersion: 'demo-model', queuedAt: takenAt, startedAt: takenAt, finishedAt: takenAt, durationMs: 0,
  })
  return row.id
}
