import type { AppContext } from '../context'
import { Analysis } from '../entities/analysis.entity'
import { BladeBaseline } from '../entities/blade-baseline.entity'
import { Blade } from '../entities/blade.entity'
import { ConflictError, InvalidError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { analysisFor, bladeFor, pairFor, sharpeningFor } from './blade-access'
import { baselineOf, measuredAnalyses, type MeasuredAnalysis } from './history.service'
import { bladeTargets } from './target.service'
import { compareAnalyses } from '../../shared/compare/analyses'
import { readPair } from '../../shared/targets/readings'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import type { ComparisonDto } from '../../shared/schemas/comparison'
import type { Baseline } from '../../shared/schemas/history'

type Ctx = Pick<AppContext, 'db'>

/** What the registration rests on (DESIGN.md §6): the teeth, and the runner's top edge when both photos show it. */
function registrationNote(on: readonly string[]): string {
  return on.includes('runner top edge')
    ? 'Registered on the toe-pick teeth and the runner\u2019s top edge, which sharpening does not touch: the top edge holds the tilt along the blade.'
    : 'Registered on the toe-pick teeth only: the runner\u2019s top edge did not show in both photos, so heights far behind the picks are the least certain.'
}

/** Why a single sharpening may not show (DESIGN.md §6). */
const RESOLUTION_NOTE =
  'A sharpening removes about 0.05\u20130.1 mm, near one pixel of a 12 MP photo: single sharpenings may not be resolvable, trends over several are.'

function measured(a: Analysis): MeasuredAnalysis {
  if (a.status !== 'measured' || !a.result) throw new ConflictError('That analysis has no measurement to compare yet.')
  return a as MeasuredAnalysis
}

/** One side of a comparison: a stored analysis, or a shop's saved reference profile. */
export interface ComparedInput {
  id: string
  result: AnalysisResult
  takenAt: Date
  side: Blade['side']
  bladeId: string
}

const fromAnalysis = ([a, b]: [MeasuredAnalysis, Blade]): ComparedInput =>
  ({ id: a.id, result: a.result, takenAt: a.queuedAt, side: b.side, bladeId: b.id })

function compareInputs(kind: ComparisonDto['kind'], first: ComparedInput, second: ComparedInput, extra: string[] = []): ComparisonDto {
  const info = (x: ComparedInput) => ({ analysisId: x.id, bladeId: x.bladeId, side: x.side, takenAt: x.takenAt.toISOString() })
  const cmp = compareAnalyses(first.result, second.result)
  return { kind, first: info(first), second: info(second), ...cmp, notes: [...extra, registrationNote(cmp.registration.on), RESOLUTION_NOTE] }
}

function build(kind: ComparisonDto['kind'], first: [MeasuredAnalysis, Blade], second: [MeasuredAnalysis, Blade], extra: string[] = []): ComparisonDto {
  return compareInputs(kind, fromAnalysis(first), fromAnalysis(second), extra)
}

/** A reference (or any stored result) against one analysis of a blade, the reference first. */
export function compareTwoResults(kind: ComparisonDto['kind'], first: ComparedInput, analysis: Analysis, blade: Blade, extra: string[] = []): ComparisonDto {
  return compareInputs(kind, first, fromAnalysis([measured(analysis), blade]), extra)
}

/** Any two analyses the caller may read, the first as the reference. */
export async function compareTwo(ctx: Ctx, user: AuthUser, firstId: string, secondId: string): Promise<ComparisonDto> {
  const a = await analysisFor(ctx, user, firstId, 'read')
  const b = await analysisFor(ctx, user, secondId, 'read')
  const mirrored = a.blade.side !== b.blade.side ? ['Left and right blades: each is read in its own blade frame, toe to heel, which mirrors one onto the other.'] : []
  return build('any', [measured(a.analysis), a.blade], [measured(b.analysis), b.blade], mirrored)
}

/** The blade's latest measured analysis against its baseline. */
export async function compareWithBaseline(ctx: Ctx, user: AuthUser, bladeId: string): Promise<ComparisonDto> {
  const blade = await bladeFor(ctx, user, bladeId, 'read')
  const analyses = await measuredAnalyses(ctx, blade.id)
  const baseline = await baselineOf(ctx, blade, analyses)
  if (!baseline) throw new ConflictError('This blade has no baseline yet: it was registered mid-life and no reference analysis is marked.')
  const base = analyses.find((a) => a.id === baseline.analysisId)!
  const latest = analyses[analyses.length - 1]
  if (latest.id === base.id) throw new ConflictError('The baseline is the only measured analysis of this blade so far.')
  return build('baseline', [base, blade], [latest, blade])
}

/** The latest measured analyses of the left and the right blade of a pair, left as the reference. */
export async function comparePair(ctx: Ctx, user: AuthUser, pairId: string): Promise<ComparisonDto> {
  const pair = await pairFor(ctx, user, pairId, 'read')
  const blades = await ctx.db.getRepository(Blade).findBy({ pairId: pair.id })
  const latestOf = async (side: string): Promise<[MeasuredAnalysis, Blade]> => {
    const blade = blades.find((b) => b.side === side)
    const list = blade ? await measuredAnalyses(ctx, blade.id) : []
    if (!blade || !list.length) throw new ConflictError(`The ${side} blade has no measured analysis yet.`)
    return [list[list.length - 1], blade]
  }
  const [left, right] = [await latestOf('left'), await latestOf('right')]
  const dto = build('pair', left, right, [
    'Left and right blades: each is read in its own blade frame, toe to heel, which mirrors one onto the other.',
  ])
  const { resolved } = await bladeTargets(ctx, left[1], user)
  const pairReadings = readPair(left[0].result, right[0].result, resolved).map((r) => ({
    metric: r.metric as 'pairTouchPointDiffMm' | 'pairHeelLiftDiffMm', label: r.label, value: r.value, plusMinus: r.plusMinus, band: r.band, status: r.status,
  }))
  return { ...dto, pairReadings }
}

/** The analyses recorded before and after one sharpening. */
export async function compareSharpening(ctx: Ctx, user: AuthUser, sharpeningId: string): Promise<ComparisonDto> {
  const { sharpening, blade } = await sharpeningFor(ctx, user, sharpeningId, 'read')
  if (!sharpening.analysisBeforeId || !sharpening.analysisAfterId) {
    throw new ConflictError('This sharpening has no analysis recorded both before and after it.')
  }
  const repo = ctx.db.getRepository(Analysis)
  const before = measured((await repo.findOneBy({ id: sharpening.analysisBeforeId }))!)
  const after = measured((await repo.findOneBy({ id: sharpening.analysisAfterId }))!)
  return build('sharpening', [before, blade], [after, blade])
}

/** Marks (or moves) a blade's reference analysis; the analysis must be a measured one of this blade. */
export async function markBaseline(ctx: Ctx, user: AuthUser, bladeId: string, analysisId: string): Promise<Baseline> {
  const blade = await bladeFor(ctx, user, bladeId, 'write')
  const analyses = await measuredAnalyses(ctx, blade.id)
  if (!analyses.some((a) => a.id === analysisId)) {
    throw new InvalidError('analysisId: no measured analysis of this blade has that id', [{ path: 'analysisId', message: 'unknown analysis' }])
  }
  await ctx.db.getRepository(BladeBaseline).save({ bladeId: blade.id, analysisId, markedById: user.id, markedByName: user.name, markedAt: new Date() })
  return (await baselineOf(ctx, blade, analyses))!
}

export async function clearBaseline(ctx: Ctx, user: AuthUser, bladeId: string): Promise<void> {
  const blade = await bladeFor(ctx, user, bladeId, 'write')
  await ctx.db.getRepository(BladeBaseline).delete({ bladeId: blade.id })
}
