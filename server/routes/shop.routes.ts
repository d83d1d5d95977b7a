import { Router } from 'express'
import { createShopBodySchema, idParamsSchema, inviteTechnicianBodySchema, shopMemberParamsSchema } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { requireAuth, requireVerified, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import * as shops from '../services/shop.service'

/** Shops, their members and technician invitations. Membership is checked in the service (404 for non-members). */
export function shopRoutes(ctx: AppContext): Router {
  const router = Router()
  const id = (req: { params: unknown }) => String((req.params as { id: string }).id)

  router.get('/shops', requireAuth, async (req, res) => {
    res.json(await shops.listShops(ctx, signedIn(req)))
  })

  router.post('/shops', requireAuth, requireVerified, validate({ body: createShopBodySchema }), async (req, res) => {
    res.status(201).json(await shops.createShop(ctx, signedIn(req), req.body.name))
  })

  router.get('/shops/:id/members', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await shops.listMembers(ctx, signedIn(req), id(req)))
  })

  router.delete('/shops/:id/members/:accountId', requireAuth, validate({ params: shopMemberParamsSchema }), async (req, res) => {
    await shops.removeMember(ctx, signedIn(req), id(req), String(req.params.accountId))
    res.status(204).end()
  })

  router.get('/shops/:id/invitations', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await shops.listShopInvitations(ctx, signedIn(req), id(req)))
  })

  router.post('/shops/:id/invitations', requireAuth, requireVerified, validate({ params: idParamsSchema, body: inviteTechnicianBodySchema }), async (req, res) => {
    res.status(201).json(await shops.inviteTechnician(ctx, signedIn(req), id(req), req.body.email))
  })

  router.get('/shops/:id/skaters', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await shops.listShopSkaters(ctx, signedIn(req), id(req)))
  })

  router.get('/shop-invitations', requireAuth, async (req, res) => {
    res.json(await shops.listMyShopInvitations(ctx, signedIn(req)))
  })

  router.post('/shop-invitations/:id/accept', requireAuth, requireVerified, validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await shops.acceptShopInvitation(ctx, signedIn(req), id(req)))
  })

  return router
}
