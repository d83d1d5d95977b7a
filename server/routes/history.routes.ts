import { Router, type Response } from 'express'
import { z } from 'zod'
import type { AppContext } from '../context'
import { Blade } from '../entities/blade.entity'
import { requireAuth, signedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { assertSkaterAccess } from '../services/access.service'
import { bladeFor } from '../services/blade-access'
import {
  clearBaseline, compareTwo, comparePair, compareSharpening, compareWithBaseline, markBaseline,
} from '../services/comparison.service'
import { attentionList } from '../services/attention.service'
import { bladeHistory } from '../services/history.service'
import { compareWithReference, listReferences, saveReference } from '../services/reference.service'
import { analysisReport, bladeReport } from '../services/report.service'
import { historyCsv, markBaselineSchema, type HistoryRow } from '../../shared/schemas/history'

const bladeParams = z.object({ bladeId: z.uuid() })
const skaterParams = z.object({ skaterId: z.uuid() })
const idParams = z.object({ id: z.uuid() })
const twoParams = z.object({ id: z.uuid(), otherId: z.uuid() })
const shopParams = z.object({ shopId: z.uuid() })

function sendCsv(res: Response, name: string, rows: HistoryRow[]) {
  res.type('text/csv; charset=utf-8').attachment(`${name}.csv`).send(historyCsv(rows))
}

/** A blade's history and wear, its baseline, CSV and PDF exports, and comparisons of two analyses. */
export function historyRoutes(ctx: AppContext): Router {
  const r = Router()
  const p = (req: { params: unknown }) => req.params as Record<string, string>

  r.get('/attention', requireAuth, async (req, res) => {
    res.json(await attentionList(ctx, signedIn(req)))
  })
  r.get('/blades/:bladeId/history', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    const user = signedIn(req)
    res.json((await bladeHistory(ctx, await bladeFor(ctx, user, p(req).bladeId, 'read'), user)).history)
  })
  r.get('/blades/:bladeId/history.csv', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    const user = signedIn(req)
    const blade = await bladeFor(ctx, user, p(req).bladeId, 'read')
    sendCsv(res, `blade-${blade.side}-${blade.id.slice(0, 8)}`, (await bladeHistory(ctx, blade, user)).history.rows)
  })
  r.get('/skaters/:skaterId/history.csv', requireAuth, validate({ params: skaterParams }), async (req, res) => {
    const user = signedIn(req)
    const skater = await assertSkaterAccess(ctx, user, p(req).skaterId, 'read')
    const blades = await ctx.db.getRepository(Blade).find({ where: { skaterProfileId: skater.id }, order: { createdAt: 'ASC', side: 'ASC' } })
    const rows: HistoryRow[] = []
    for (const blade of blades) rows.push(...(await bladeHistory(ctx, blade, user)).history.rows)
    sendCsv(res, `skater-${skater.id.slice(0, 8)}`, rows.sort((a, b) => a.takenAt.localeCompare(b.takenAt)))
  })

  r.put('/blades/:bladeId/baseline', requireAuth, validate({ params: bladeParams, body: markBaselineSchema }), async (req, res) => {
    res.json(await markBaseline(ctx, signedIn(req), p(req).bladeId, req.body.analysisId))
  })
  r.delete('/blades/:bladeId/baseline', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    await clearBaseline(ctx, signedIn(req), p(req).bladeId)
    res.status(204).end()
  })

  r.get('/blades/:bladeId/compare/baseline', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    res.json(await compareWithBaseline(ctx, signedIn(req), p(req).bladeId))
  })
  r.get('/pairs/:id/compare', requireAuth, validate({ params: idParams }), async (req, res) => {
    res.json(await comparePair(ctx, signedIn(req), p(req).id))
  })
  r.get('/sharpenings/:id/compare', requireAuth, validate({ params: idParams }), async (req, res) => {
    res.json(await compareSharpening(ctx, signedIn(req), p(req).id))
  })
  r.get('/analyses/:id/compare-reference', requireAuth, validate({ params: idParams }), async (req, res) => {
    res.json(await compareWithReference(ctx, signedIn(req), p(req).id))
  })
  r.get('/shops/:shopId/reference-profiles', requireAuth, validate({ params: shopParams }), async (req, res) => {
    res.json(await listReferences(ctx, signedIn(req), p(req).shopId))
  })
  r.post('/shops/:shopId/reference-profiles', requireAuth, validate({ params: shopParams, body: markBaselineSchema }), async (req, res) => {
    res.status(201).json(await saveReference(ctx, signedIn(req), p(req).shopId, req.body.analysisId))
  })
  r.get('/analyses/:id/compare/:otherId', requireAuth, validate({ params: twoParams }), async (req, res) => {
    res.json(await compareTwo(ctx, signedIn(req), p(req).id, p(req).otherId))
  })

  r.get('/analyses/:id/report.pdf', requireAuth, validate({ params: idParams }), async (req, res) => {
    const pdf = await analysisReport(ctx, signedIn(req), p(req).id)
    res.type('application/pdf').attachment(`analysis-${p(req).id.slice(0, 8)}.pdf`).send(pdf)
  })
  r.get('/blades/:bladeId/report.pdf', requireAuth, validate({ params: bladeParams }), async (req, res) => {
    const pdf = await bladeReport(ctx, signedIn(req), p(req).bladeId)
    res.type('application/pdf').attachment(`blade-${p(req).bladeId.slice(0, 8)}.pdf`).send(pdf)
  })
  return r
}
