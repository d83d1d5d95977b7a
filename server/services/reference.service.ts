import type { AppContext } from '../context'
import { ReferenceProfile } from '../entities/reference-profile.entity'
import { ConflictError, InvalidError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { analysisFor } from './blade-access'
import { compareTwoResults } from './comparison.service'
import { applicableShop, shopMembership } from './target.service'
import type { ComparisonDto } from '../../shared/schemas/comparison'

type Ctx = Pick<AppContext, 'db'>

export interface ReferenceDto {
  id: string
  shopId: string
  modelLabel: string
  sizeIn: number
  sourceAnalysisId: string | null
  savedBy: string
  savedAt: string
}

const norm = (label: string) => label.trim().toLowerCase()
const toDto = (r: ReferenceProfile): ReferenceDto => ({
  id: r.id, shopId: r.shopId, modelLabel: r.modelLabel, sizeIn: r.sizeIn, sourceAnalysisId: r.sourceAnalysisId,
  savedBy: r.savedByName, savedAt: r.savedAt.toISOString(),
})

async function findReference(ctx: Ctx, shopId: string, modelLabel: string, sizeIn: number): Promise<ReferenceProfile | null> {
  const rows = await ctx.db.getRepository(ReferenceProfile).findBy({ shopId, sizeIn })
  return rows.find((r) => norm(r.modelLabel) === norm(modelLabel)) ?? null
}

export async function listReferences(ctx: Ctx, user: AuthUser, shopId: string): Promise<ReferenceDto[]> {
  await shopMembership(ctx, user, shopId)
  const rows = await ctx.db.getRepository(ReferenceProfile).find({ where: { shopId }, order: { modelLabel: 'ASC', sizeIn: 'ASC' } })
  return rows.map(toDto)
}

/**
 * Saves a measured analysis the shop can read as its reference for the blade's model and size, replacing an older
 * one. The blade must carry a model label: that is what other blades are matched on.
 */
export async function saveReference(ctx: Ctx, user: AuthUser, shopId: string, analysisId: string): Promise<ReferenceDto> {
  await shopMembership(ctx, user, shopId)
  const { analysis, blade } = await analysisFor(ctx, user, analysisId, 'read')
  if (analysis.status !== 'measured' || !analysis.result) throw new ConflictError('That analysis has no measurement to keep as a reference.')
  if (!blade.modelLabel?.trim()) {
    throw new InvalidError('The blade has no model label: add one on the Blade page first.', [{ path: 'analysisId', message: 'blade without a model label' }])
  }
  const repo = ctx.db.getRepository(ReferenceProfile)
  const row = (await findReference(ctx, shopId, blade.modelLabel, blade.sizeIn)) ?? repo.create({ shopId, modelLabel: blade.modelLabel.trim(), sizeIn: blade.sizeIn })
  Object.assign(row, { result: analysis.result, sourceAnalysisId: analysis.id, savedByName: user.name, savedAt: new Date() })
  return toDto(await repo.save(row))
}

/** Compares an analysis with the reference of its blade's model and size kept by the shop whose defaults apply. */
export async function compareWithReference(ctx: Ctx, user: AuthUser, analysisId: string): Promise<ComparisonDto> {
  const { analysis, blade } = await analysisFor(ctx, user, analysisId, 'read')
  const shop = await applicableShop(ctx, blade.skaterProfileId, user)
  const ref = shop && blade.modelLabel ? await findReference(ctx, shop.id, blade.modelLabel, blade.sizeIn) : null
  if (!ref) throw new ConflictError('No shop this skater works with keeps a reference profile for this blade\u2019s model and size.')
  const first = { id: ref.sourceAnalysisId ?? ref.id, result: ref.result, takenAt: ref.savedAt, side: blade.side, bladeId: blade.id }
  const note = `Reference: ${ref.modelLabel}, ${ref.sizeIn} in, kept by ${shop!.name}, saved by ${ref.savedByName}.`
  return compareTwoResults('reference', first, analysis, blade, [note])
}
