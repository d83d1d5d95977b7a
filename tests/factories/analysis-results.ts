import { randomUUID } from 'node:crypto'
import type { AppContext } from '../../server/context'
import { Analysis } from '../../server/entities/analysis.entity'
import { Photo } from '../../server/entities/photo.entity'
import { measuredResult, type ResultOptions } from '../../fixtures/measured-result'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import { withNoise } from '../unit/geometry/helpers'

export type { ResultOptions }

/** A stored analysis result of a generated blade, known by construction (fixtures/measured-result.ts). */
export const resultOf = (o: ResultOptions = {}): AnalysisResult => measuredResult(o, withNoise)

/** Stores a measured analysis (with a placeholder photo row) of a blade, taken at `takenAt`. */
export async function storeMeasured(ctx: AppContext, bladeId: string, result: AnalysisResult, takenAt: Date): Promise<string> {
  const photo = await ctx.db.getRepository(Photo).save({
    bladeId, storageKey: `test/${randomUUID()}`, sha256: randomUUID(), contentType: 'image/jpeg', width: 4000, height: 3000, bytes: 1,
    uploadedById: null, uploadedAt: takenAt,
  })
  const row = await ctx.db.getRepository(Analysis).save({
    bladeId, photoId: photo.id, status: 'measured', result, algorithmVersion: result.algorithmVersion,
    queuedAt: takenAt, startedAt: takenAt, finishedAt: takenAt, durationMs: 1000,
  })
  return row.id
}
