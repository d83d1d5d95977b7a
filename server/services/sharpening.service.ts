import type { AppContext } from '../context'
import { Analysis } from '../entities/analysis.entity'
import type { Blade } from '../entities/blade.entity'
import { Sharpening } from '../entities/sharpening.entity'
import { InvalidError, NotFoundError } from '../errors'
import type { CreateSharpeningBody, SharpeningDto } from '../../shared/schemas/blades'

type Ctx = Pick<AppContext, 'db'>

function toDto(s: Sharpening): SharpeningDto {
  return {
    id: s.id, bladeId: s.bladeId, sharpenedOn: s.sharpenedOn, shop: s.shop, technician: s.technician,
    rootRadiusSixteenths: s.rootRadiusSixteenths, notes: s.notes, analysisBeforeId: s.analysisBeforeId,
    analysisAfterId: s.analysisAfterId, createdAt: s.createdAt.toISOString(),
  }
}

/** An analysis linked to a sharpening must be of the same blade; another blade's id reads as not valid. */
async function checkAnalysis(ctx: Ctx, bladeId: string, id: string | undefined, field: string): Promise<void> {
  if (!id) return
  const found = (await ctx.db.getRepository(Analysis).countBy({ id, bladeId })) > 0
  if (!found) throw new InvalidError(`${field}: no analysis of this blade has that id`, [{ path: field, message: 'unknown analysis' }])
}

export async function recordSharpening(ctx: Ctx, blade: Blade, body: CreateSharpeningBody, userId: string | null) {
  await checkAnalysis(ctx, blade.id, body.analysisBeforeId, 'analysisBeforeId')
  await checkAnalysis(ctx, blade.id, body.analysisAfterId, 'analysisAfterId')
  const row = await ctx.db.getRepository(Sharpening).save({
    bladeId: blade.id, sharpenedOn: body.sharpenedOn, shop: body.shop || null, technician: body.technician || null,
    rootRadiusSixteenths: body.rootRadiusSixteenths ?? null, notes: body.notes || null,
    analysisBeforeId: body.analysisBeforeId ?? null, analysisAfterId: body.analysisAfterId ?? null, recordedById: userId,
  })
  return toDto(row)
}

export async function listSharpenings(ctx: Ctx, bladeId: string): Promise<SharpeningDto[]> {
  const rows = await ctx.db.getRepository(Sharpening).find({ where: { bladeId }, order: { sharpenedOn: 'DESC', createdAt: 'DESC' } })
  return rows.map(toDto)
}

export async function findSharpening(ctx: Ctx, id: string): Promise<Sharpening> {
  const row = await ctx.db.getRepository(Sharpening).findOneBy({ id })
  if (!row) throw new NotFoundError('That sharpening')
  return row
}

export async function deleteSharpening(ctx: Ctx, row: Sharpening): Promise<void> {
  await ctx.db.getRepository(Sharpening).delete({ id: row.id })
}
