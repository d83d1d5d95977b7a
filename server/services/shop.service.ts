import type { Role } from '../../shared/schemas/auth'
import type { ShopInfo, ShopInvitationInfo, ShopMemberInfo, SkaterSummary } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { ShopInvitation } from '../entities/shop-invitation.entity'
import { ShopMember } from '../entities/shop-member.entity'
import { Shop } from '../entities/shop.entity'
import { ConflictError, NotFoundError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { technicianInvitationMail } from './auth-mail'
import { earnedRoles } from './policy'

type Ctx = Pick<AppContext, 'db' | 'config' | 'mail' | 'logger'>

/** Adds a role once; takes a DataSource or a transaction's EntityManager. */
export async function grantRole(db: Pick<AppContext['db'], 'query'>, accountId: string, role: Role): Promise<void> {
  await db.query(`UPDATE accounts SET roles = array_append(roles, $2) WHERE id = $1 AND NOT ($2 = ANY(roles))`, [accountId, role])
}

/** Creates a shop with the caller as its admin; the shop_admin role comes with it. */
export async function createShop(ctx: Ctx, user: AuthUser, name: string): Promise<ShopInfo> {
  return ctx.db.transaction(async (tx) => {
    const shop = await tx.getRepository(Shop).save({ name })
    await tx.getRepository(ShopMember).insert({ shopId: shop.id, accountId: user.id, role: 'admin' })
    await grantRole(tx, user.id, earnedRoles.createShop)
    return { id: shop.id, name: shop.name, myRole: 'admin' as const }
  })
}

/** The shop directory (names only), so a skater can pick a shop to share with; marks the caller's own shops. */
export async function listShops(ctx: Ctx, user: AuthUser): Promise<ShopInfo[]> {
  const rows: { id: string; name: string; role: 'admin' | 'technician' | null }[] = await ctx.db.query(
    `SELECT s.id, s.name, m.role FROM shops s LEFT JOIN shop_members m ON m.shop_id = s.id AND m.account_id = $1 ORDER BY s.name`,
    [user.id],
  )
  return rows.map((r) => ({ id: r.id, name: r.name, myRole: r.role }))
}

/** The caller's membership of a shop, or 404 alike for no such shop and not a member (or not its admin). */
export async function assertShopMember(ctx: Pick<AppContext, 'db'>, user: AuthUser, shopId: string, adminOnly = false): Promise<Shop> {
  const member = await ctx.db.getRepository(ShopMember).findOneBy({ shopId, accountId: user.id })
  if (!member || (adminOnly && member.role !== 'admin')) throw new NotFoundError('That shop')
  return ctx.db.getRepository(Shop).findOneByOrFail({ id: shopId })
}

export async function listMembers(ctx: Ctx, user: AuthUser, shopId: string): Promise<ShopMemberInfo[]> {
  await assertShopMember(ctx, user, shopId)
  const rows: { account_id: string; name: string; email: string; role: 'admin' | 'technician' }[] = await ctx.db.query(
    `SELECT m.account_id, a.name, a.email, m.role FROM shop_members m JOIN accounts a ON a.id = m.account_id
      WHERE m.shop_id = $1 ORDER BY m.role, a.name`,
    [shopId],
  )
  return rows.map((r) => ({ accountId: r.account_id, name: r.name, email: r.email, role: r.role }))
}

const INVITATION_SELECT = `SELECT i.id, i.shop_id, s.name AS shop_name, i.email, i.status, i.created_at
  FROM shop_invitations i JOIN shops s ON s.id = i.shop_id`

function toInvitation(r: { id: string; shop_id: string; shop_name: string; email: string; status: ShopInvitationInfo['status']; created_at: Date }): ShopInvitationInfo {
  return { id: r.id, shopId: r.shop_id, shopName: r.shop_name, email: r.email, status: r.status, createdAt: new Date(r.created_at).toISOString() }
}

export async function inviteTechnician(ctx: Ctx, user: AuthUser, shopId: string, email: string): Promise<ShopInvitationInfo> {
  const shop = await assertShopMember(ctx, user, shopId, true)
  const member = await ctx.db.query(`SELECT 1 FROM shop_members m JOIN accounts a ON a.id = m.account_id WHERE m.shop_id = $1 AND lower(a.email) = $2`, [shopId, email])
  const pending = await ctx.db.getRepository(ShopInvitation).existsBy({ shopId, email, status: 'pending' })
  if (member.length || pending) throw new ConflictError('That person already works at this shop or has an invitation waiting.', 'ALREADY_INVITED')
  const invitation = await ctx.db.getRepository(ShopInvitation).save({ shopId, email, invitedByAccountId: user.id, status: 'pending' })
  ctx.mail
    .send(technicianInvitationMail(email, shop.name, new URL('/shop', ctx.config.PUBLIC_URL).toString()))
    .catch((err: unknown) => ctx.logger.error({ err }, 'technician invitation mail failed'))
  return toInvitation({ ...invitation, shop_id: shopId, shop_name: shop.name, created_at: invitation.createdAt })
}

export async function listShopInvitations(ctx: Ctx, user: AuthUser, shopId: string): Promise<ShopInvitationInfo[]> {
  await assertShopMember(ctx, user, shopId, true)
  const rows = await ctx.db.query(`${INVITATION_SELECT} WHERE i.shop_id = $1 AND i.status = 'pending' ORDER BY i.created_at DESC`, [shopId])
  return rows.map(toInvitation)
}

/** Pending invitations addressed to the caller's e-mail address. */
export async function listMyShopInvitations(ctx: Ctx, user: AuthUser): Promise<ShopInvitationInfo[]> {
  const rows = await ctx.db.query(`${INVITATION_SELECT} WHERE lower(i.email) = lower($1) AND i.status = 'pending' ORDER BY i.created_at DESC`, [user.email])
  return rows.map(toInvitation)
}

/** Joins the shop as a technician; the technician role comes with it. */
export async function acceptShopInvitation(ctx: Ctx, user: AuthUser, invitationId: string): Promise<ShopInfo> {
  const invitation = await ctx.db.getRepository(ShopInvitation).findOneBy({ id: invitationId, status: 'pending' })
  if (!invitation || invitation.email.toLowerCase() !== user.email.toLowerCase()) throw new NotFoundError('That invitation')
  return ctx.db.transaction(async (tx) => {
    await tx.getRepository(ShopInvitation).update({ id: invitation.id }, { status: 'accepted', answeredAt: new Date() })
    await tx.query(`INSERT INTO shop_members (shop_id, account_id, role) VALUES ($1, $2, 'technician') ON CONFLICT DO NOTHING`, [invitation.shopId, user.id])
    await grantRole(tx, user.id, earnedRoles.acceptShopInvitation)
    const shop = await tx.getRepository(Shop).findOneByOrFail({ id: invitation.shopId })
    return { id: shop.id, name: shop.name, myRole: 'technician' as const }
  })
}

/**
 * The shop's admin removes a technician, or a technician leaves. The technician role goes with the last shop.
 * A shop's admin cannot be removed this way, so a shop is never left without one.
 */
export async function removeMember(ctx: Ctx, user: AuthUser, shopId: string, accountId: string): Promise<void> {
  const self = accountId === user.id
  await assertShopMember(ctx, user, shopId, !self)
  const deleted = await ctx.db.getRepository(ShopMember).delete({ shopId, accountId, role: 'technician' })
  if (!deleted.affected) throw new NotFoundError('That technician')
  await ctx.db.query(
    `UPDATE accounts SET roles = array_remove(roles, 'technician') WHERE id = $1
       AND NOT EXISTS (SELECT 1 FROM shop_members WHERE account_id = $1 AND role = 'technician')`,
    [accountId],
  )
}

/** The skaters shared with a shop, for its technicians' bench. */
export async function listShopSkaters(ctx: Ctx, user: AuthUser, shopId: string): Promise<SkaterSummary[]> {
  await assertShopMember(ctx, user, shopId)
  const rows: { id: string; name: string; owner_name: string; created_at: Date }[] = await ctx.db.query(
    `SELECT DISTINCT p.id, p.name, a.name AS owner_name, p.created_at FROM skater_shares s
       JOIN skater_profiles p ON p.id = s.skater_profile_id JOIN accounts a ON a.id = p.owner_account_id
      WHERE s.kind = 'shop' AND s.status = 'active' AND s.shop_id = $1 ORDER BY p.name`,
    [shopId],
  )
  return rows.map((r) => ({ id: r.id, name: r.name, ownerName: r.owner_name, via: ['shop'], createdAt: new Date(r.created_at).toISOString() }))
}
