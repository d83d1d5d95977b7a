import { Router } from 'express'
import { z } from 'zod'
import type { AppContext } from '../context'
import { requireAuth, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { assertSkaterAccess } from '../services/access.service'
import { bladeFor } from '../services/blade-access'
import {
  bladeTargets, clearTarget, listLayer, setShopWear, setTarget, shopMembership, shopWear, skaterAuthorRole,
} from '../services/target.service'
import { setShopWearSchema, setTargetSchema, targetMetricSchema } from '../../shared/schemas/targets'
import type { TargetMetric } from '../../shared/targets/bands'

const bladeParams = z.object({ bladeId: z.uuid() })
const bladeMetric = bladeParams.extend({ metric: targetMetricSchema })
const skaterParams = z.object({ skaterId: z.uuid() })
const skaterMetric = skaterParams.extend({ metric: targetMetricSchema })
const shopParams = z.object({ shopId: z.uuid() })
const shopMetric = shopParams.extend({ metric: targetMetricSchema })

/**
 * Target bands: what applies to a blade, and the three layers people set above the platform's defaults. Skaters'
 * and blades' preferences need the annotate right on the skater (the skater or their coach); a shop's defaults
 * need membership of the shop.
 */
export function targetRoutes(ctx: AppContext): Router {
  const r = Router()
  const p = (req: { params: unknown }) => req.params as Record<string, string>

  r.get('/blades/:bladeId/targets', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    const user = signedIn(req)
    res.json((await bladeTargets(ctx, await bladeFor(ctx, user, p(req).bladeId, 'read'), user)).dto)
  })
  r.put('/blades/:bladeId/targets/:metric', requireAuth, validate({ params: bladeMetric, body: setTargetSchema }), async (req, res) => {
    const user = signedIn(req)
    const blade = await bladeFor(ctx, user, p(req).bladeId, 'annotate')
    const role = await skaterAuthorRole(ctx, user, blade.skaterProfileId)
    res.json(await setTarget(ctx, 'blade', blade.id, p(req).metric as TargetMetric, req.body, { id: user.id, name: user.name, role }))
  })
  r.delete('/blades/:bladeId/targets/:metric', requireAuth, validate({ params: bladeMetric }), async (req, res) => {
    const blade = await bladeFor(ctx, signedIn(req), p(req).bladeId, 'annotate')
    await clearTarget(ctx, 'blade', blade.id, p(req).metric as TargetMetric)
    res.status(204).end()
  })

  r.get('/skaters/:skaterId/targets', requireAuth, validate({ params: skaterParams }), async (req, res) => {
    await assertSkaterAccess(ctx, signedIn(req), p(req).skaterId, 'read')
    res.json(await listLayer(ctx, 'skater', p(req).skaterId))
  })
  r.put('/skaters/:skaterId/targets/:metric', requireAuth, validate({ params: skaterMetric, body: setTargetSchema }), async (req, res) => {
    const user = signedIn(req)
    await assertSkaterAccess(ctx, user, p(req).skaterId, 'annotate')
    const role = await skaterAuthorRole(ctx, user, p(req).skaterId)
    res.json(await setTarget(ctx, 'skater', p(req).skaterId, p(req).metric as TargetMetric, req.body, { id: user.id, name: user.name, role }))
  })
  r.delete('/skaters/:skaterId/targets/:metric', requireAuth, validate({ params: skaterMetric }), async (req, res) => {
    await assertSkaterAccess(ctx, signedIn(req), p(req).skaterId, 'annotate')
    await clearTarget(ctx, 'skater', p(req).skaterId, p(req).metric as TargetMetric)
    res.status(204).end()
  })

  r.get('/shops/:shopId/targets', requireAuth, validate({ params: shopParams }), async (req, res) => {
    await shopMembership(ctx, signedIn(req), p(req).shopId)
    res.json(await listLayer(ctx, 'shop', p(req).shopId))
  })
  r.put('/shops/:shopId/targets/:metric', requireAuth, validate({ params: shopMetric, body: setTargetSchema }), async (req, res) => {
    const user = signedIn(req)
    const member = await shopMembership(ctx, user, p(req).shopId)
    const role = member.role === 'admin' ? 'shop admin' : 'technician'
    res.json(await setTarget(ctx, 'shop', p(req).shopId, p(req).metric as TargetMetric, req.body, { id: user.id, name: user.name, role }))
  })
  r.delete('/shops/:shopId/targets/:metric', requireAuth, validate({ params: shopMetric }), async (req, res) => {
    await shopMembership(ctx, signedIn(req), p(req).shopId)
    await clearTarget(ctx, 'shop', p(req).shopId, p(req).metric as TargetMetric)
    res.status(204).end()
  })

  r.get('/shops/:shopId/wear-settings', requireAuth, validate({ params: shopParams }), async (req, res) => {
    await shopMembership(ctx, signedIn(req), p(req).shopId)
    res.json(await shopWear(ctx, p(req).shopId))
  })
  r.put('/shops/:shopId/wear-settings', requireAuth, validate({ params: shopParams, body: setShopWearSchema }), async (req, res) => {
    const user = signedIn(req)
    await shopMembership(ctx, user, p(req).shopId)
    res.json(await setShopWear(ctx, p(req).shopId, req.body.minRunnerHeightMm, user))
  })
  return r
}
