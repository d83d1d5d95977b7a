/**
 * Engine diagnosis for one synthetic photo: where the traced bottom edge departs from the true one (card mm, per 10 mm
 * along the blade and point by point around the base pick), the metrics the same geometry gives on the true edge, and
 * how far the engine's landmarks lie from the true ones.
 *   npx tsx tests/bench/diagnose.ts SEED [12mp|3mp] [--ideal-lens] [--no-shadow] [--no-noise]
 * The switches take one cause of error out of the photo (lens distortion, the runner's shadow on the card, sensor
 * noise and JPEG loss), to see how much of an error each explains.
 */
import { renderScene, sampleScene, type Resolution, type Scene } from '../../fixtures/synthetic'
import { extractEdge } from '../../workers/engine/extract'
import { measureProfile } from '../../shared/geometry/measure-profile'
import { analyzePhoto } from '../../workers/engine/analyze'
import type { Vec2 } from '../../shared/geometry/vec'
import { apply, invert, type Mat3 } from '../../workers/engine/projective'

/** Signed distance from p to the polyline (positive below it in card y, i.e. outside the steel). */
function signedDistance(p: Vec2, line: Vec2[]): { d: number; i: number } {
  let best = { d: Infinity, i: 0 }
  for (let i = 0; i + 1 < line.length; i++) {
    const [a, b] = [line[i], line[i + 1]]
    const [dx, dy] = [b[0] - a[0], b[1] - a[1]]
    const len2 = dx * dx + dy * dy
    const t = len2 ? Math.min(1, Math.max(0, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2)) : 0
    const q: Vec2 = [a[0] + dx * t, a[1] + dy * t]
    const d = Math.hypot(p[0] - q[0], p[1] - q[1])
    if (d < Math.abs(best.d)) best = { d: p[1] >= q[1] ? d : -d, i }
  }
  return best
}

async function main(): Promise<void> {
  const [seedArg, resolutionArg] = process.argv.slice(2).filter((a) => !a.startsWith('--'))
  const seed = Number(seedArg ?? 1000)
  const resolution = (resolutionArg ?? '12mp') as Resolution
  const scene = withoutCauses(sampleScene(seed, { resolution }), new Set(process.argv.filter((a) => a.startsWith('--'))))
  const photo = await renderScene(scene)
  const truth = photo.truth
  const m = truth.metrics
  console.log(`seed ${seed} ${resolution} toe ${truth.toe} steelLighter ${scene.look.steelLighter} ${m.discipline} ${m.nominalSizeIn} in, offset ${truth.bladePlaneOffsetMm.toFixed(2)} mm`)
  console.log(`truth: TP ${m.touchPointAlongMm.toFixed(2)} HL ${m.heelLiftMm.toFixed(2)} B ${truth.basePickMm.map((v) => v.toFixed(2))} T ${truth.touchPointMm.map((v) => v.toFixed(2))}`)
  const onTruth = measureProfile({
    edgeMm: densify(truth.bottomEdgeMm, 0.25), toe: truth.toe, sizeIn: m.nominalSizeIn, discipline: m.discipline,
    edgeSigmaMm: 0.01, calibrationSigmaMm: 0.01,
  })
  console.log(`geometry on the true edge: TP ${onTruth.touchPointMm.toFixed(2)} HL ${onTruth.heelLiftMm.toFixed(2)}`)
  const x = await extractEdge(photo.jpeg)
  const edge = x.edge.edgeMm
  // The truth as the engine's runner plane sees it: through the true blade plane into the photo and back through the
  // engine's nominal plane, which removes the parallax of the unknown 0–5 mm offset (a shift, not a shape change).
  const back = invert(x.edge.planeHomography)
  const seen = (p: Vec2): Vec2 => apply(back, apply(truth.bladePlaneToImage as Mat3, p as [number, number])) as Vec2
  truth.bottomEdgeMm = truth.bottomEdgeMm.map(seen)
  truth.basePickMm = seen(truth.basePickMm)
  truth.touchPointMm = seen(truth.touchPointMm)
  const dirX = truth.toe === 'left' ? 1 : -1
  const bx = truth.basePickMm[0]
  const tAlong = (truth.touchPointMm[0] - bx) * dirX
  const bins = new Map<number, number[]>()
  for (const p of edge) {
    const along = (p[0] - bx) * dirX
    const key = Math.floor(along / 10) * 10
    const list = bins.get(key) ?? []
    list.push(signedDistance(p, truth.bottomEdgeMm).d)
    bins.set(key, list)
  }
  console.log(`traced ${edge.length} points; error (mm, + = below the true edge) per 10 mm along from true B (T at ${tAlong.toFixed(1)}):`)
  for (const [key, ds] of [...bins.entries()].sort((a, b) => a[0] - b[0])) {
    const s = [...ds].sort((a, b) => a - b)
    console.log(`  ${String(key).padStart(5)}  n ${String(ds.length).padStart(3)}  median ${s[Math.floor(s.length / 2)].toFixed(3)}  min ${s[0].toFixed(3)}  max ${s[s.length - 1].toFixed(3)}`)
  }
  console.log(`seen B ${truth.basePickMm.map((v) => v.toFixed(2))}; traced points within 2.5 mm of true B, relative to it:`)
  for (const p of edge) {
    const d = [(p[0] - truth.basePickMm[0]) * dirX, p[1] - truth.basePickMm[1]]
    if (Math.hypot(d[0], d[1]) < 2.5) process.stdout.write(`(${d[0].toFixed(2)},${d[1].toFixed(2)}:${signedDistance(p, truth.bottomEdgeMm).d.toFixed(2)}) `)
  }
  console.log()
  const outcome = await analyzePhoto(photo.jpeg, { sizeIn: m.nominalSizeIn, discipline: m.discipline })
  if (!outcome.ok) console.log(`refused: ${outcome.error.code} ${outcome.error.message}`)
  else {
    const r = outcome.result
    console.log(`measured: TP ${r.touchPointMm.toFixed(2)} ±${r.uncertainty.touchPointMm.toFixed(2)}  HL ${r.heelLiftMm.toFixed(2)} ±${r.uncertainty.heelLiftMm.toFixed(2)}`)
    const rel = (q: number[], t: number[]) => `(${((q[0] - t[0]) * dirX).toFixed(2)}, ${(q[1] - t[1]).toFixed(2)})`
    console.log(`  B off truth ${rel(r.landmarks.basePick.cardMm, truth.basePickMm)}  T off truth ${rel(r.landmarks.touchPoint.cardMm, truth.touchPointMm)}`)
  }
}

/** The scene with the causes of error named by the switches removed. */
function withoutCauses(scene: Scene, switches: Set<string>): Scene {
  if (switches.has('--ideal-lens')) {
    const c = scene.camera
    Object.assign(c, { k1: 0, k2: 0, cx: (c.width - 1) / 2, cy: (c.height - 1) / 2 })
  }
  if (switches.has('--no-shadow')) scene.look.shadow.strength = 0
  if (switches.has('--no-noise')) Object.assign(scene.look, { noise: { read: 0, shot: 0 }, jpegQuality: 100 })
  return scene
}

function densify(line: Vec2[], step: number): Vec2[] {
  const out: Vec2[] = [line[0]]
  for (let i = 1; i < line.length; i++) {
    const [a, b] = [line[i - 1], line[i]]
    const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / step))
    for (let k = 1; k <= n; k++) out.push([a[0] + ((b[0] - a[0]) * k) / n, a[1] + ((b[1] - a[1]) * k) / n])
  }
  return out
}

main().catch((err) => {
  console.error(err)
  process.exit(1)
})
