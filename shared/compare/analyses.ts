import { compareProfiles, pickTeeth, type ComparableProfile } from '../geometry/comparison'
import { bladeFrameFromCard, cardToBlade } from '../geometry/frames'
import { inverse } from '../geometry/linalg'
import { applySimilarity } from '../geometry/registration'
import { heightLoss } from '../geometry/runner-height'
import type { Vec2 } from '../geometry/vec'
import type { AnalysisResult } from '../schemas/analysis'

/** Half the 40 mm window of the radius profile: its first station sits this far behind the rocker start (mm). */
const RADIUS_HALF_WINDOW_MM = 20

/**
 * The comparable profile of a stored analysis: its edge in its own blade frame (x from B toward the heel, y up),
 * built from the stored card-frame edge and the landmarks B and T, and where its rocker runs.
 */
export function comparableFromResult(r: AnalysisResult): ComparableProfile {
  const frame = bladeFrameFromCard(r.landmarks.basePick.cardMm, r.landmarks.touchPoint.cardMm)
  const bladeMm = r.edge.cardMm.map((p) => cardToBlade(frame, p))
  const first = r.radiusProfile[0]?.alongMm
  const start = first !== undefined ? first - RADIUS_HALF_WINDOW_MM : r.touchPointMm - 30
  return { bladeMm, frame, rockerStartAlongMm: Math.max(1, start), rockerEndAlongMm: r.landmarks.heelEnd.alongMm }
}

export type ComparedMetric =
  | 'touchPointMm' | 'heelLiftMm' | 'contactLengthMm' | 'toeRadiusMm' | 'middleRadiusMm' | 'heelRadiusMm' | 'runnerHeightMm'

/** The change of one metric from the first analysis to the second, mm. */
export interface MetricChange {
  metric: ComparedMetric
  from: number | null
  to: number | null
  change: number | null
  /** ± of the change: the two analyses' ± combined in quadrature, mm. */
  plusMinus: number | null
  /** True when |change| ≤ its ±: the two analyses cannot tell this metric apart. */
  insideNoise: boolean | null
}

function change(metric: ComparedMetric, a: [number | null, number], b: [number | null, number]): MetricChange {
  if (a[0] === null || b[0] === null) return { metric, from: a[0], to: b[0], change: null, plusMinus: null, insideNoise: null }
  const d = b[0] - a[0]
  const pm = Math.hypot(a[1], b[1])
  return { metric, from: a[0], to: b[0], change: d, plusMinus: pm, insideNoise: Math.abs(d) <= pm }
}

/** Heel lift as it is read against its target: at the heel station when there is one (DESIGN.md §4), else at E. */
const heelOf = (r: AnalysisResult): [number, number] =>
  r.heelLiftStationMm !== null
    ? [r.heelLiftStationMm, r.uncertainty.heelLiftStationMm ?? r.uncertainty.heelLiftMm]
    : [r.heelLiftMm, r.uncertainty.heelLiftMm]

/**
 * Runner height of each analysis as the mean over the stations both measured (so the two are read at the same places
 * along the blade), with each station's ±; nulls when they have no station in common.
 */
function commonRunnerHeights(a: AnalysisResult, b: AnalysisResult): [[number | null, number], [number | null, number]] {
  const common = heightLoss(a.runnerHeights ?? [], b.runnerHeights ?? []).map((s) => s.alongMm)
  if (!common.length) return [[null, 0], [null, 0]]
  const mean = (r: AnalysisResult): [number, number] => {
    const at = (r.runnerHeights ?? []).filter((s) => common.includes(s.alongMm))
    // The stations' ± is mostly the edges' systematic error, which averaging over stations does not shrink.
    return [at.reduce((sum, s) => sum + s.heightMm, 0) / at.length, Math.max(...at.map((s) => s.plusMinusMm))]
  }
  return [mean(a), mean(b)]
}

/** Change in each headline metric from analysis a to analysis b, each with its ±. */
export function metricChanges(a: AnalysisResult, b: AnalysisResult): MetricChange[] {
  const radius = (r: AnalysisResult, key: 'toeMm' | 'middleMm' | 'heelMm'): [number | null, number] => {
    const v = r.sectionRadii[key]
    return [v, v === null ? 0 : v * r.uncertainty.radiusRelative]
  }
  return [
    change('touchPointMm', [a.touchPointMm, a.uncertainty.touchPointMm], [b.touchPointMm, b.uncertainty.touchPointMm]),
    change('heelLiftMm', heelOf(a), heelOf(b)),
    change('contactLengthMm', [a.contactLengthMm, a.uncertainty.contactLengthMm], [b.contactLengthMm, b.uncertainty.contactLengthMm]),
    change('toeRadiusMm', radius(a, 'toeMm'), radius(b, 'toeMm')),
    change('middleRadiusMm', radius(a, 'middleMm'), radius(b, 'middleMm')),
    change('heelRadiusMm', radius(a, 'heelMm'), radius(b, 'heelMm')),
    change('runnerHeightMm', ...commonRunnerHeights(a, b)),
  ]
}

/** Keeps about one point per stepMm along x, for charts. */
function thinAlong(points: readonly Vec2[], stepMm: number): Vec2[] {
  const out: Vec2[] = []
  for (const p of points) if (!out.length || Math.abs(p[0] - out[out.length - 1][0]) >= stepMm) out.push(p)
  return out
}

export interface AnalysisComparison {
  /** What the profiles were registered on, and how well they agree there. */
  registration: { on: string[]; rmsMm: number; rotationDeg: number; shiftMm: [number, number] }
  /** Both edges in the first analysis's blade frame (mm, x from B toward the heel, y up), about 1 point per mm. */
  overlay: { first: Vec2[]; second: Vec2[] }
  /**
   * Steel removed from the first to the second, every 10 mm along the rocker (mm, + = removed), with its ± (mm,
   * about 95 %) from the registration's residual on its parts and the two edges' noise; insideNoise when |removed| ≤ ±.
   */
  steelRemoved: { alongMm: number; removedMm: number | null; plusMinusMm: number | null; insideNoise: boolean | null }[]
  changes: MetricChange[]
}

