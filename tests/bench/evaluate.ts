/**
 * Scores the engine against synthetic photos whose truth comes from their construction (fixtures/synthetic): the
 * errors of each metric, and whether the reported ± covers the truth. Shared by the accuracy bench and unit tests.
 */
import { renderScene, sampleScene, type Refusal, type Resolution, type Scene } from '../../fixtures/synthetic'
import { buildBlade } from '../../fixtures/synthetic/blade'
import { buildRocker } from '../../fixtures/synthetic/rocker'
import { placeCamera } from '../../fixtures/synthetic/scene-camera'
import { Rng } from '../../fixtures/synthetic/rng'
import { cardLayout } from '../../shared/card/layout'
import { analyzePhoto } from '../../workers/engine/analyze'
import type { AnalysisResult } from '../../shared/schemas/analysis'

export interface PhotoScore {
  seed: number
  resolution: Resolution
  toe: 'left' | 'right'
  steelLighter: boolean
  discipline: string
  /** Refusal code when the engine declined a photo it should have measured. */
  refused: string | null
  touchErrMm: number
  touchPlusMinusMm: number
  heelErrMm: number
  heelPlusMinusMm: number
  /** Heel-station lift error where the truth is extrapolated (dance blades), else null. */
  stationErrMm: number | null
  stationPlusMinusMm: number | null
  /** Relative radius errors of the 40 mm windows lying wholly inside one true section. */
  radiusRelErrs: number[]
  sectionRelErrs: number[]
  analyseMs: number
  /** Metric values, for repeatability. */
  values: { touch: number; heel: number; middle: number | null }
}

const SECTION_KEYS = [['toeMm', 'toe'], ['middleMm', 'middle'], ['heelMm', 'heel']] as const

/** True radius of each section and where each section runs, blade-frame mm along L from B. */
function trueSections(scene: Scene, heelEndX: number): { from: number; to: number; r: number }[] {
  const rocker = buildRocker({
    touchMm: scene.blade.rocker.touchMm, toeRadiusMm: scene.blade.rocker.toeRadiusMm,
    middleRadiusMm: scene.blade.rocker.middleRadiusMm, heelRadiusMm: scene.blade.rocker.heelRadiusMm,
  })
  const [b1, b2] = rocker.breaksMm
  return [
    { from: -Infinity, to: b1, r: rocker.arcs[0].r },
    { from: b1, to: b2, r: rocker.arcs[1].r },
    { from: b2, to: heelEndX, r: rocker.arcs[2].r },
  ]
}

function radiusErrors(result: AnalysisResult, sections: { from: number; to: number; r: number }[], rockerStart: number): number[] {
  const errs: number[] = []
  for (const st of result.radiusProfile) {
    const [a, b] = [st.alongMm - 20, st.alongMm + 20]
    const sec = sections.find((s) => a >= Math.max(s.from, rockerStart) && b <= s.to)
    if (!sec) continue
    const r = st.radiusMm ?? Infinity
    errs.push(Math.abs(r - sec.r) / sec.r)
  }
  return errs
}

/** Renders one seeded scene (or the given one), analyses it and scores it against its truth. */
export async function scorePhoto(seed: number, resolution: Resolution, given?: Scene): Promise<PhotoScore> {
  const scene = given ?? sampleScene(seed, { resolution })
  const photo = await renderScene(scene)
  const m = photo.truth.metrics
  const started = Date.now()
  const outcome = await analyzePhoto(photo.jpeg, { sizeIn: m.nominalSizeIn, discipline: m.discipline })
  const analyseMs = Date.now() - started
  const base = {
    seed, resolution, toe: photo.truth.toe, steelLighter: scene.look.steelLighter, discipline: m.discipline, analyseMs,
  }
  if (!outcome.ok) {
    return {
      ...base, refused: outcome.error.code, touchErrMm: NaN, touchPlusMinusMm: NaN, heelErrMm: NaN, heelPlusMinusMm: NaN,
      stationErrMm: null, stationPlusMinusMm: null, radiusRelErrs: [], sectionRelErrs: [],
      values: { touch: NaN, heel: NaN, middle: null },
    }
  }
  const r = outcome.result
  const sections = trueSections(scene, m.heelEnd[0])
  const sectionRelErrs = SECTION_KEYS.flatMap(([key], i) => {
    const got = r.sectionRadii[key]
    return got === null ? [] : [Math.abs(got - sections[i].r) / sections[i].r]
  })
  const extrapolated = m.heelStation.extrapolated
  return {
    ...base, refused: null,
    touchErrMm: r.touchPointMm - m.touchPointAlongMm, touchPlusMinusMm: r.uncertainty.touchPointMm,
    heelErrMm: r.heelLiftMm - m.heelLiftMm, heelPlusMinusMm: r.uncertainty.heelLiftMm,
    stationErrMm: extrapolated && r.heelLiftStationMm !== null ? r.heelLiftStationMm - m.heelStation.liftMm : null,
    stationPlusMinusMm: extrapolated ? r.uncertainty.heelLiftStationMm : null,
    radiusRelErrs: radiusErrors(r, sections, m.touchPointAlongMm - 30),
    sectionRelErrs,
    values: { touch: r.touchPointMm, heel: r.heelLiftMm, middle: r.sectionRadii.middleMm },
  }
}

/** Renders a photo the engine must refuse and returns the code it gave (or 'MEASURED'). */
export async function refusalCode(seed: number, refusal: Refusal, resolution: Resolution = '3mp'): Promise<string> {
  const scene = sampleScene(seed, { resolution, refusal })
  const photo = await renderScene(scene)
  const m = photo.truth.metrics
  const outcome = await analyzePhoto(photo.jpeg, { sizeIn: m.nominalSizeIn, discipline: m.discipline })
  return outcome.ok ? 'MEASURED' : outcome.error.code
}

export const EXPECTED_REFUSAL: Record<Exclude<Refusal, 'none'>, string> = {
  'no-card': 'CARD_NOT_FOUND',
  'no-blade': 'BLADE_NOT_FOUND',
  'blade-cut-off': 'BLADE_CUT_OFF',
  'strong-blur': 'TOO_BLURRY',
  'plain-surface': 'BLADE_NOT_FOUND',
}

/** The same blade, card and placement photographed from `count` camera poses (seeded), for repeatability. */
export function posesOfOneBlade(seed: number, count: number, resolution: Resolution): Scene[] {
  const first = sampleScene(seed, { resolution })
  const layout = cardLayout(first.paper)
  const blade = buildBlade(first.blade)
  return Array.from({ length: count }, (_, k) => {
    if (k === 0) return first
    const other = sampleScene(seed + 7919 * k, { resolution, paper: first.paper })
    const camera = placeCamera(new Rng(seed * 31 + k), {
      layout, blade, placement: first.placement, resolution, refusal: 'none', frontal: false,
    })
    return { ...first, camera, look: { ...other.look, steelGrey: first.look.steelGrey, cardWhite: first.look.cardWhite, steelLighter: first.look.steelLighter } }
  })
}

export function quantile(values: number[], q: number): number {
  const s = values.filter(Number.isFinite).sort((a, b) => a - b)
  if (!s.length) return NaN
  return s[Math.min(s.length - 1, Math.floor(q * (s.length - 1) + 0.5))]
}
