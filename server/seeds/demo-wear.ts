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
import { uploadPhoto } from '../services/photo.service'
import { setTarget } from '../services/target.service'
import { renderScene } from '../../fixtures/synthetic/render'
import { demoScene } from './demo-blades'
import type { SeedStep } from './index'

const DAY_MS = 86_400_000
const VISITS = 5

/**
 * A wear history for the demo: Tomas Reyvik's practice pair (registered after 6 sharpenings) photographed five times
 * over five more sharpenings, the left blade's touch point drifting back faster than the right's. Each photo is a
 * generated (invented) blade rendered with that visit's rocker and queued for the worker like any upload, so every
 * number the history shows is measured by the engine. The technician marks the first analysis as the reference; the
 * coach prefers a touch point of 38–44 mm and the shop keeps heel lift at 18–32 mm.
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
    const start = Date.now() - 150 * DAY_MS
    for (const blade of await ctx.db.getRepository(Blade).findBy({ pairId: pair.id })) {
      const driftMmPerSharpening = blade.side === 'left' ? 1.1 : 0.6
      const ids: string[] = []
      for (let k = 0; k < VISITS; k++) {
        const takenAt = new Date(start + k * 30 * DAY_MS)
        if (k > 0) {
          await ctx.db.getRepository(Sharpening).save({
            bladeId: blade.id, sharpenedOn: new Date(takenAt.getTime() - 2 * DAY_MS).toISOString().slice(0, 10),
            shop: shop.name, technician: tech.name, rootRadiusSixteenths: k === VISITS - 1 && blade.side === 'left' ? 9 : 7, recordedById: tech.id,
          })
        }
        ids.push(await photographVisit(ctx, blade, tomas.ownerAccountId, k * driftMmPerSharpening, takenAt))
      }
      await ctx.db.getRepository(BladeBaseline).save({ bladeId: blade.id, analysisId: ids[0], markedById: tech.id, markedByName: tech.name, markedAt: new Date(start) })
    }
    await setTarget(ctx, 'skater', tomas.id, 'touchPointMm', { min: 38, max: 44, note: 'Balance a touch further forward for spins' }, { id: coach.id, name: coach.name, role: 'coach' })
    await setTarget(ctx, 'shop', shop.id, 'heelLiftMm', { min: 18, max: 32 }, { id: tech.id, name: tech.name, role: 'technician' })
  },
}

/** Renders this visit's blade, uploads it through the normal photo path and dates it to the visit. */
async function photographVisit(ctx: AppContext, blade: Blade, userId: string, driftMm: number, takenAt: Date): Promise<string> {
  const scene = demoScene(blade.side === 'left' ? 'left' : 'right')
  scene.blade.rocker.touchMm += driftMm
  const { jpeg } = await renderScene(scene)
  const { analysisId } = await uploadPhoto(ctx, { blade, buffer: jpeg, userId })
  await ctx.db.getRepository(Analysis).update({ id: analysisId }, { queuedAt: takenAt })
  const analysis = await ctx.db.getRepository(Analysis).findOneByOrFail({ id: analysisId })
  await ctx.db.getRepository(Photo).update({ id: analysis.photoId }, { uploadedAt: takenAt })
  return analysisId
}
