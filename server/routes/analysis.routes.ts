import { Router } from 'express'
import { z } from 'zod'
import type { AppContext } from '../context'
import { requireAuth, signedIn } from '../middleware/require-auth'
import { photoUpload } from '../middleware/photo-upload'
import { validate } from '../middleware/validate'
import { findPhoto, getAnalysisDto, toAnalysisDto } from '../services/analysis.service'
import { analysisFor, annotationFor, bladeFor } from '../services/blade-access'
import { createAnnotation, listAnnotations, replyToAnnotation, setResolved } from '../services/annotation.service'
import { moveLandmarks, restoreLandmarks } from '../services/landmark.service'
import { uploadPhoto } from '../services/photo.service'
import { createAnnotationSchema, landmarksBodySchema, replySchema, uploadFieldsSchema } from '../../shared/schemas/analyses'
import { idParamSchema } from '../../shared/schemas/blades'

const bladeParams = z.object({ bladeId: z.uuid() })

/** Photo upload, the analyses it produces, landmark corrections and notes on them. */
export function analysisRoutes(ctx: AppContext): Router {
  const r = Router()
  const id = (req: { params: unknown }) => (req.params as { id: string }).id

  r.post('/blades/:bladeId/photos', requireAuth, validate({ params: bladeParams }), photoUpload, validate({ body: uploadFieldsSchema }), async (req, res) => {
    const user = signedIn(req)
    const blade = await bladeFor(ctx, user, req.params.bladeId as string, 'write')
    const { analysisId } = await uploadPhoto(ctx, { blade, buffer: req.file!.buffer, checkBarMm: req.body.checkBarMm, userId: user.id })
    res.status(202).json({ analysisId })
  })
  r.get('/analyses/:id', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    const { analysis } = await analysisFor(ctx, signedIn(req), id(req), 'read')
    res.json(await getAnalysisDto(ctx, analysis))
  })
  r.get('/analyses/:id/photo', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    const { analysis } = await analysisFor(ctx, signedIn(req), id(req), 'read')
    const photo = await findPhoto(ctx, analysis)
    res.set({ 'Content-Type': photo.contentType, 'Cache-Control': 'private, max-age=3600' })
    res.send(await ctx.storage.getBuffer(photo.storageKey))
  })
  r.put('/analyses/:id/landmarks', requireAuth, validate({ params: idParamSchema, body: landmarksBodySchema }), async (req, res) => {
    const user = signedIn(req)
    // Anyone who may see the blade may correct its landmarks; every move is recorded with their name.
    const { analysis, blade } = await analysisFor(ctx, user, id(req), 'read')
    const updated = await moveLandmarks(ctx, analysis, blade, req.body, user.name)
    res.json(toAnalysisDto(updated, await findPhoto(ctx, analysis)))
  })
  r.delete('/analyses/:id/landmarks', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    const user = signedIn(req)
    const { analysis, blade } = await analysisFor(ctx, user, id(req), 'read')
    const updated = await restoreLandmarks(ctx, analysis, blade, user.name)
    res.json(toAnalysisDto(updated, await findPhoto(ctx, analysis)))
  })

  r.get('/analyses/:id/annotations', requireAuth, validate({ params: idParamSchema }), async (req, res) => {
    const { analysis } = await analysisFor(ctx, signedIn(req), id(req), 'read')
    res.json(await listAnnotations(ctx, analysis.id))
  })
  r.post('/analyses/:id/annotations', requireAuth, validate({ params: idParamSchema, body: createAnnotationSchema }), async (req, res) => {
    const user = signedIn(req)
    const { analysis, blade } = await analysisFor(ctx, user, id(req), 'annotate')
    res.status(201).json(await createAnnotation(ctx, analysis, blade, req.body, user))
  })
  r.post('/annotations/:id/replies', requireAuth, validate({ params: idParamSchema, body: replySchema }), async (req, res) => {
    const user = signedIn(req)
    const { note, blade } = await annotationFor(ctx, user, id(req), 'annotate')
    res.status(201).json(await replyToAnnotation(ctx, note, blade, req.body.text, user))
  })
  r.patch('/annotations/:id', requireAuth, validate({ params: idParamSchema, body: z.object({ resolved: z.boolean() }) }), async (req, res) => {
    const { note } = await annotationFor(ctx, signedIn(req), id(req), 'annotate')
    res.json(await setResolved(ctx, note, req.body.resolved))
  })
  return r
}
