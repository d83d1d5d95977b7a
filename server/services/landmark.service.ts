import type { AppContext } from '../context'
import { Analysis } from '../entities/analysis.entity'
import type { Blade } from '../entities/blade.entity'
import { ConflictError } from '../errors'
import type { Overrides } from '../../shared/schemas/analysis'
import type { LandmarkChange, LandmarksBody } from '../../shared/schemas/analyses'
import { recomputeFromEdge } from '../../shared/geometry/stored-result'

type Ctx = Pick<AppContext, 'db'>

function measuredOnly(analysis: Analysis) {
  if (analysis.status !== 'measured' || !analysis.result) {
    throw new ConflictError('Landmarks can be moved only on a measured photo.', 'NOT_MEASURED')
  }
  return analysis.result
}

async function save(ctx: Ctx, analysis: Analysis, blade: Blade, overrides: Overrides | null, change: LandmarkChange) {
  const result = recomputeFromEdge(measuredOnly(analysis), overrides, { sizeIn: blade.sizeIn, discipline: blade.discipline })
  const landmarkChanges = [...analysis.landmarkChanges, change]
  await ctx.db.getRepository(Analysis).update({ id: analysis.id }, { result, overrides, landmarkChanges })
  return { ...analysis, result, overrides, landmarkChanges } as Analysis
}

/**
 * Moves the base pick and/or the heel end to where a person put them and recomputes every metric from the stored
 * edge. Positions are along the detected support line from the detected base pick, so moves accumulate sensibly.
 */
export async function moveLandmarks(ctx: Ctx, analysis: Analysis, blade: Blade, body: LandmarksBody, byName: string) {
  measuredOnly(analysis)
  const overrides: Overrides = { ...(analysis.overrides ?? {}) }
  if (body.basePickAlongMm !== undefined) overrides.basePickAlongMm = body.basePickAlongMm
  if (body.heelEndAlongMm !== undefined) overrides.heelEndAlongMm = body.heelEndAlongMm
  return save(ctx, analysis, blade, overrides, {
    at: new Date().toISOString(), byName, action: 'moved',
    basePickAlongMm: body.basePickAlongMm ?? null, heelEndAlongMm: body.heelEndAlongMm ?? null,
  })
}

/** Puts the detected landmarks back; the record of earlier moves stays. */
export async function restoreLandmarks(ctx: Ctx, analysis: Analysis, blade: Blade, byName: string) {
  return save(ctx, analysis, blade, null, {
    at: new Date().toISOString(), byName, action: 'restored', basePickAlongMm: null, heelEndAlongMm: null,
  })
}
