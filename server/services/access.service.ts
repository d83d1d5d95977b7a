import type { SkaterVia } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { SkaterProfile } from '../entities/skater-profile.entity'
import { NotFoundError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { COACH_SHARE_ROLE, relationAllows, type SkaterAccessMode } from './policy'

type Ctx = Pick<AppContext, 'db'>
type Caller = Pick<AuthUser, 'id' | 'roles'>

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/**
 * Every path by which `user` reaches skaters, as one query: owned profiles, active coach shares (while the account
 * still holds the coach role), and active shop shares of shops the account works at.
 */
async function relations(ctx: Ctx, user: Caller, skaterId?: string): Promise<Map<string, SkaterVia[]>> {
  const isCoach = user.roles.includes(COACH_SHARE_ROLE)
  const rows: { id: string; via: SkaterVia }[] = await ctx.db.query(
    `SELECT p.id, 'owner' AS via FROM skater_profiles p
      WHERE p.owner_account_id = $1 AND ($2::uuid IS NULL OR p.id = $2)
     UNION
     SELECT s.skater_profile_id, 'coach' FROM skater_shares s
      WHERE $3 AND s.kind = 'coach' AND s.status = 'active' AND s.coach_account_id = $1
        AND ($2::uuid IS NULL OR s.skater_profile_id = $2)
     UNION
     SELECT s.skater_profile_id, 'shop' FROM skater_shares s JOIN shop_members m ON m.shop_id = s.shop_id
      WHERE s.kind = 'shop' AND s.status = 'active' AND m.account_id = $1
        AND ($2::uuid IS NULL OR s.skater_profile_id = $2)`,
    [user.id, skaterId ?? null, isCoach],
  )
  const map = new Map<string, SkaterVia[]>()
  for (const row of rows) map.set(row.id, [...(map.get(row.id) ?? []), row.via])
  return map
}

/** How `user` reaches one skater (empty when they do not). */
export async function skaterRelation(ctx: Ctx, user: Caller, skaterProfileId: string): Promise<SkaterVia[]> {
  return (await relations(ctx, user, skaterProfileId)).get(skaterProfileId) ?? []
}

/**
 * The one access check for anything belonging to a skater. Returns the profile, or throws NotFoundError alike for a
 * profile that does not exist and one the caller may not use in this mode, so ids cannot be probed.
 * Owner: every mode. Coach with an active share: read, annotate (targets too). Shop member with an active shop
 * share: read, write (measurements, sharpenings). See `policy.ts`.
 */
export async function assertSkaterAccess(
  ctx: Ctx,
  user: Caller,
  skaterProfileId: string,
  mode: SkaterAccessMode,
): Promise<SkaterProfile> {
  if (!UUID.test(skaterProfileId)) throw new NotFoundError('That skater')
  const via = await skaterRelation(ctx, user, skaterProfileId)
  if (!relationAllows(via, mode)) throw new NotFoundError('That skater')
  const profile = await ctx.db.getRepository(SkaterProfile).findOneBy({ id: skaterProfileId })
  if (!profile) throw new NotFoundError('That skater')
  return profile
}

/** Ids of every skater the caller may read, with how they reach each. */
export async function listAccessibleSkaters(ctx: Ctx, user: Caller): Promise<Map<string, SkaterVia[]>> {
  return relations(ctx, user)
}

export async function listAccessibleSkaterIds(ctx: Ctx, user: Caller): Promise<string[]> {
  return [...(await relations(ctx, user)).keys()]
}
