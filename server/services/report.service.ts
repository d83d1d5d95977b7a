import type { AppContext } from '../context'
import type { Blade } from '../entities/blade.entity'
import { ConflictError } from '../errors'
import type { AuthUser } from '../middleware/require-auth'
import { listAnnotations } from './annotation.service'
import { analysisFor, bladeFor } from './blade-access'
import { bladeHistory, type MeasuredAnalysis } from './history.service'
import { ACCENT, INK, heading, keyValues, lineChart, newReport, paragraph, table, type Doc } from './report-pdf'
import { comparableFromResult, compareAnalyses, type MetricChange } from '../../shared/compare/analyses'
import { mmToFeet } from '../../shared/geometry/hollow'
import type { AnalysisResult } from '../../shared/schemas/analysis'
import type { AnnotationDto } from '../../shared/schemas/analyses'
import type { BladeHistory } from '../../shared/schemas/history'
import { formatBand } from '../../shared/targets/bands'
import { describeReading, readAnalysis } from '../../shared/targets/readings'
import { lowestStation } from '../../shared/geometry/runner-height'
import { describeRunnerHeight } from '../../shared/wear/runner-height'
import type { ResolvedTargets } from '../../shared/targets/resolve'

type Ctx = Pick<AppContext, 'db'>

const CAUTIONS = [
  'Keep guards on the toe picks while you set up; hold the boot, never the blade. Keep your fingers off the edge.',
  'Rockerbook advises; it does not replace a qualified technician. Have a blade it flags for replacement, or a loose mount, seen in person before anyone skates on it.',
  'A sharpening removes about 0.05-0.1 mm, near one pixel of a 12 MP photo: single sharpenings may not be resolvable, trends over several are.',
]

const CHANGE_LABEL: Record<MetricChange['metric'], string> = {
  touchPointMm: 'Touch point', heelLiftMm: 'Heel lift', contactLengthMm: 'Contact length',
  toeRadiusMm: 'Toe section radius', middleRadiusMm: 'Middle section radius', heelRadiusMm: 'Heel section radius',
  runnerHeightMm: 'Runner height (stations both show)',
}

const mm = (v: number | null, d = 1) => (v === null ? '-' : `${v.toFixed(d)} mm`)
const date = (iso: string) => iso.slice(0, 10)

function bladeFacts(doc: Doc, blade: Blade, names: { skater: string; pair: string }): void {
  keyValues(doc, [
    ['Skater', names.skater], ['Pair', names.pair],
    ['Blade', `${blade.side}, ${blade.sizeIn} in, ${blade.discipline}${blade.modelLabel ? `, ${blade.modelLabel}` : ''}`],
  ])
}

function changesTable(doc: Doc, changes: MetricChange[]): void {
  table(doc, ['Metric', 'Then', 'Now', 'Change', 'Reading'], changes.map((c) => [
    CHANGE_LABEL[c.metric], mm(c.from), mm(c.to),
    c.change === null ? '-' : `${c.change >= 0 ? '+' : ''}${c.change.toFixed(2)} ± ${c.plusMinus!.toFixed(2)} mm`,
    c.insideNoise === null ? '' : c.insideNoise ? 'inside the noise' : 'a real change',
  ]), [3, 2, 2, 3, 2])
}

function baselineSection(doc: Doc, base: MeasuredAnalysis, current: MeasuredAnalysis): void {
  heading(doc, 'Compared with the baseline')
  paragraph(doc, `Baseline measured ${date(base.queuedAt.toISOString())}; this analysis ${date(current.queuedAt.toISOString())}.`)
  const cmp = compareAnalyses(base.result, current.result)
  changesTable(doc, cmp.changes)
  const removed = cmp.steelRemoved.filter((s) => s.removedMm !== null).map((s): [number, number] => [s.alongMm, s.removedMm!])
  if (removed.length) {
    const values = removed.map((p) => p[1])
    const pms = cmp.steelRemoved.map((st) => st.plusMinusMm).filter((v): v is number => v !== null && Number.isFinite(v))
    const pm = pms.length ? `, each within ± ${Math.min(...pms).toFixed(2)} to ${Math.max(...pms).toFixed(2)} mm` : ''
    paragraph(doc, `Steel removed along the rocker: ${Math.min(...values).toFixed(2)} to ${Math.max(...values).toFixed(2)} mm${pm} (registered on the ${cmp.registration.on.join(' and ')}; RMS ${cmp.registration.rmsMm.toFixed(3)} mm).`)
    lineChart(doc, { series: [{ points: removed, colour: INK, label: 'steel removed, mm, against mm behind the base pick' }], heightPt: 70, yZeroLine: true, caption: 'Steel removed since the baseline.' })
  }
}

