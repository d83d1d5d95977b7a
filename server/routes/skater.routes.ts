import { Router } from 'express'
import { createSkaterBodySchema, idParamsSchema } from '../../shared/schemas/sharing'
import type { AppContext } from '../context'
import { requireAuth, requireRole, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { assertSkaterAccess } from '../services/access.service'
import { routeRoles } from '../services/policy'
import * as skaters from '../services/skater.service'

/** Skater profiles: created by skater accounts, seen by owners and by the coaches and shops they share with. */
export function skaterRoutes(ctx: AppContext): Router {
  const router = Router()

  router.post('/skaters', requireAuth, requireRole(...routeRoles.createSkater), validate({ body: createSkaterBodySchema }), async (req, res) => {
    const profile = await skaters.createSkater(ctx, signedIn(req), req.body.name)
    res.status(201).json({ id: profile.id })
  })

  router.get('/skaters', requireAuth, async (req, res) => {
    res.json(await skaters.listSkaters(ctx, signedIn(req)))
  })

  router.get('/skaters/:id', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
    const profile = await assertSkaterAccess(ctx, signedIn(req), String(req.params.id), 'read')
    res.json(await skaters.skaterSummary(ctx, signedIn(req), profile))
  })

  router.patch('/skaters/:id', requireAuth, validate({ params: idParamsSchema, body: createSkaterBodySchema }), async (req, res) => {
    const profile = await assertSkaterAccess(ctx, signedIn(req), String(req.params.id), 'manage')
    await skaters.renameSkater(ctx, profile, req.body.name)
    res.json(await skaters.skaterSummary(ctx, signedIn(req), { ...profile, name: req.body.name }))
  })

  router.get('/roster', requireAuth, requireRole(...routeRoles.coachRoster), async (req, res) => {
    res.json(await skaters.listRoster(ctx, signedIn(req)))
  })

  return router
}
