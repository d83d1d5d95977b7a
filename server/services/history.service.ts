import type { AppContext } from '../context'
import { Analysis } from '../entities/analysis.entity'
import { BladeBaseline } from '../entities/blade-baseline.entity'
import type { Blade } from '../entities/blade.entity'
import { Sharpening } from '../entities/sharpening.entity'
import { SkatePair } from '../entities/skate-pair.entity'
import { SkaterProfile } from '../entities/skater-profile.entity'
import type { AuthUser } from '../middleware/require-auth'
import { bladeTargets, shopWear } from './target.service'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import type { Baseline, BladeHistory, HistoryRow } from '../../shared/schemas/history'
import { isHockeyGrind } from '../../shared/targets/bands'
import { readAnalysis } from '../../shared/targets/readings'
import type { ResolvedTargets } from '../../shared/targets/resolve'
import { overallStatus, rootRadiusOn, sharpeningsAt } from '../../shared/wear/history'
import { projectWear } from '../../shared/wear/projection'
import { runnerHeightSummary } from '../../shared/wear/runner-height'
import { lowestStation } from '../../shared/geometry/runner-height'
import { WEAR_RULE, assessWear } from '../../shared/wear/state'

type Ctx = Pick<AppContext, 'db'>
export type MeasuredAnalysis = Analysis & { result: AnalysisResult }

/** A blade's measured analyses, oldest first. */
export async function measuredAnalyses(ctx: Ctx, bladeId: string): Promise<MeasuredAnalysis[]> {
  const rows = await ctx.db.getRepository(Analysis).find({ where: { bladeId, status: 'measured' }, order: { queuedAt: 'ASC' } })
  return rows.filter((a): a is MeasuredAnalysis => a.result !== null)
}

/** The blade's baseline (DESIGN.md §6): a marked reference analysis, else the first analysis of a blade registered new. */
export async function baselineOf(ctx: Ctx, blade: Blade, analyses: readonly MeasuredAnalysis[]): Promise<Baseline | null> {
  const marked = await ctx.db.getRepository(BladeBaseline).findOneBy({ bladeId: blade.id })
  if (marked && analyses.some((a) => a.id === marked.analysisId)) {
    return { analysisId: marked.analysisId, kind: 'marked reference', markedBy: marked.markedByName, markedAt: marked.markedAt.toISOString() }
  }
  if (blade.sharpeningsAtRegistration === 0 && analyses.length) {
    return { analysisId: analyses[0].id, kind: 'first analysis', markedBy: null, markedAt: null }
  }
  return null
}

const day = (d: Date) => d.toISOString().slice(0, 10)

function toRow(a: MeasuredAnalysis, blade: Blade, names: { skater: string; pair: string }, sharpenings: Sharpening[],
  targets: ResolvedTargets, baselineId: string | null): HistoryRow {
  const r = a.result
  const readings = readAnalysis(r, targets)
  const heel = readings[1]
  const overall = overallStatus(readings)
  const runner = lowestStation(r.runnerHeights ?? [])
  return {
    analysisId: a.id, takenAt: a.queuedAt.toISOString(), skater: names.skater, pair: names.pair, bladeId: blade.id,
    side: blade.side, sizeIn: blade.sizeIn,
    sharpeningsSoFar: sharpeningsAt({ id: a.id, takenOn: day(a.queuedAt) }, sharpenings, blade.sharpeningsAtRegistration),
    rootRadiusSixteenths: rootRadiusOn(day(a.queuedAt), sharpenings),
    touchPointMm: r.touchPointMm, touchPointPmMm: r.uncertainty.touchPointMm,
    heelLiftMm: heel.value, heelLiftPmMm: heel.plusMinus, heelLiftReadAt: r.heelLiftStationMm !== null ? 'heel station' : 'heel end',
    contactLengthMm: r.contactLengthMm, contactLengthPmMm: r.uncertainty.contactLengthMm,
    toeRadiusMm: r.sectionRadii.toeMm, middleRadiusMm: r.sectionRadii.middleMm, heelRadiusMm: r.sectionRadii.heelMm,
    runnerHeightMm: runner?.heightMm ?? null, runnerHeightPmMm: runner?.plusMinusMm ?? null,
    status: overall.status, statusText: overall.text, baseline: a.id === baselineId, algorithmVersion: a.algorithmVersion,
  }
}

async function namesOf(ctx: Ctx, blade: Blade) {
  const pair = await ctx.db.getRepository(SkatePair).findOneBy({ id: blade.pairId })
  const skater = await ctx.db.getRepository(SkaterProfile).findOneBy({ id: blade.skaterProfileId })
  return { skater: skater?.name ?? '', pair: pair?.label ?? '' }
}

/** One blade's history: rows read against its targets, wear projections for touch point and heel lift, wear state. */
export async function bladeHistory(ctx: Ctx, blade: Blade, user: AuthUser | null) {
  const analyses = await measuredAnalyses(ctx, blade.id)
  const sharpenings = await ctx.db.getRepository(Sharpening).find({ where: { bladeId: blade.id }, order: { sharpenedOn: 'ASC' } })
  const { resolved, shop } = await bladeTargets(ctx, blade, user)
  const wearSettings = await shopWear(ctx, shop?.id ?? null)
  const baseline = await baselineOf(ctx, blade, analyses)
  const names = await namesOf(ctx, blade)
  const rows = analyses.map((a) => toRow(a, blade, names, sharpenings, resolved, baseline?.analysisId ?? null))
  const projections = (['touchPointMm', 'heelLiftMm'] as const).map((metric) => {
    const series = rows.map((r) => ({ sharpenings: r.sharpeningsSoFar, value: metric === 'touchPointMm' ? r.touchPointMm : r.heelLiftMm }))
    return { metric, band: resolved[metric].band, ...projectWear(series, resolved[metric].band) }
  })
  const last = analyses.length ? analyses[analyses.length - 1].result : null
  const latest = last ? readAnalysis(last, resolved).slice(0, 2) : []
  const runner = runnerHeightSummary(analyses.find((a) => a.id === baseline?.analysisId)?.result ?? null, last)
  // Runner height where the photos show the top edge; without it the wear state can say re-profile only.
  const wear = assessWear({
    rockerStatuses: latest.map((r) => r.status), runnerHeightMm: runner.latest?.heightMm ?? null,
    baselineRunnerHeightMm: runner.baseline?.heightMm ?? null, steelRemovedMm: runner.lossStations.map((s) => s.lossMm),
    minRunnerHeightMm: wearSettings.minRunnerHeightMm,
  })
  const history: BladeHistory = {
    bladeId: blade.id, baseline, rows, projections, wear, wearRule: WEAR_RULE,
    runnerHeight: { measured: runner.latest !== null, minMm: wearSettings.minRunnerHeightMm, shop: shop?.name ?? null, ...runner },
    sharpenings: sharpenings.map((s) => ({
      sharpenedOn: s.sharpenedOn,
      sharpeningsSoFar: sharpeningsAt({ id: '', takenOn: s.sharpenedOn }, sharpenings, blade.sharpeningsAtRegistration),
      rootRadiusSixteenths: s.rootRadiusSixteenths,
      hockeyGrind: s.rootRadiusSixteenths !== null && isHockeyGrind(s.rootRadiusSixteenths),
    })),
  }
  return { history, resolved, analyses, names }
}
