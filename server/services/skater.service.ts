import type { SkaterSummary } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { SkaterProfile } from '../entities/skater-profile.entity'
import type { AuthUser } from '../middleware/require-auth'
import { listAccessibleSkaters, skaterRelation } from './access.service'

type Ctx = Pick<AppContext, 'db'>

export async function createSkater(ctx: Ctx, user: AuthUser, name: string): Promise<SkaterProfile> {
  const repo = ctx.db.getRepository(SkaterProfile)
  return repo.save(repo.create({ ownerAccountId: user.id, name }))
}

async function summaries(ctx: Ctx, relations: Map<string, SkaterSummary['via']>): Promise<SkaterSummary[]> {
  if (!relations.size) return []
  const rows: { id: string; name: string; owner_name: string; created_at: Date }[] = await ctx.db.query(
    `SELECT p.id, p.name, a.name AS owner_name, p.created_at FROM skater_profiles p
       JOIN accounts a ON a.id = p.owner_account_id WHERE p.id = ANY($1::uuid[]) ORDER BY p.name, p.id`,
    [[...relations.keys()]],
  )
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    ownerName: r.owner_name,
    via: relations.get(r.id) ?? [],
    createdAt: new Date(r.created_at).toISOString(),
  }))
}

/** Every skater the caller may see, with how they see each (owner, coach, shop). */
export async function listSkaters(ctx: Ctx, user: AuthUser): Promise<SkaterSummary[]> {
  return summaries(ctx, await listAccessibleSkaters(ctx, user))
}

/** One skater for a caller already let through `assertSkaterAccess`. */
export async function skaterSummary(ctx: Ctx, user: AuthUser, profile: SkaterProfile): Promise<SkaterSummary> {
  const via = await skaterRelation(ctx, user, profile.id)
  const [summary] = await summaries(ctx, new Map([[profile.id, via]]))
  return summary
}

/** A coach's roster: the skaters shared with them by an active share. */
export async function listRoster(ctx: Ctx, user: AuthUser): Promise<SkaterSummary[]> {
  const all = await listAccessibleSkaters(ctx, user)
  return summaries(ctx, new Map([...all].filter(([, via]) => via.includes('coach'))))
}

export async function renameSkater(ctx: Ctx, profile: SkaterProfile, name: string): Promise<void> {
  await ctx.db.getRepository(SkaterProfile).update({ id: profile.id }, { name })
}
