import { z } from 'zod'
import { emailSchema } from './auth'

export const idParamsSchema = z.object({ id: z.uuid({ error: 'Not a valid id.' }) })

export const skaterNameSchema = z
  .string({ error: 'Enter the skater’s name.' })
  .trim()
  .min(1, 'Enter the skater’s name.')
  .max(100, 'Use at most 100 characters.')

export const createSkaterBodySchema = z.object({ name: skaterNameSchema })

/** How the caller reaches a skater: as its owner, as a coach it is shared with, or through a shop it is shared with. */
export const skaterViaSchema = z.enum(['owner', 'coach', 'shop'])
export type SkaterVia = z.infer<typeof skaterViaSchema>

export const skaterSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  ownerName: z.string(),
  via: z.array(skaterViaSchema).describe('Every path by which the caller sees this skater'),
  createdAt: z.iso.datetime(),
})
export type SkaterSummary = z.infer<typeof skaterSummarySchema>

export const shareCoachBodySchema = z.object({ email: emailSchema })
export const shareShopBodySchema = z.object({ shopId: z.uuid({ error: 'Choose a shop.' }) })

export const shareStatusSchema = z.enum(['pending', 'active', 'ended'])

/** A share as both sides see it. */
export const shareSchema = z.object({
  id: z.uuid(),
  kind: z.enum(['coach', 'shop']),
  status: shareStatusSchema,
  skaterId: z.uuid(),
  skaterName: z.string(),
  ownerName: z.string(),
  coachEmail: z.string().nullable(),
  coachName: z.string().nullable(),
  shopId: z.uuid().nullable(),
  shopName: z.string().nullable(),
  createdAt: z.iso.datetime(),
})
export type Share = z.infer<typeof shareSchema>

export const shopNameSchema = z
  .string({ error: 'Enter the shop’s name.' })
  .trim()
  .min(2, 'Use at least 2 characters.')
  .max(100, 'Use at most 100 characters.')

export const createShopBodySchema = z.object({ name: shopNameSchema })
export const inviteTechnicianBodySchema = z.object({ email: emailSchema })

export const shopSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  myRole: z.enum(['admin', 'technician']).nullable().describe('The caller’s place in the shop, null if not a member'),
})
export type ShopInfo = z.infer<typeof shopSchema>

export const shopMemberSchema = z.object({
  accountId: z.uuid(),
  name: z.string(),
  email: z.string(),
  role: z.enum(['admin', 'technician']),
})
export type ShopMemberInfo = z.infer<typeof shopMemberSchema>

export const shopInvitationSchema = z.object({
  id: z.uuid(),
  shopId: z.uuid(),
  shopName: z.string(),
  email: z.string(),
  status: z.enum(['pending', 'accepted', 'withdrawn']),
  createdAt: z.iso.datetime(),
})
export type ShopInvitationInfo = z.infer<typeof shopInvitationSchema>

export const shopMemberParamsSchema = z.object({ id: z.uuid(), accountId: z.uuid() })
