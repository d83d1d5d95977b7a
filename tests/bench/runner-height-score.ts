/**
 * Scores the engine's runner height against synthetic photos whose truth comes from their construction: at each
 * station the engine reports, the true height between the true bottom edge and the true top edge (the runner's top
 * line between the plates, and behind the heel plate), both read in the engine's own blade frame. The truth is the
 * blade's own plane; it is carried through the photo and back through the engine's nominal runner plane, which removes
 * the parallax of the unknown 0–5 mm offset (as tests/bench/diagnose.ts does).
 */
import { renderScene, sampleScene, type Resolution, type Scene } from '../../fixtures/synthetic'
import { analyzePhoto } from '../../workers/engine/analyze'
import { bladeFrameFromCard, cardToBlade } from '../../shared/geometry/frames'
import { interpolateY, type Vec2 } from '../../shared/geometry/vec'
import { apply, invert, type Mat3 } from '../../workers/engine/projective'
import { extractEdge } from '../../workers/engine/extract'

export interface RunnerHeightScore {
  seed: number
  resolution: Resolution
  /** Refusal code when the engine declined the photo. */
  refused: string | null
  /** True visible length of the runner's top edge (between the plates and behind the heel plate), mm. */
  trueTopMm: number
  stations: { alongMm: number; measuredMm: number; trueMm: number | null; plusMinusMm: number }[]
}

/** Truth polylines (card mm of the blade's plane) as the engine's runner plane sees them, in the measured blade frame. */
async function seenInBladeFrame(jpeg: Buffer, bladePlaneToImage: number[], lines: Vec2[][], b: Vec2, t: Vec2): Promise<Vec2[][]> {
  const x = await extractEdge(jpeg)
  const back = invert(x.edge.planeHomography)
  const frame = bladeFrameFromCard(b, t)
  return lines.map((line) => line.map((p) => cardToBlade(frame, apply(back, apply(bladePlaneToImage as Mat3, p as [number, number])) as Vec2)))
}

const byX = (pts: Vec2[]) => [...pts].sort((p, q) => p[0] - q[0])

/** Renders one seeded scene (or the given one), analyses it and compares its runner heights with the truth. */
export async function scoreRunnerHeight(seed: number, resolution: Resolution, given?: Scene): Promise<RunnerHeightScore> {
  const scene = given ?? sampleScene(seed, { resolution })
  const photo = await renderScene(scene)
  const m = photo.truth.metrics
  const outcome = await analyzePhoto(photo.jpeg, { sizeIn: m.nominalSizeIn, discipline: m.discipline })
  const top = photo.truth.topEdgeMm
  // The top polyline: toe plate, ramp, runner top [2]–[3], ramp, heel plate, ramp, tail's top [6]–[7].
  const straight = [[top[2], top[3]], [top[6], top[7]]]
  const trueTopMm = straight.reduce((s, [a, b]) => s + Math.abs(b[0] - a[0]), 0)
  if (!outcome.ok) return { seed, resolution, refused: outcome.error.code, trueTopMm, stations: [] }
  const r = outcome.result
  const [bottom, ...tops] = await seenInBladeFrame(
    photo.jpeg, photo.truth.bladePlaneToImage, [photo.truth.bottomEdgeMm, ...straight],
    r.landmarks.basePick.cardMm, r.landmarks.touchPoint.cardMm,
  )
  const rocker = byX(bottom.filter((p) => p[0] >= 0 && p[0] <= r.landmarks.heelEnd.alongMm + 5))
  const stations = (r.runnerHeights ?? []).map((s) => {
    const topY = tops.map((line) => interpolateY(byX(line), s.alongMm)).find((y) => y !== null) ?? null
    const lowY = interpolateY(rocker, s.alongMm)
    return { alongMm: s.alongMm, measuredMm: s.heightMm, trueMm: topY === null || lowY === null ? null : topY - lowY, plusMinusMm: s.plusMinusMm }
  })
  return { seed, resolution, refused: null, trueTopMm, stations }
}
