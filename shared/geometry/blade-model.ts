import type { BladeFrame, ToeSide } from './frames'
import { bladeFrameFromCard } from './frames'
import { MM_PER_INCH } from './hollow'
import type { Vec2 } from './vec'
import { rotate } from './vec'

/**
 * Synthetic figure-blade bottom edge with known geometry, for tests and synthetic photos. Shapes follow trade
 * descriptions (common practice, no published source): a rocker of circular sections, about 1.5 m near the picks,
 * 2.1–2.4 m in the middle, tighter toward the heel; toe-pick teeth in front; the base pick about 40 mm in front of
 * the touch point; a heel corner that turns up. Dance blades: shorter tail, tighter rocker.
 */
export interface BladeModelOptions {
  sizeIn: number
  toe?: ToeSide
  touchPointMm?: number
  toeRadiusMm?: number
  middleRadiusMm?: number
  heelRadiusMm?: number
  /** Where the heel section starts, mm behind T (the middle section starts at T + 20). */
  heelFromMm?: number
  /** How much shorter than the nominal length the tail ends (dance blades), mm. */
  tailShortMm?: number
  cornerRadiusMm?: number
  stepMm?: number
  /** A straight stretch inserted into the rocker: [from, to] in mm along L. */
  flat?: [number, number]
  /** A sudden change of direction at alongMm (degrees, + turns up). */
  kink?: { alongMm: number; angleDeg: number }
  /** Where along L the blade rests on the table, which sets its tilt in the card frame. */
  standAlongMm?: number
  /** Card-frame height of the table line (mm, y down). */
  tableYMm?: number
}

export interface BladeModel {
  /** Noise-free edge in card mm, ordered toe → heel. */
  edgeMm: Vec2[]
  /** The same edge in the true blade frame (x along L from B, y up). */
  bladeMm: Vec2[]
  frame: BladeFrame
  truth: {
    touchPointMm: number
    heelEnd: Vec2
    heelLiftMm: number
    heelStationAlongMm: number
    /** Lift on the heel circle continued to the station, or null when E reaches the station. */
    heelLiftStationMm: number | null
    rockerStartAlongMm: number
    lengthMm: number
  }
}

const TEETH: Vec2[] = [[-21, 14], [-18, 7], [-15, 8], [-12, 3.6], [-9, 5], [-6, 1.4], [-3, 3], [0, 0]]
const ROCKER_START_MM = 5

function densify(poly: readonly Vec2[], step: number): Vec2[] {
  const out: Vec2[] = []
  for (let i = 0; i + 1 < poly.length; i++) {
    const [a, b] = [poly[i], poly[i + 1]]
    const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / step))
    for (let k = 0; k < n; k++) out.push([a[0] + ((b[0] - a[0]) * k) / n, a[1] + ((b[1] - a[1]) * k) / n])
  }
  return out
}

/** One exact circular-arc step of arc length ds at curvature k (y up; k > 0 turns counter-clockwise). */
function arcStep(p: Vec2, theta: number, k: number, ds: number): [Vec2, number] {
  const t = theta + k * ds
  if (Math.abs(k) < 1e-12) return [[p[0] + Math.cos(theta) * ds, p[1] + Math.sin(theta) * ds], t]
  return [[p[0] + (Math.sin(t) - Math.sin(theta)) / k, p[1] - (Math.cos(t) - Math.cos(theta)) / k], t]
}

export function bladeModel(o: BladeModelOptions): BladeModel {
  const step = o.stepMm ?? 0.1
  const tp = o.touchPointMm ?? 40
  const nominal = o.sizeIn * MM_PER_INCH
  const curvature = curvatureSchedule(o, tp)
  const { front, rocker, end } = integrateRocker(o, tp, curvature, TEETH[0][0] + nominal - (o.tailShortMm ?? 0))
  const { points: heel, heelEnd } = heelCorner(end[0], end[1], o.cornerRadiusMm ?? 4, step)
  const toe = densify([...TEETH, [3, front[0][1] + 5], front[0]], step)
  const bladeMm = [...toe, ...rocker, ...heel]
  const station = nominal - 45
  return {
    ...place(bladeMm, o, tp),
    bladeMm,
    truth: {
      touchPointMm: tp,
      heelEnd,
      heelLiftMm: heelEnd[1],
      heelStationAlongMm: station,
      heelLiftStationMm: heelEnd[0] >= station ? null : continueCircle(end, curvature(end[0][0] - 1), station),
      rockerStartAlongMm: front[0][0],
      lengthMm: Math.max(...bladeMm.map((q) => q[0])) - Math.min(...bladeMm.map((q) => q[0])),
    },
  }
}

