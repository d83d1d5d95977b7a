import type { Share } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { Shop } from '../entities/shop.entity'
import { SkaterShare } from '../entities/skater-share.entity'
import { ConflictError, NotFoundError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { assertSkaterAccess } from './access.service'
import { coachInvitationMail } from './auth-mail'

type Ctx = Pick<AppContext, 'db' | 'config' | 'mail' | 'logger'>

const SHARE_SELECT = `
  SELECT s.id, s.kind, s.status, s.skater_profile_id, p.name AS skater_name, o.name AS owner_name,
         s.coach_email, c.name AS coach_name, s.shop_id, sh.name AS shop_name, s.created_at
    FROM skater_shares s
    JOIN skater_profiles p ON p.id = s.skater_profile_id
    JOIN accounts o ON o.id = p.owner_account_id
    LEFT JOIN accounts c ON c.id = s.coach_account_id
    LEFT JOIN shops sh ON sh.id = s.shop_id`

/** A share the caller is a party to: the skater's owner, the coach (invited address or account), a shop member. */
const PARTY = `(p.owner_account_id = $1
    OR (s.kind = 'coach' AND (s.coach_account_id = $1 OR (s.status = 'pending' AND lower(s.coach_email) = lower($2))))
    OR (s.kind = 'shop' AND EXISTS (SELECT 1 FROM shop_members m WHERE m.shop_id = s.shop_id AND m.account_id = $1)))`

interface ShareRow {
  id: string
  kind: Share['kind']
  status: Share['status']
  skater_profile_id: string
  skater_name: string
  owner_name: string
  coach_email: string | null
  coach_name: string | null
  shop_id: string | null
  shop_name: string | null
  created_at: Date
}

function toShare(r: ShareRow): Share {
  return {
    id: r.id,
    kind: r.kind,
    status: r.status,
    skaterId: r.skater_profile_id,
    skaterName: r.skater_name,
    ownerName: r.owner_name,
    coachEmail: r.coach_email,
    coachName: r.coach_name,
    shopId: r.shop_id,
    shopName: r.shop_name,
    createdAt: new Date(r.created_at).toISOString(),
  }
}

/** Open (pending or active) shares the caller is a party to, newest first. */
export async function listMyShares(ctx: Ctx, user: AuthUser): Promise<Share[]> {
  const rows: ShareRow[] = await ctx.db.query(
    `${SHARE_SELECT} WHERE s.status <> 'ended' AND ${PARTY} ORDER BY s.created_at DESC`,
    [user.id, user.email],
  )
  return rows.map(toShare)
}

/** The open shares of one of the caller's own skaters. */
export async function listSkaterShares(ctx: Ctx, user: AuthUser, skaterId: string): Promise<Share[]> {
  await assertSkaterAccess(ctx, user, skaterId, 'manage')
  const rows: ShareRow[] = await ctx.db.query(
    `${SHARE_SELECT} WHERE s.skater_profile_id = $1 AND s.status <> 'ended' ORDER BY s.created_at DESC`,
    [skaterId],
  )
  return rows.map(toShare)
}

async function loadShare(ctx: Ctx, user: AuthUser, shareId: string): Promise<Share> {
  const rows: ShareRow[] = await ctx.db.query(`${SHARE_SELECT} WHERE s.id = $3 AND s.status <> 'ended' AND ${PARTY}`, [user.id, user.email, shareId])
  if (!rows[0]) throw new NotFoundError('That share')
  return toShare(rows[0])
}

/** Invites a coach by e-mail; the share grants nothing until the coach accepts. */
export async function inviteCoach(ctx: Ctx, user: AuthUser, skaterId: string, email: string): Promise<Share> {
  const profile = await assertSkaterAccess(ctx, user, skaterId, 'manage')
  const repo = ctx.db.getRepository(SkaterShare)
  const open = await repo
    .createQueryBuilder('s')
    .where(`s.skater_profile_id = :skaterId AND s.kind = 'coach' AND s.status <> 'ended' AND lower(s.coach_email) = :email`, { skaterId, email })
    .getOne()
  if (open) throw new ConflictError('This skater is already shared with that coach, or an invitation is waiting.', 'ALREADY_SHARED')
  const share = await repo.save(repo.create({ skaterProfileId: profile.id, kind: 'coach', coachEmail: email, status: 'pending' }))
  const link = new URL('/sharing', ctx.config.PUBLIC_URL).toString()
  ctx.mail
    .send(coachInvitationMail(email, user.name, profile.name, link))
    .catch((err: unknown) => ctx.logger.error({ err }, 'coach invitation mail failed'))
  return loadShare(ctx, user, share.id)
}

/** Shares with a shop; it takes effect at once, and the shop or the owner may end it. */
export async function shareWithShop(ctx: Ctx, user: AuthUser, skaterId: string, shopId: string): Promise<Share> {
  const profile = await assertSkaterAccess(ctx, user, skaterId, 'manage')
  if (!(await ctx.db.getRepository(Shop).existsBy({ id: shopId }))) throw new NotFoundError('That shop')
  const repo = ctx.db.getRepository(SkaterShare)
  if (await repo.existsBy({ skaterProfileId: profile.id, kind: 'shop', shopId, status: 'active' })) {
    throw new ConflictError('This skater is already shared with that shop.', 'ALREADY_SHARED')
  }
  const share = await repo.save(repo.create({ skaterProfileId: profile.id, kind: 'shop', shopId, status: 'active', acceptedAt: new Date() }))
  return loadShare(ctx, user, share.id)
}

/** The coach addressed by a pending invitation accepts it; anyone else gets the same 404 as for no invitation. */
export async function acceptCoachShare(ctx: Ctx, user: AuthUser, shareId: string): Promise<Share> {
  const share = await loadShare(ctx, user, shareId)
  if (share.kind !== 'coach' || share.status !== 'pending' || share.coachEmail?.toLowerCase() !== user.email.toLowerCase()) {
    throw new NotFoundError('That invitation')
  }
  await ctx.db.getRepository(SkaterShare).update({ id: shareId }, { status: 'active', coachAccountId: user.id, acceptedAt: new Date() })
  return loadShare(ctx, user, shareId)
}

/** Either side ends a share (or declines an invitation); it stops granting access on the next request. */
export async function endShare(ctx: Ctx, user: AuthUser, shareId: string): Promise<void> {
  await loadShare(ctx, user, shareId)
  await ctx.db.getRepository(SkaterShare).update({ id: shareId }, { status: 'ended', endedAt: new Date() })
}
