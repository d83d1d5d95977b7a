import type { AppContext } from '../context'
import { Analysis } from '../entities/analysis.entity'
import { Photo } from '../entities/photo.entity'
import { NotFoundError } from '../errors'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import type { AnalysisDto, AnalysisSummaryDto } from '../../shared/schemas/analyses'

type Ctx = Pick<AppContext, 'db'>

const iso = (d: Date | null) => (d ? d.toISOString() : null)

export function toAnalysisDto(a: Analysis, photo: Photo | null): AnalysisDto {
  return {
    id: a.id, bladeId: a.bladeId, status: a.status, result: a.result,
    error: a.errorCode ? { code: a.errorCode, message: a.errorMessage ?? '' } : null,
    algorithmVersion: a.algorithmVersion, checkBarMm: a.checkBarMm, landmarkChanges: a.landmarkChanges,
    photo: photo && {
      id: photo.id, width: photo.width, height: photo.height, bytes: photo.bytes,
      uploadedAt: photo.uploadedAt.toISOString(), url: `/api/analyses/${a.id}/photo`,
    },
    queuedAt: a.queuedAt.toISOString(), startedAt: iso(a.startedAt), finishedAt: iso(a.finishedAt),
    durationMs: a.durationMs,
  }
}

/** Loads an analysis without any access check; callers go through `blade-access.ts`. */
export async function findAnalysis(ctx: Ctx, id: string): Promise<Analysis> {
  const analysis = await ctx.db.getRepository(Analysis).findOneBy({ id })
  if (!analysis) throw new NotFoundError('That analysis')
  return analysis
}

export async function getAnalysisDto(ctx: Ctx, analysis: Analysis): Promise<AnalysisDto> {
  const photo = await ctx.db.getRepository(Photo).findOneBy({ id: analysis.photoId })
  return toAnalysisDto(analysis, photo)
}

export async function findPhoto(ctx: Ctx, analysis: Analysis): Promise<Photo> {
  const photo = await ctx.db.getRepository(Photo).findOneBy({ id: analysis.photoId })
  if (!photo) throw new NotFoundError('That photo')
  return photo
}

/** A blade's analyses, newest first, with the two headline numbers for its history table. */
export async function listBladeAnalyses(ctx: Ctx, bladeId: string): Promise<AnalysisSummaryDto[]> {
  const rows = await ctx.db.getRepository(Analysis).find({ where: { bladeId }, order: { queuedAt: 'DESC' } })
  return rows.map((a) => ({
    id: a.id, status: a.status, queuedAt: a.queuedAt.toISOString(), finishedAt: iso(a.finishedAt),
    error: a.errorCode ? { code: a.errorCode, message: a.errorMessage ?? '' } : null,
    touchPointMm: a.result?.touchPointMm ?? null, heelLiftMm: a.result?.heelLiftMm ?? null,
  }))
}

/** What the worker records when it finishes: a measurement, a refusal the person can act on, or a failure. */
export type AnalysisOutcome =
  | { kind: 'measured'; result: AnalysisResult; algorithmVersion: string }
  | { kind: 'refused' | 'failed'; code: string; message: string; algorithmVersion: string }

/**
 * Marks the analysis running unless it already ended for this algorithm version. Returns null when there is
 * nothing to do, so a job that runs twice (a retry after a crash, a duplicate send) changes nothing.
 */
export async function claimAnalysis(ctx: Ctx, id: string, algorithmVersion: string): Promise<Analysis | null> {
  // TypeORM answers an UPDATE on PostgreSQL with [rows, affected count], not the rows alone.
  const [rows]: [{ id: string }[], number] = await ctx.db.query(
    `UPDATE analyses SET status = 'running', started_at = now(), attempts = attempts + 1
      WHERE id = $1 AND (status NOT IN ('measured', 'refused', 'failed') OR algorithm_version IS DISTINCT FROM $2)
      RETURNING id`, [id, algorithmVersion])
  if (!rows.length) return null
  return ctx.db.getRepository(Analysis).findOneBy({ id })
}

/** Writes the outcome and, last, the final status, in one statement. */
export async function recordOutcome(ctx: Ctx, id: string, outcome: AnalysisOutcome, durationMs: number): Promise<void> {
  const measured = outcome.kind === 'measured'
  await ctx.db.query(
    `UPDATE analyses SET result = $2, error_code = $3, error_message = $4, algorithm_version = $5,
        finished_at = now(), duration_ms = $6, overrides = NULL, landmark_changes = '[]'::jsonb, status = $7
      WHERE id = $1`,
    [id, measured ? JSON.stringify(outcome.result) : null, measured ? null : outcome.code,
      measured ? null : outcome.message, outcome.algorithmVersion, Math.round(durationMs), outcome.kind])
}
