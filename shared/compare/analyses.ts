import { compareProfiles, type ComparableProfile } from '../geometry/comparison'
import { bladeFrameFromCard, cardToBlade } from '../geometry/frames'
import { applySimilarity } from '../geometry/registration'
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

export type ComparedMetric = 'touchPointMm' | 'heelLiftMm' | 'contactLengthMm' | 'toeRadiusMm' | 'middleRadiusMm' | 'heelRadiusMm'

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
  /** Steel removed from the first to the second, every 10 mm along the rocker (mm, + = removed). */
  steelRemoved: { alongMm: number; removedMm: number | null }[]
  changes: MetricChange[]
}

/**
 * Compares two analyses (of one blade, or the two blades of a pair: blade frames run toe → heel with y up for
 * either foot, which is the mirroring). Registration is on the toe-pick teeth; the stored result has no runner top
 * edge yet, so only the teeth hold the rotation and heights far behind them are the least certain.
 */
export function compareAnalyses(first: AnalysisResult, second: AnalysisResult): AnalysisComparison {
  const a = comparableFromResult(first)
  const b = comparableFromResult(second)
  const cmp = compareProfiles(a, b)
  const t = cmp.registration.transform
  return {
    registration: {
      on: ['toe-pick teeth'],
      rmsMm: cmp.registration.rmsMm,
      rotationDeg: (t.rotationRad * 180) / Math.PI,
      shiftMm: [t.tx, t.ty],
    },
    overlay: { first: thinAlong(a.bladeMm, 1), second: thinAlong(b.bladeMm.map((p) => applySimilarity(t, p)), 1) },
    steelRemoved: cmp.steelRemoved,
    changes: metricChanges(first, second),
  }
}
