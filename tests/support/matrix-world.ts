import { randomBytes } from 'node:crypto'
import type { Role } from '../../shared/schemas/auth'
import type { AppContext } from '../../server/context'
import { createAccount } from '../../server/services/auth.service'
import { authFor } from '../../server/services/session.service'
import { TEST_PASSWORD, uniqueEmail } from './accounts'

/** Who calls: every role, people with no share, an unverified account, and nobody signed in. */
export const callerRoles = {
  owner: ['skater'],
  otherSkater: ['skater'],
  unverified: ['skater'],
  coach: ['coach'],
  otherCoach: ['coach'],
  technician: ['technician'],
  otherTechnician: ['technician'],
  shopAdmin: ['shop_admin'],
  admin: ['admin'],
} satisfies Record<string, Role[]>

export type CallerName = keyof typeof callerRoles | 'anonymous'
export const callerNames = [...Object.keys(callerRoles), 'anonymous'] as CallerName[]

/** Callers who have no relation to the world's skater: nothing about that skater may reach them. */
export const strangers: CallerName[] = ['otherSkater', 'unverified', 'otherCoach', 'otherTechnician', 'admin']

export const SKATER_NAME = 'Quinn Matrixskater'

export interface World {
  ids: Record<keyof typeof callerRoles, string>
  emails: Record<keyof typeof callerRoles, string>
  skaterId: string
  shopId: string
  otherShopId: string
  spareAccountId: string
}

async function insertShop(ctx: AppContext, name: string, members: [string, 'admin' | 'technician'][]): Promise<string> {
  const [{ id }] = await ctx.db.query(`INSERT INTO shops (name) VALUES ($1) RETURNING id`, [name])
  for (const [accountId, role] of members) await ctx.db.query(`INSERT INTO shop_members (shop_id, account_id, role) VALUES ($1, $2, $3)`, [id, accountId, role])
  return id
}

/** One skater owned by `owner`, shared with `coach` and with the shop where `technician` and `shopAdmin` work. */
export async function buildWorld(ctx: AppContext): Promise<World> {
  const ids = {} as World['ids']
  const emails = {} as World['emails']
  for (const [name, roles] of Object.entries(callerRoles) as [keyof typeof callerRoles, Role[]][]) {
    emails[name] = uniqueEmail(name.toLowerCase())
    ids[name] = (await createAccount(ctx, { email: emails[name], password: TEST_PASSWORD, name: `Matrix ${name}`, roles, verified: name !== 'unverified' })).id
  }
  const [{ id: skaterId }] = await ctx.db.query(`INSERT INTO skater_profiles (owner_account_id, name) VALUES ($1, $2) RETURNING id`, [ids.owner, SKATER_NAME])
  const shopId = await insertShop(ctx, 'Matrix Shop', [[ids.shopAdmin, 'admin'], [ids.technician, 'technician']])
  const otherShopId = await insertShop(ctx, 'Other Shop', [[ids.otherTechnician, 'technician']])
  await ctx.db.query(
    `INSERT INTO skater_shares (skater_profile_id, kind, coach_email, coach_account_id, status) VALUES ($1, 'coach', $2, $3, 'active')`,
    [skaterId, emails.coach, ids.coach],
  )
  await ctx.db.query(`INSERT INTO skater_shares (skater_profile_id, kind, shop_id, status) VALUES ($1, 'shop', $2, 'active')`, [skaterId, shopId])
  const spare = await createAccount(ctx, { email: uniqueEmail('spare'), password: TEST_PASSWORD, name: 'Matrix spare', roles: ['skater'] })
  return { ids, emails, skaterId, shopId, otherShopId, spareAccountId: spare.id }
}

/** A fresh session for each call, so signing out or changing a password in one case cannot disturb another. */
export async function cookieFor(ctx: AppContext, world: World, caller: CallerName): Promise<string | null> {
  if (caller === 'anonymous') return null
  const session = await authFor(ctx).createSession(world.ids[caller], { userAgent: 'matrix', ip: null, createdAt: new Date() })
  return `rb_session=${session.id}`
}

export const fresh = {
  shop: (ctx: AppContext, members: [string, 'admin' | 'technician'][] = []) => insertShop(ctx, `Fresh ${randomBytes(3).toString('hex')}`, members),
  async share(ctx: AppContext, world: World, status: 'pending' | 'active'): Promise<string> {
    const [{ id }] = await ctx.db.query(
      `INSERT INTO skater_shares (skater_profile_id, kind, coach_email, coach_account_id, status) VALUES ($1, 'coach', $2, $3, $4) RETURNING id`,
      [world.skaterId, world.emails.coach, status === 'active' ? world.ids.coach : null, status],
    )
    return id
  },
  async technician(ctx: AppContext, world: World): Promise<string> {
    const [{ id }] = await ctx.db.query(`INSERT INTO accounts (email, name, password_hash, roles) VALUES ($1, 'Spare tech', 'x', '{technician}') RETURNING id`, [uniqueEmail('sparetech')])
    await ctx.db.query(`INSERT INTO shop_members (shop_id, account_id, role) VALUES ($1, $2, 'technician')`, [world.shopId, id])
    return id
  },
  async invitation(ctx: AppContext, world: World): Promise<string> {
    const shopId = await fresh.shop(ctx)
    const [{ id }] = await ctx.db.query(`INSERT INTO shop_invitations (shop_id, email) VALUES ($1, $2) RETURNING id`, [shopId, world.emails.otherTechnician])
    return id
  },
}
