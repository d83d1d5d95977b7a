import type { Role } from '../../shared/schemas/auth'
import type { AppContext } from '../context'
import { ShopMember } from '../entities/shop-member.entity'
import { Shop } from '../entities/shop.entity'
import { SkaterProfile } from '../entities/skater-profile.entity'
import { SkaterShare } from '../entities/skater-share.entity'
import { createAccount } from '../services/auth.service'
import type { SeedStep } from './index'

/** One password for every demo account, printed by `npm start`; never used outside the local demo database. */
export const DEMO_PASSWORD = 'rockerbook-demo'

/**
 * The invented Glenmere Skating Club: a platform admin, a coach, two skater families (a parent with two children
 * who skate, and an adult skater), and the Glenmere Edge Bench shop with its admin and two technicians.
 */
export const demoPeople = {
  admin: { email: 'admin@glenmere.example', name: 'Platform Admin', roles: ['admin'] },
  coach: { email: 'coach@glenmere.example', name: 'Wren Aldane', roles: ['coach'] },
  parent: { email: 'parent@glenmere.example', name: 'Petra Haldor', roles: ['skater'] },
  skater: { email: 'skater@glenmere.example', name: 'Tomas Reyvik', roles: ['skater', 'coach'] },
  shopAdmin: { email: 'shop@glenmere.example', name: 'Hale Brennick', roles: ['shop_admin'] },
  techOne: { email: 'tech1@glenmere.example', name: 'Sami Okoro', roles: ['technician'] },
  techTwo: { email: 'tech2@glenmere.example', name: 'Rue Tanaberg', roles: ['technician'] },
} satisfies Record<string, { email: string; name: string; roles: Role[] }>

async function seedAccounts(ctx: AppContext): Promise<Record<keyof typeof demoPeople, string>> {
  const ids = {} as Record<keyof typeof demoPeople, string>
  for (const [key, person] of Object.entries(demoPeople) as [keyof typeof demoPeople, (typeof demoPeople)[keyof typeof demoPeople]][]) {
    const account = await createAccount(ctx, { ...person, password: DEMO_PASSWORD, verified: true })
    ids[key] = account.id
  }
  return ids
}

async function run(ctx: AppContext): Promise<void> {
  const ids = await seedAccounts(ctx)
  await ctx.db.transaction(async (tx) => {
    const shop = await tx.getRepository(Shop).save({ name: 'Glenmere Edge Bench' })
    await tx.getRepository(ShopMember).insert([
      { shopId: shop.id, accountId: ids.shopAdmin, role: 'admin' },
      { shopId: shop.id, accountId: ids.techOne, role: 'technician' },
      { shopId: shop.id, accountId: ids.techTwo, role: 'technician' },
    ])
    const skaters = tx.getRepository(SkaterProfile)
    const mila = await skaters.save({ ownerAccountId: ids.parent, name: 'Mila Haldor' })
    const jonas = await skaters.save({ ownerAccountId: ids.parent, name: 'Jonas Haldor' })
    const tomas = await skaters.save({ ownerAccountId: ids.skater, name: 'Tomas Reyvik' })
    const now = new Date()
    const coach = demoPeople.coach.email
    await tx.getRepository(SkaterShare).insert([
      { skaterProfileId: mila.id, kind: 'coach', coachEmail: coach, coachAccountId: ids.coach, status: 'active', acceptedAt: now },
      { skaterProfileId: mila.id, kind: 'shop', shopId: shop.id, status: 'active', acceptedAt: now },
      { skaterProfileId: jonas.id, kind: 'coach', coachEmail: coach, status: 'pending' },
      { skaterProfileId: tomas.id, kind: 'coach', coachEmail: coach, coachAccountId: ids.coach, status: 'active', acceptedAt: now },
      { skaterProfileId: tomas.id, kind: 'shop', shopId: shop.id, status: 'active', acceptedAt: now },
    ])
  })
}

export const demoAccountsStep: SeedStep = {
  name: 'demo-accounts',
  signIns: Object.values(demoPeople).map((p) => `${p.email.padEnd(26)} ${DEMO_PASSWORD}  (${p.roles.join(', ')}: ${p.name})`),
  run,
}