/** The runner's top edge of a stored result as one polyline in card mm (its stretches lie on one line), or none. */
const topEdgeOf = (r: AnalysisResult): Vec2[] | undefined => r.topEdge?.cardMm.flat() as Vec2[] | undefined

/**
 * Compares two analyses (of one blade, or the two blades of a pair: blade frames run toe → heel with y up for
 * either foot, which is the mirroring). Registration is on the toe-pick teeth and, when both results carry it, the
 * runner's top edge (DESIGN §6): with the top edge far behind the picks the rotation is held along the whole blade.
 */
export function compareAnalyses(first: AnalysisResult, second: AnalysisResult): AnalysisComparison {
  const a = comparableFromResult(first)
  const b = comparableFromResult(second)
  const [topA, topB] = [topEdgeOf(first), topEdgeOf(second)]
  const both = !!topA?.length && !!topB?.length
  const cmp = compareProfiles(a, b, both ? { topEdgeBeforeCardMm: topA, topEdgeAfterCardMm: topB } : {})
  const t = cmp.registration.transform
  const parts = both ? [pickTeeth(a), topA!.map((p) => cardToBlade(a.frame, p))] : [pickTeeth(a)]
  const removedPlusMinus = steelRemovedPlusMinus(a, parts, cmp.registration.rmsMm, [first.quality.edgeResidualMm, second.quality.edgeResidualMm])
  return {
    registration: {
      on: both ? ['toe-pick teeth', 'runner top edge'] : ['toe-pick teeth'],
      rmsMm: cmp.registration.rmsMm,
      rotationDeg: (t.rotationRad * 180) / Math.PI,
      shiftMm: [t.tx, t.ty],
    },
    overlay: { first: thinAlong(a.bladeMm, 1), second: thinAlong(b.bladeMm.map((p) => applySimilarity(t, p)), 1) },
    steelRemoved: cmp.steelRemoved.map((st) => {
      const pm = removedPlusMinus(st.alongMm)
      return { ...st, plusMinusMm: st.removedMm === null ? null : pm, insideNoise: st.removedMm === null ? null : Math.abs(st.removedMm) <= pm }
    }),
    changes: metricChanges(first, second),
  }
}

/** Points about spacingMm apart along a polyline, as the registration thins the teeth. */
function spaced(points: readonly Vec2[], spacingMm: number): Vec2[] {
  const out: Vec2[] = []
  for (const p of points) if (!out.length || Math.hypot(p[0] - out[out.length - 1][0], p[1] - out[out.length - 1][1]) >= spacingMm) out.push(p)
  return out
}

/** Coverage factor of the ± (about 95 % for a normal error), as elsewhere in the product. */
const COVERAGE = 2

/**
 * Covariance (per unit residual variance) of the rigid motion [θ, tx, ty] the point-to-line registration fits on
 * its parts (the teeth, and the top edge when used): (JᵀJ)⁻¹ with one row [n·(−dy, dx), nx, ny] per point, n its
 * edge normal, (dx, dy) its offset from the parts' centroid. Vertical tooth faces pin the shift along the blade but
 * say little about the tilt; a top edge far behind them holds the tilt.
 */
function registrationCovariance(parts: readonly (readonly Vec2[])[]): { cov: number[][]; cx: number } | null {
  const all = parts.flat()
  const cx = all.reduce((s, p) => s + p[0], 0) / all.length
  const cy = all.reduce((s, p) => s + p[1], 0) / all.length
  const jtj = [[0, 0, 0], [0, 0, 0], [0, 0, 0]]
  for (const part of parts) {
    for (let i = 1; i + 1 < part.length; i++) {
      const [tx, ty] = [part[i + 1][0] - part[i - 1][0], part[i + 1][1] - part[i - 1][1]]
      const len = Math.hypot(tx, ty) || 1
      const [nx, ny] = [-ty / len, tx / len]
      const [dx, dy] = [part[i][0] - cx, part[i][1] - cy]
      const row = [nx * -dy + ny * dx, nx, ny]
      for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) jtj[a][b] += row[a] * row[b]
    }
  }
  const cov = inverse(jtj)
  return cov ? { cov, cx } : null
}

/**
 * The ± of the steel removed at a station x (mm): the registration's error (its RMS residual on its parts through
 * the covariance above: a small turn θ and shift t move a rocker point at x by θ·(x − cx) + ty) and each edge's own
 * height noise, averaged over the ±1 mm window. A first-order error budget, checked by simulation in the tests.
 */
function steelRemovedPlusMinus(a: ComparableProfile, parts: readonly Vec2[][], rmsMm: number, edgeResidualsMm: [number, number]): (x: number) => number {
  const reg = registrationCovariance(parts.map((part) => spaced(part, 0.5)))
  const spacing = a.bladeMm.length > 1 ? Math.max(1e-3, Math.abs(a.bladeMm[a.bladeMm.length - 1][0] - a.bladeMm[0][0]) / (a.bladeMm.length - 1)) : 1
  const heights = Math.hypot(...edgeResidualsMm) / Math.sqrt(Math.max(1, 2 / spacing))
  return (x) => {
    if (!reg) return Infinity
    const g = [x - reg.cx, 0, 1]
    let v = 0
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += g[i] * reg.cov[i][j] * g[j]
    return COVERAGE * Math.hypot(rmsMm * Math.sqrt(Math.max(0, v)), heights)
  }
}
