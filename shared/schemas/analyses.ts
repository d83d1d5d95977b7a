import { z } from 'zod'
import { analysisResultSchema } from './analysis'

/** Where an analysis is in its life: queued → running → measured, or refused (photo cannot support numbers) / failed. */
export const analysisStatusSchema = z.enum(['queued', 'running', 'measured', 'refused', 'failed'])

export const analysisErrorSchema = z
  .object({ code: z.string(), message: z.string().describe('Plain-language reason and what to do') })
  .describe('Why the photo was refused or the analysis failed')

/** One landmark move or restore, so the page can say who moved what and when. */
export const landmarkChangeSchema = z.object({
  at: z.string(),
  byName: z.string().describe('Display name of the person who made the change'),
  action: z.enum(['moved', 'restored']),
  basePickAlongMm: z.number().nullable().describe('Where B was put, mm along the detected L from the detected B'),
  heelEndAlongMm: z.number().nullable().describe('Where E was put, mm along the detected L from the detected B'),
})

export const photoSchema = z.object({
  id: z.uuid(),
  width: z.number().int().describe('px, after turning by the EXIF orientation'),
  height: z.number().int().describe('px'),
  bytes: z.number().int(),
  uploadedAt: z.string(),
  url: z.string().describe('Short-lived address of the stored photo'),
})

export const analysisSchema = z.object({
  id: z.uuid(),
  bladeId: z.uuid(),
  status: analysisStatusSchema,
  result: analysisResultSchema.nullable(),
  error: analysisErrorSchema.nullable(),
  algorithmVersion: z.string().nullable(),
  checkBarMm: z.number().nullable().describe('Ruler reading of the card check bar used, mm'),
  landmarkChanges: z.array(landmarkChangeSchema),
  photo: photoSchema.nullable(),
  queuedAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  durationMs: z.number().int().nullable().describe('Time the worker spent measuring, ms'),
})

/** Summary row for a blade's history list. */
export const analysisSummarySchema = analysisSchema.pick({ id: true, status: true, queuedAt: true, finishedAt: true, error: true }).extend({
  touchPointMm: z.number().nullable(),
  heelLiftMm: z.number().nullable(),
})

export const landmarksBodySchema = z
  .object({
    basePickAlongMm: z.number().min(-60).max(400).optional(),
    heelEndAlongMm: z.number().min(-60).max(400).optional(),
  })
  .refine((b) => b.basePickAlongMm !== undefined || b.heelEndAlongMm !== undefined, {
    message: 'Move the base pick, the heel end or both',
  })

/** Upload form fields besides the photo file itself. */
export const uploadFieldsSchema = z.object({
  checkBarMm: z.coerce.number().min(80).max(120).optional().describe('Ruler reading of the 100 mm check bar, mm'),
})

export const createAnnotationSchema = z
  .object({
    text: z.string().trim().min(1, 'Write a note').max(4000),
    alongMm: z.number().min(-60).max(400).optional().describe('Position along L from B, mm'),
    photoPoint: z.tuple([z.number(), z.number()]).optional().describe('A point on the photo, px'),
  })
  .refine((a) => a.alongMm !== undefined || a.photoPoint !== undefined, {
    message: 'Pin the note at a position along the blade or on the photo',
  })

export const replySchema = z.object({ text: z.string().trim().min(1, 'Write a reply').max(4000) })

export const annotationSchema = z.object({
  id: z.uuid(),
  analysisId: z.uuid(),
  authorName: z.string(),
  alongMm: z.number().nullable(),
  photoPoint: z.tuple([z.number(), z.number()]).nullable(),
  text: z.string(),
  resolved: z.boolean(),
  createdAt: z.string(),
  replies: z.array(z.object({ id: z.uuid(), authorName: z.string(), text: z.string(), createdAt: z.string() })),
})

export type AnalysisStatus = z.infer<typeof analysisStatusSchema>
export type AnalysisError = z.infer<typeof analysisErrorSchema>
export type LandmarkChange = z.infer<typeof landmarkChangeSchema>
export type AnalysisDto = z.infer<typeof analysisSchema>
export type AnalysisSummaryDto = z.infer<typeof analysisSummarySchema>
export type PhotoDto = z.infer<typeof photoSchema>
export type LandmarksBody = z.infer<typeof landmarksBodySchema>
export type CreateAnnotationBody = z.infer<typeof createAnnotationSchema>
export type AnnotationDto = z.infer<typeof annotationSchema>
