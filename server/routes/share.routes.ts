import { Router } from 'express'
import { idParamsSchema, shareCoachBodySchema, shareShopBodySchema } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { requireAuth, requireRole, requireVerified, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { routeRoles } from '../services/policy'
import * as shares from '../services/share.service'

/**
 * Sharing a skater with a coach (invitation by e-mail, accepted by the coach) or a shop (at once). Sharing and
 * accepting need a confirmed e-mail address; ending a share never does.
 */
export function shareRoutes(ctx: AppContext): Router {
  const router = Router()
  const id = (req: { params: unknown }) => String((req.params as { id: string }).id)

  router.get('/shares', requireAuth, async (req, res) => {
    res.json(await shares.listMyShares(ctx, signedIn(req)))
  })

  router.get('/skaters/:id/shares', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await shares.listSkaterShares(ctx, signedIn(req), id(req)))
  })

  router.post('/skaters/:id/shares/coach', requireAuth, requireVerified, validate({ params: idParamsSchema, body: shareCoachBodySchema }), async (req, res) => {
    res.status(201).json(await shares.inviteCoach(ctx, signedIn(req), id(req), req.body.email))
  })

  router.post('/skaters/:id/shares/shop', requireAuth, requireVerified, validate({ params: idParamsSchema, body: shareShopBodySchema }), async (req, res) => {
    res.status(201).json(await shares.shareWithShop(ctx, signedIn(req), id(req), req.body.shopId))
  })

  router.post('/shares/:id/accept', requireAuth, requireRole(...routeRoles.acceptCoachInvitation), requireVerified, validate({ params: idParamsSchema }), async (req, res) => {
    res.json(await shares.acceptCoachShare(ctx, signedIn(req), id(req)))
  })

  router.delete('/shares/:id', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
    await shares.endShare(ctx, signedIn(req), id(req))
    res.status(204).end()
  })

  return router
}