function metricsSection(doc: Doc, r: AnalysisResult, resolved: ResolvedTargets): void {
  heading(doc, 'Metrics against targets')
  const readings = readAnalysis(r, resolved)
  table(doc, ['Metric', 'Measured', 'Target', 'Status'], readings.map((m) => [
    m.label + (m.remarks.length ? ` (${m.remarks.join('; ')})` : ''),
    `${m.value.toFixed(m.decimals)} ± ${m.plusMinus.toFixed(m.decimals)} ${m.unit}`, formatBand(m.band, m.unit), m.status,
  ]), [4, 3, 3, 2])
  paragraph(doc, readings.map(describeReading).join('. ') + '.', { muted: true, size: 8 })
  const radius = (v: number | null) => (v === null ? 'straight' : `${v.toFixed(0)} mm (${mmToFeet(v).toFixed(1)} ft)`)
  keyValues(doc, [['Rocker radius, toe', radius(r.sectionRadii.toeMm)], ['Middle', radius(r.sectionRadii.middleMm)], ['Heel', radius(r.sectionRadii.heelMm)]])
  keyValues(doc, [['Runner height', runnerHeightText(r)]])
}

/** The lowest runner height with its station and ±, or why the photo gives none. */
function runnerHeightText(r: AnalysisResult): string {
  const low = lowestStation(r.runnerHeights ?? [])
  if (low) return `${low.heightMm.toFixed(2)} ± ${low.plusMinusMm.toFixed(2)} mm at ${low.alongMm.toFixed(0)} mm behind the base pick (lowest of ${r.runnerHeights!.length} stations where the top edge shows)`
  return r.topEdge === undefined ? 'not measured (analysed before the top edge was traced)' : 'not measured: the runner\u2019s top edge does not show in this photo'
}

function profileSection(doc: Doc, r: AnalysisResult, resolved: ResolvedTargets): void {
  heading(doc, 'Profile')
  const profile = comparableFromResult(r).bladeMm.filter((_, i) => i % 4 === 0)
  const tp = resolved.touchPointMm.band
  lineChart(doc, {
    series: [{ points: profile, colour: INK, label: 'bottom edge, blade frame (x from the base pick toward the heel, y up from the support line)' }],
    // Up to 220 pt: at 5× the picks and heel of our blade model (14 and 17 mm above the support line) fit whole;
    // taller picks lower the exaggeration rather than being cut off, and the caption states the one drawn.
    heightPt: 220, yExaggeration: 5, yZeroLine: true,
    band: tp.min !== null && tp.max !== null ? [tp.min, tp.max] : undefined,
    marks: [{ x: 0, label: 'B' }, { x: r.touchPointMm, label: 'T' }, { x: r.landmarks.heelEnd.alongMm, label: 'E' }],
    caption: 'The shaded stretch is the touch-point target.',
  })
}

function notesSection(doc: Doc, notes: AnnotationDto[]): void {
  heading(doc, 'Notes')
  if (!notes.length) paragraph(doc, 'No notes on this analysis.', { muted: true })
  for (const n of notes) {
    paragraph(doc, `${n.authorName}, ${date(n.createdAt)}${n.alongMm !== null ? `, ${n.alongMm.toFixed(0)} mm behind the base pick` : ''}: ${n.text}${n.resolved ? ' (resolved)' : ''}`)
    for (const reply of n.replies) paragraph(doc, `    ${reply.authorName}: ${reply.text}`, { muted: true })
  }
}

/** The PDF report of one analysis: metrics against targets, profile chart, baseline comparison, notes, cautions. */
export async function analysisReport(ctx: Ctx, user: AuthUser, analysisId: string): Promise<Buffer> {
  const { analysis, blade } = await analysisFor(ctx, user, analysisId, 'read')
  if (analysis.status !== 'measured' || !analysis.result) throw new ConflictError('That analysis has no measurement to report yet.')
  const { history, resolved, analyses } = await bladeHistory(ctx, blade, user)
  const row = history.rows.find((r) => r.analysisId === analysis.id)!
  const r = analysis.result
  const { doc, bytes } = newReport('Rockerbook blade analysis')
  bladeFacts(doc, blade, row)
  keyValues(doc, [['Measured', date(row.takenAt)], ['Sharpenings so far', String(row.sharpeningsSoFar)], ['Analysis', `${analysis.id} (algorithm ${analysis.algorithmVersion ?? '-'})`]])

  metricsSection(doc, r, resolved)
  profileSection(doc, r, resolved)

  const baselineId = history.baseline?.analysisId
  const base = analyses.find((a) => a.id === baselineId)
  if (base && base.id !== analysis.id) baselineSection(doc, base, analysis as MeasuredAnalysis)

  notesSection(doc, await listAnnotations(ctx, analysis.id))
  cautions(doc, r.warnings.map((w) => w.message))
  doc.end()
  return bytes
}

