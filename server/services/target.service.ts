import type { AppContext } from '../context'
import type { Blade } from '../entities/blade.entity'
import { Shop } from '../entities/shop.entity'
import { ShopMember } from '../entities/shop-member.entity'
import { ShopWearSetting } from '../entities/shop-wear-setting.entity'
import { TargetSetting } from '../entities/target-setting.entity'
import { NotFoundError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { skaterRelation } from './access.service'
import { TARGET_METRICS, type TargetMetric } from '../../shared/targets/bands'
import { resolveTargets, type ResolvedTargets, type TargetLayerSettings } from '../../shared/targets/resolve'
import type { BladeTargetsDto, SetTargetBody, ShopWearSettingsDto, TargetSettingDto } from '../../shared/schemas/targets'

type Ctx = Pick<AppContext, 'db'>
export type TargetScope = TargetSetting['scope']

const ownerColumn = { shop: 'shopId', skater: 'skaterProfileId', blade: 'bladeId' } as const

function toSetting(row: TargetSetting): TargetSettingDto {
  return {
    metric: row.metric,
    band: { min: row.minValue, max: row.maxValue },
    setBy: { accountId: row.setById ?? '', displayName: row.setByName, ...(row.setByRole ? { role: row.setByRole } : {}) },
    setAt: row.setAt.toISOString(),
    note: row.note,
  }
}

/** The bands one layer sets (a shop's defaults, a skater's or a blade's preferences). */
export async function listLayer(ctx: Ctx, scope: TargetScope, ownerId: string): Promise<TargetSettingDto[]> {
  const rows = await ctx.db.getRepository(TargetSetting).find({ where: { scope, [ownerColumn[scope]]: ownerId } })
  return rows.map(toSetting).sort((a, b) => TARGET_METRICS.indexOf(a.metric) - TARGET_METRICS.indexOf(b.metric))
}

async function layerSettings(ctx: Ctx, scope: TargetScope, ownerId: string | null): Promise<TargetLayerSettings> {
  if (!ownerId) return {}
  return Object.fromEntries((await listLayer(ctx, scope, ownerId)).map((s) => [s.metric, s]))
}

/** Sets (or replaces) one band in one layer, recording who set it, in what capacity, and when. */
export async function setTarget(
  ctx: Ctx, scope: TargetScope, ownerId: string, metric: TargetMetric, body: SetTargetBody,
  author: { id: string; name: string; role: string | null },
): Promise<TargetSettingDto> {
  const repo = ctx.db.getRepository(TargetSetting)
  const existing = await repo.findOneBy({ scope, metric, [ownerColumn[scope]]: ownerId })
  const row = existing ?? repo.create({ scope, metric, shopId: null, skaterProfileId: null, bladeId: null, [ownerColumn[scope]]: ownerId })
  Object.assign(row, {
    minValue: body.min, maxValue: body.max, note: body.note ?? null,
    setById: author.id, setByName: author.name, setByRole: author.role, setAt: new Date(),
  })
  return toSetting(await repo.save(row))
}

/** Removes one band from one layer, so the layer below applies again. */
export async function clearTarget(ctx: Ctx, scope: TargetScope, ownerId: string, metric: TargetMetric): Promise<void> {
  const result = await ctx.db.getRepository(TargetSetting).delete({ scope, metric, [ownerColumn[scope]]: ownerId })
  if (!result.affected) throw new NotFoundError('That target')
}

/** The capacity in which the caller sets a skater's or a blade's target: the skater (or parent) or their coach. */
export async function skaterAuthorRole(ctx: Ctx, user: AuthUser, skaterProfileId: string): Promise<string | null> {
  const via = await skaterRelation(ctx, user, skaterProfileId)
  return via.includes('owner') ? 'skater' : via.includes('coach') ? 'coach' : null
}

/** The caller's membership of a shop; 404 alike for a shop that does not exist and one they do not work at. */
export async function shopMembership(ctx: Ctx, user: AuthUser, shopId: string): Promise<ShopMember> {
  const member = await ctx.db.getRepository(ShopMember).findOneBy({ shopId, accountId: user.id })
  if (!member) throw new NotFoundError('That shop')
  return member
}

/**
 * The shop whose defaults apply to a skater's blades: the caller's own shop when it has an active share from the
 * skater, otherwise the shop of the skater's most recent active shop share. Null when no shop has one.
 */
export async function applicableShop(ctx: Ctx, skaterProfileId: string, user: AuthUser | null): Promise<Shop | null> {
  const rows: { shop_id: string }[] = await ctx.db.query(
    `SELECT s.shop_id FROM skater_shares s
      WHERE s.skater_profile_id = $1 AND s.kind = 'shop' AND s.status = 'active'
      ORDER BY EXISTS (SELECT 1 FROM shop_members m WHERE m.shop_id = s.shop_id AND m.account_id = $2) DESC,
               coalesce(s.accepted_at, s.created_at) DESC
      LIMIT 1`,
    [skaterProfileId, user?.id ?? null],
  )
  return rows.length ? ctx.db.getRepository(Shop).findOneBy({ id: rows[0].shop_id }) : null
}

/** Every band that applies to a blade, layered platform < shop < skater < blade. */
export async function bladeTargets(ctx: Ctx, blade: Blade, user: AuthUser | null): Promise<{ resolved: ResolvedTargets; dto: BladeTargetsDto; shop: Shop | null }> {
  const shop = await applicableShop(ctx, blade.skaterProfileId, user)
  const resolved = resolveTargets({
    blade: { sizeIn: blade.sizeIn },
    shop: await layerSettings(ctx, 'shop', shop?.id ?? null),
    skater: await layerSettings(ctx, 'skater', blade.skaterProfileId),
    bladePreference: await layerSettings(ctx, 'blade', blade.id),
  })
  const dto: BladeTargetsDto = {
    bladeId: blade.id,
    shop: shop ? { id: shop.id, name: shop.name } : null,
    targets: TARGET_METRICS.map((m) => ({ ...resolved[m], note: resolved[m].note ?? null })),
  }
  return { resolved, dto, shop }
}

/** A shop's wear settings (the minimum runner height), or nulls when it has set none. */
export async function shopWear(ctx: Ctx, shopId: string | null): Promise<ShopWearSettingsDto> {
  const row = shopId ? await ctx.db.getRepository(ShopWearSetting).findOneBy({ shopId }) : null
  return { minRunnerHeightMm: row?.minRunnerHeightMm ?? null, setBy: row?.setByName ?? null, setAt: row?.setAt.toISOString() ?? null }
}

export async function setShopWear(ctx: Ctx, shopId: string, minRunnerHeightMm: number, author: { name: string }): Promise<ShopWearSettingsDto> {
  await ctx.db.getRepository(ShopWearSetting).save({ shopId, minRunnerHeightMm, setByName: author.name, setAt: new Date() })
  return shopWear(ctx, shopId)
}