/** Curvature (1/mm) at x along L: toe section to T + 20, middle to the heel section, heel after; 0 on a flat. */
function curvatureSchedule(o: BladeModelOptions, tp: number): (x: number) => number {
  const heelFrom = tp + (o.heelFromMm ?? 100)
  return (x) => {
    if (o.flat && x >= o.flat[0] && x < o.flat[1]) return 0
    const r = x < tp + 20 ? (o.toeRadiusMm ?? 1500) : x < heelFrom ? (o.middleRadiusMm ?? 2200) : (o.heelRadiusMm ?? 1900)
    return 1 / r
  }
}

/**
 * Integrates the rocker from T (where it touches L with zero slope) toward the toe until the rocker start, and
 * toward the heel until the heel corner of the given radius would reach rearX. Returns the rocker toe → heel and
 * the point and direction where the corner begins.
 */
function integrateRocker(o: BladeModelOptions, tp: number, curvature: (x: number) => number, rearX: number) {
  const step = o.stepMm ?? 0.1
  const corner = o.cornerRadiusMm ?? 4
  const front: Vec2[] = []
  let p: Vec2 = [tp, 0]
  let theta = 0
  while (p[0] > ROCKER_START_MM) {
    ;[p, theta] = arcStep(p, theta, curvature(p[0]), -step)
    front.push(p)
  }
  front.reverse()
  const rocker: Vec2[] = [...front, [tp, 0]]
  ;[p, theta] = [[tp, 0], 0]
  let kinked = false
  while (p[0] + corner * (1 - Math.sin(theta)) < rearX) {
    ;[p, theta] = arcStep(p, theta, curvature(p[0]), step)
    if (o.kink && !kinked && p[0] >= o.kink.alongMm) {
      theta += (o.kink.angleDeg * Math.PI) / 180
      kinked = true
    }
    rocker.push(p)
  }
  return { front, rocker, end: [p, theta] as [Vec2, number] }
}

/** The heel corner: an arc of the given radius turning up to vertical, with E where it passes 45°, then 4 mm up. */
function heelCorner(start: Vec2, theta0: number, radius: number, step: number): { points: Vec2[]; heelEnd: Vec2 } {
  const points: Vec2[] = []
  let p = start
  let theta = theta0
  let heelEnd: Vec2 = start
  while (theta < Math.PI / 2) {
    const ds = Math.min(step, (Math.PI / 2 - theta) * radius)
    const toE = (Math.PI / 4 - theta) * radius
    if (toE > 0 && toE <= ds) heelEnd = arcStep(p, theta, 1 / radius, toE)[0]
    ;[p, theta] = arcStep(p, theta, 1 / radius, ds)
    points.push(p)
    if (ds < step) break
  }
  for (let y = step; y <= 4; y += step) points.push([p[0], p[1] + y])
  return { points, heelEnd }
}

/** Height at stationX of the circle of curvature k tangent to the edge at (point, direction). */
function continueCircle([p, theta]: [Vec2, number], k: number, stationX: number): number {
  const r = 1 / k
  const c: Vec2 = [p[0] - r * Math.sin(theta), p[1] + r * Math.cos(theta)]
  return c[1] - Math.sqrt(r * r - (stationX - c[0]) ** 2)
}

/** Stands the blade on the table at standAlongMm and maps it into the card frame. */
function place(bladeMm: Vec2[], o: BladeModelOptions, tp: number): { edgeMm: Vec2[]; frame: BladeFrame } {
  const stand = o.standAlongMm ?? tp + 70
  const i = bladeMm.findIndex((q) => q[0] >= stand)
  const tilt = Math.atan2(bladeMm[i + 1][1] - bladeMm[i - 1][1], bladeMm[i + 1][0] - bladeMm[i - 1][0])
  const work = bladeMm.map((q) => rotate(q, -tilt))
  const table = o.tableYMm ?? 180
  const lowY = work[i][1]
  const toCard = (w: Vec2): Vec2 => [o.toe === 'right' ? 330 - w[0] : 30 + w[0], table - (w[1] - lowY)]
  const edgeMm = work.map(toCard)
  return { edgeMm, frame: bladeFrameFromCard(toCard([0, 0]), toCard(rotate([tp, 0], -tilt))) }
}