function cautions(doc: Doc, extra: string[]): void {
  heading(doc, 'Cautions')
  for (const line of [...extra, ...CAUTIONS]) paragraph(doc, `- ${line}`)
}

function wearSection(doc: Doc, h: BladeHistory): void {
  heading(doc, 'Wear')
  for (const p of h.projections) {
    const label = p.metric === 'touchPointMm' ? 'Touch point' : 'Heel lift'
    const band = formatBand(p.band, 'mm')
    const text = p.line === null ? 'too few sharpenings measured to project a trend'
      : p.remaining === null ? `trend ${p.line.slope >= 0 ? '+' : ''}${p.line.slope.toFixed(2)} mm per sharpening; it does not leave ${band}`
        : `trend ${p.line.slope >= 0 ? '+' : ''}${p.line.slope.toFixed(2)} mm per sharpening; about ${p.remaining} sharpening${p.remaining === 1 ? '' : 's'} left inside ${band}`
    paragraph(doc, `${label}: ${text}.`)
  }
  doc.moveDown(0.3)
  paragraph(doc, describeRunnerHeight(h.runnerHeight, h.runnerHeight.minMm, h.runnerHeight.shop))
  paragraph(doc, h.wear.state ? `State: ${h.wear.state}. ${h.wear.reasons.join(' ')}` : 'State: no re-profile or replacement indicated.')
  paragraph(doc, `Rule: ${h.wearRule}`, { muted: true, size: 8 })
  const series = h.rows.map((r): [number, number] => [r.sharpeningsSoFar, r.touchPointMm])
  if (series.length > 1) lineChart(doc, { series: [{ points: series, colour: ACCENT, label: 'touch point, mm, against sharpenings so far' }], heightPt: 80, caption: 'Touch point over the blade\u2019s life.' })
}

/** The PDF report of one blade's history: every analysis against targets, wear, comparison with the baseline, cautions. */
export async function bladeReport(ctx: Ctx, user: AuthUser, bladeId: string): Promise<Buffer> {
  const blade = await bladeFor(ctx, user, bladeId, 'read')
  const { history: h, analyses } = await bladeHistory(ctx, blade, user)
  const { doc, bytes } = newReport('Rockerbook blade history')
  bladeFacts(doc, blade, h.rows[0] ?? { skater: '', pair: '' })
  keyValues(doc, [['Baseline', h.baseline ? `${h.baseline.kind}${h.baseline.markedBy ? ` by ${h.baseline.markedBy}` : ''}` : 'none yet']])
  heading(doc, 'Analyses')
  if (!h.rows.length) paragraph(doc, 'No measured analyses yet.', { muted: true })
  else {
    table(doc, ['Date', 'Sharpenings', 'Touch point', 'Heel lift', 'Contact', 'Runner', 'Status'], h.rows.map((r) => [
      date(r.takenAt) + (r.baseline ? ' (baseline)' : ''), String(r.sharpeningsSoFar),
      `${r.touchPointMm.toFixed(1)} ± ${r.touchPointPmMm.toFixed(1)} mm`, `${r.heelLiftMm.toFixed(1)} ± ${r.heelLiftPmMm.toFixed(1)} mm`,
      mm(r.contactLengthMm), r.runnerHeightMm === null ? '-' : `${r.runnerHeightMm.toFixed(1)} ± ${r.runnerHeightPmMm!.toFixed(1)} mm`, r.statusText,
    ]), [2.1, 1.4, 2.2, 2.2, 1.3, 2.2, 2.4])
  }
  if (h.sharpenings.length) {
    heading(doc, 'Sharpenings')
    table(doc, ['Date', 'Sharpenings so far', 'Root radius'], h.sharpenings.map((s) => [
      s.sharpenedOn, String(s.sharpeningsSoFar),
      s.rootRadiusSixteenths === null ? '-' : `${s.rootRadiusSixteenths}/16 in${s.hockeyGrind ? ' (hockey grind)' : ''}`,
    ]), [2, 2, 3])
  }
  wearSection(doc, h)
  const base = analyses.find((a) => a.id === h.baseline?.analysisId)
  const latest = analyses[analyses.length - 1]
  if (base && latest && base.id !== latest.id) baselineSection(doc, base, latest)
  cautions(doc, [])
  doc.end()
  return bytes
}
