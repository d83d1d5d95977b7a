import type { AppContext } from '../context'
import { Blade } from '../entities/blade.entity'
import { SkatePair } from '../entities/skate-pair.entity'
import { NotFoundError } from '../errors'
import type { BladeDto, CreatePairBody, PairDto, UpdateBladeBody } from '../../shared/schemas/blades'

type Ctx = Pick<AppContext, 'db'>

export function toBladeDto(blade: Blade): BladeDto {
  return {
    id: blade.id, pairId: blade.pairId, skaterId: blade.skaterProfileId, side: blade.side,
    discipline: blade.discipline, sizeIn: blade.sizeIn, modelLabel: blade.modelLabel, mountedOn: blade.mountedOn,
    sharpeningsAtRegistration: blade.sharpeningsAtRegistration, status: blade.status, notes: blade.notes,
    createdAt: blade.createdAt.toISOString(),
  }
}

function toPairDto(pair: SkatePair, blades: Blade[]): PairDto {
  return {
    id: pair.id, skaterId: pair.skaterProfileId, label: pair.label, sizeIn: pair.sizeIn, discipline: pair.discipline,
    createdAt: pair.createdAt.toISOString(),
    blades: blades.filter((b) => b.pairId === pair.id).sort((a, b) => a.side.localeCompare(b.side)).map(toBladeDto),
  }
}

/** Creates a pair and both its blades in one transaction; the caller has checked write access to the skater. */
export async function createPair(ctx: Ctx, skaterProfileId: string, body: CreatePairBody): Promise<PairDto> {
  return ctx.db.transaction(async (tx) => {
    const pair = await tx.getRepository(SkatePair).save({
      skaterProfileId, label: body.label, sizeIn: body.sizeIn, discipline: body.discipline,
    })
    const blades = await tx.getRepository(Blade).save((['left', 'right'] as const).map((side) => ({
      pairId: pair.id, skaterProfileId, side, discipline: body.discipline, sizeIn: body.sizeIn,
      modelLabel: body.modelLabel ?? null, mountedOn: body.mountedOn ?? null,
      sharpeningsAtRegistration: body.sharpeningsAtRegistration ?? 0, status: 'in_use' as const, notes: null,
    })))
    return toPairDto(pair, blades)
  })
}

/** Every pair of the given skater profiles, newest first, with their blades. */
export async function listPairs(ctx: Ctx, skaterProfileIds: string[]): Promise<PairDto[]> {
  if (!skaterProfileIds.length) return []
  const pairs = await ctx.db.getRepository(SkatePair)
    .createQueryBuilder('p').where('p.skater_profile_id IN (:...ids)', { ids: skaterProfileIds })
    .orderBy('p.created_at', 'DESC').getMany()
  if (!pairs.length) return []
  const blades = await ctx.db.getRepository(Blade)
    .createQueryBuilder('b').where('b.pair_id IN (:...ids)', { ids: pairs.map((p) => p.id) }).getMany()
  return pairs.map((p) => toPairDto(p, blades))
}

/** Loads a blade without any access check; callers go through `blade-access.ts`. */
export async function findBlade(ctx: Ctx, bladeId: string): Promise<Blade> {
  const blade = await ctx.db.getRepository(Blade).findOneBy({ id: bladeId })
  if (!blade) throw new NotFoundError('That blade')
  return blade
}

export async function findPair(ctx: Ctx, pairId: string): Promise<SkatePair> {
  const pair = await ctx.db.getRepository(SkatePair).findOneBy({ id: pairId })
  if (!pair) throw new NotFoundError('That pair')
  return pair
}

export async function getPair(ctx: Ctx, pair: SkatePair): Promise<PairDto> {
  const blades = await ctx.db.getRepository(Blade).findBy({ pairId: pair.id })
  return toPairDto(pair, blades)
}

export async function renamePair(ctx: Ctx, pair: SkatePair, label: string): Promise<PairDto> {
  await ctx.db.getRepository(SkatePair).update({ id: pair.id }, { label })
  return getPair(ctx, { ...pair, label })
}

export async function updateBlade(ctx: Ctx, blade: Blade, body: UpdateBladeBody): Promise<BladeDto> {
  const changes = Object.fromEntries(Object.entries(body).filter(([, v]) => v !== undefined))
  if (Object.keys(changes).length) await ctx.db.getRepository(Blade).update({ id: blade.id }, changes)
  return toBladeDto(await findBlade(ctx, blade.id))
}

/** Deletes a pair, its blades and their records; returns the photo keys no longer referenced, for storage clean-up. */
export async function deletePair(ctx: Ctx, pair: SkatePair): Promise<string[]> {
  return ctx.db.transaction(async (tx) => {
    const keys: { storage_key: string }[] = await tx.query(
      `SELECT DISTINCT p.storage_key FROM photos p JOIN blades b ON b.id = p.blade_id WHERE b.pair_id = $1`, [pair.id])
    await tx.getRepository(SkatePair).delete({ id: pair.id })
    const still: { storage_key: string }[] = keys.length
      ? await tx.query(`SELECT DISTINCT storage_key FROM photos WHERE storage_key = ANY($1)`, [keys.map((k) => k.storage_key)])
      : []
    const kept = new Set(still.map((k) => k.storage_key))
    return keys.map((k) => k.storage_key).filter((k) => !kept.has(k))
  })
}
