import { randomUUID } from 'node:crypto'
import type { AppContext } from '../../server/context'
import { Analysis } from '../../server/entities/analysis.entity'
import { Photo } from '../../server/entities/photo.entity'
import { bladeModel, type BladeModelOptions } from '../../shared/geometry/blade-model'
import { bladeToCard } from '../../shared/geometry/frames'
import { applySimilarity, type Similarity } from '../../shared/geometry/registration'
import type { Vec2 } from '../../shared/geometry/vec'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import { withNoise } from '../unit/geometry/helpers'

export interface ResultOptions {
  model?: BladeModelOptions
  /** Steel ground off the rocker (everything 6 mm or more behind B), mm; the teeth are left alone. */
  removedMm?: number
  /** Where the photo put the blade: a rigid motion of the whole card-frame result. */
  placement?: Similarity
  noiseMm?: number
  seed?: number
  /** Overrides of headline numbers, for history and target tests. */
  touchPointMm?: number
  heelLiftMm?: number
}

/** A complete stored analysis result of a generated blade (shared/geometry's blade model), known by construction. */
export function resultOf(o: ResultOptions = {}): AnalysisResult {
  const m = bladeModel(o.model ?? { sizeIn: 10 })
  const d = o.removedMm ?? 0
  const move = (q: Vec2) => applySimilarity(o.placement ?? { scale: 1, rotationRad: 0, tx: 0, ty: 0 }, bladeToCard(m.frame, q))
  const raised = m.bladeMm.map((q): Vec2 => (q[0] > 6 ? [q[0], q[1] + d] : q))
  const tp = m.truth.touchPointMm
  // After grinding, the support line from B meets the raised rocker √(2Rd) further back (R ≈ 2 m): B does not move.
  const t: Vec2 = [tp + Math.sqrt(2 * 2000 * d), d]
  const landmark = (q: Vec2) => ({ alongMm: q[0], cardMm: move(q) })
  return {
    algorithmVersion: 'test-model',
    touchPointMm: o.touchPointMm ?? t[0], heelLiftMm: o.heelLiftMm ?? m.truth.heelLiftMm - d,
    heelLiftStationMm: null, heelLiftExtrapolated: false, contactLengthMm: 3.5, bladeLengthMm: m.truth.lengthMm,
    uncertainty: { touchPointMm: 1.2, heelLiftMm: 0.3, heelLiftStationMm: null, contactLengthMm: 0.2, radiusRelative: 0.03 },
    radiusProfile: [{ alongMm: m.truth.rockerStartAlongMm + 20, curvaturePerMm: 1 / 1500, radiusMm: 1500 }],
    sectionRadii: { toeMm: 1500, middleMm: 2200, heelMm: 1900 },
    flatSpots: [], kinks: [],
    landmarks: { basePick: landmark([0, 0]), touchPoint: landmark(t), heelEnd: landmark(m.truth.heelEnd) },
    edge: { cardMm: withNoise(raised.map(move), o.noiseMm ?? 0, o.seed ?? 1), homography: [[1, 0, 0], [0, 1, 0], [0, 0, 1]] },
    card: { cardId: 'TEST-CARD', residualMm: 0.02, residualPx: 0.3, checkBarMm: 100 },
    quality: { edgeResidualMm: 0.01, sharpness: 1, coverage: 1 },
    warnings: [], overrides: null,
  }
}

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
