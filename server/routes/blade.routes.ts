import { Router } from 'express'
import { z } from 'zod'
import type { AppContext } from '../context'
import { requireAuth, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { assertSkaterAccess, listAccessibleSkaterIds } from '../services/access.service'
import { listBladeAnalyses } from '../services/analysis.service'
import { bladeFor, pairFor, sharpeningFor } from '../services/blade-access'
import { createPair, deletePair, getPair, listPairs, renamePair, toBladeDto, updateBlade } from '../services/blade.service'
import { removeUnreferenced } from '../services/photo.service'
import { deleteSharpening, listSharpenings, recordSharpening } from '../services/sharpening.service'
import {
  createPairSchema, createSharpeningSchema, idParamSchema, updateBladeSchema, updatePairSchema,
} from '../../shared/schemas/blades'

const skaterParams = z.object({ skaterId: z.uuid() })
const bladeParams = z.object({ bladeId: z.uuid() })

/** Pairs of skates, their blades and the blades' sharpenings. */
export function bladeRoutes(ctx: AppContext): Router {
  const r = Router()

  r.post('/skaters/:skaterId/pairs', requireAuth, validate({ params: skaterParams, body: createPairSchema }), async (req, res) => {
    await assertSkaterAccess(ctx, signedIn(req), req.params.skaterId as string, 'write')
    res.status(201).json(await createPair(ctx, req.params.skaterId as string, req.body))
  })
  r.get('/skaters/:skaterId/pairs', requireAuth, validate({ params: skaterParams }), async (req, res) => {
    await assertSkaterAccess(ctx, signedIn(req), req.params.skaterId as string, 'read')
    res.json(await listPairs(ctx, [req.params.skaterId as string]))
  })
  r.get('/pairs', requireAuth, async (req, res) => {
    res.json(await listPairs(ctx, await listAccessibleSkaterIds(ctx, signedIn(req))))
  })
  r.get('/pairs/:id', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    res.json(await getPair(ctx, await pairFor(ctx, signedIn(req), req.params.id as string, 'read')))
  })
  r.patch('/pairs/:id', requireAuth, validate({ params: idParamSchema, body: updatePairSchema }), async (req, res) => {
    const pair = await pairFor(ctx, signedIn(req), req.params.id as string, 'write')
    res.json(await renamePair(ctx, pair, req.body.label))
  })
  r.delete('/pairs/:id', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    const pair = await pairFor(ctx, signedIn(req), req.params.id as string, 'write')
    await removeUnreferenced(ctx, await deletePair(ctx, pair))
    res.status(204).end()
  })

  r.get('/blades/:bladeId', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    res.json(toBladeDto(await bladeFor(ctx, signedIn(req), req.params.bladeId as string, 'read')))
  })
  r.patch('/blades/:bladeId', requireAuth, validate({ params: bladeParams, body: updateBladeSchema }), async (req, res) => {
    const blade = await bladeFor(ctx, signedIn(req), req.params.bladeId as string, 'write')
    res.json(await updateBlade(ctx, blade, req.body))
  })
  r.get('/blades/:bladeId/analyses', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    const blade = await bladeFor(ctx, signedIn(req), req.params.bladeId as string, 'read')
    res.json(await listBladeAnalyses(ctx, blade.id))
  })
  r.get('/blades/:bladeId/sharpenings', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    const blade = await bladeFor(ctx, signedIn(req), req.params.bladeId as string, 'read')
    res.json(await listSharpenings(ctx, blade.id))
  })
  r.post('/blades/:bladeId/sharpenings', requireAuth, validate({ params: bladeParams, body: createSharpeningSchema }), async (req, res) => {
    const user = signedIn(req)
    const blade = await bladeFor(ctx, user, req.params.bladeId as string, 'write')
    res.status(201).json(await recordSharpening(ctx, blade, req.body, user.id))
  })
  r.delete('/sharpenings/:id', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    const { sharpening } = await sharpeningFor(ctx, signedIn(req), req.params.id as string, 'write')
    await deleteSharpening(ctx, sharpening)
    res.status(204).end()
  })
  return r
}
