import type { AppContext } from '../context'
import type { AuthUser } from '../middleware/require-auth'
import { NotFoundError } from '../errors'
import { assertSkaterAccess } from './access.service'
import { findAnalysis } from './analysis.service'
import { findAnnotation } from './annotation.service'
import { findBlade, findPair } from './blade.service'
import { findSharpening } from './sharpening.service'

type Ctx = Pick<AppContext, 'db'>
export type AccessMode = 'read' | 'write' | 'annotate'

/**
 * Every blade record reaches its caller through here: the row is loaded, then the one access helper decides on its
 * skater. Missing and not-yours both answer 404 with the record's own name, so ids cannot be probed.
 */
async function check(ctx: Ctx, user: AuthUser, skaterProfileId: string, mode: AccessMode, what: string): Promise<void> {
  try {
    await assertSkaterAccess(ctx as AppContext, user, skaterProfileId, mode)
  } catch (error) {
    if (error instanceof NotFoundError) throw new NotFoundError(what)
    throw error
  }
}

/** A 404 about the parent record is reported under the child's own name. */
function renamed(what: string) {
  return (error: unknown): never => {
    throw error instanceof NotFoundError ? new NotFoundError(what) : error
  }
}

export async function bladeFor(ctx: Ctx, user: AuthUser, bladeId: string, mode: AccessMode) {
  const blade = await findBlade(ctx, bladeId)
  await check(ctx, user, blade.skaterProfileId, mode, 'That blade')
  return blade
}

export async function pairFor(ctx: Ctx, user: AuthUser, pairId: string, mode: AccessMode) {
  const pair = await findPair(ctx, pairId)
  await check(ctx, user, pair.skaterProfileId, mode, 'That pair')
  return pair
}

export async function analysisFor(ctx: Ctx, user: AuthUser, analysisId: string, mode: AccessMode) {
  const analysis = await findAnalysis(ctx, analysisId)
  const blade = await findBlade(ctx, analysis.bladeId)
  await check(ctx, user, blade.skaterProfileId, mode, 'That analysis')
  return { analysis, blade }
}

export async function annotationFor(ctx: Ctx, user: AuthUser, annotationId: string, mode: AccessMode) {
  const note = await findAnnotation(ctx, annotationId)
  const { analysis, blade } = await analysisFor(ctx, user, note.analysisId, mode).catch(renamed('That note'))
  return { note, analysis, blade }
}

export async function sharpeningFor(ctx: Ctx, user: AuthUser, sharpeningId: string, mode: AccessMode) {
  const sharpening = await findSharpening(ctx, sharpeningId)
  const blade = await bladeFor(ctx, user, sharpening.bladeId, mode).catch(renamed('That sharpening'))
  return { sharpening, blade }
}
