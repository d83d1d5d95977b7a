import { levenbergMarquardt } from 'ml-levenberg-marquardt'
import { solve } from '../../shared/geometry/linalg'
import type { GreyImage } from './image'
import { normalCdf } from './step-model'

type Pt = [number, number]

/**
 * The base pick's tip located by fitting a model of the blurred scene around it, for where the faces' extension
 * (tips.ts) is not enough. The tip's height decides the touch point (T moves by about R·Δh/|BT|, some 50 × Δh), and
 * the traced faces near the tip are pulled off by the blur that rounds it and, as the blade stands, by the card's
 * bottom edge, which often runs right past the tip: a tenth of a millimetre there is several millimetres of touch
 * point. So the scene is modelled as it is built: a wedge of steel (two straight faces meeting at the tip, opening
 * upward), card above the card's bottom edge and table below it, all blurred by a Gaussian; the photo's pixels around
 * the tip decide the tip, the faces' slopes, the blur and the card edge's height. The three brightness levels enter
 * linearly and are solved for at each step (variable projection).
 */

/** Strip pixel coordinates: u right, v down (the card frame's directions). */
export interface TipModelRequest {
  img: GreyImage
  /** First estimate of the tip (strip px) and the slopes du/dv of its two faces (each face runs up from the tip). */
  tip: Pt
  slopes: [number, number]
  /** Blur estimate (Gaussian sigma, strip px). */
  sigma: number
  /** Height of the card's bottom edge (strip v; the table shows below it), or null when it is far away. */
  cardEdgeV: number | null
  /** Radius of the patch fitted around the tip, strip px. */
  radius: number
}

export interface TipModelFit {
  tip: Pt
  slopes: [number, number]
  sigma: number
  /** Steel-to-background contrast the fit found (card or table, whichever is nearer the steel's level), grey levels. */
  contrast: number
}

/** Nodes and weights of the n-point Gauss–Legendre rule on [−1, 1] (Newton's iteration on Pₙ). */
function gaussLegendre(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n)
  const w = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5))
    let dp = 0
    for (let it = 0; it < 100; it++) {
      let p0 = 1
      let p1 = 0
      for (let j = 1; j <= n; j++) {
        const p2 = p1
        p1 = p0
        p0 = ((2 * j - 1) * z * p1 - (j - 1) * p2) / j
      }
      dp = (n * (z * p0 - p1)) / (z * z - 1)
      const dz = p0 / dp
      z -= dz
      if (Math.abs(dz) < 1e-15) break
    }
    x[i] = z
    w[i] = 2 / ((1 - z * z) * dp * dp)
  }
  return { x, w }
}

const RULE = gaussLegendre(12)
const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI)
/** The blur kernel is cut at this many sigmas. */
const TAIL = 5

/**
 * Share of a Gaussian of sigma s centred at (u, v) that falls inside the wedge above the tip and above height vTop
 * (vTop ≤ the tip's v): the wedge's horizontal slice at each height is an interval, so the 2D integral is a 1D
 * integral over height of φ times the slice's blurred width.
 */
export function wedgeShare(u: number, v: number, tip: Pt, slopes: [number, number], s: number, vTop: number): number {
  const zHi = Math.min((vTop - v) / s, TAIL)
  const zLo = -TAIL
  if (zHi <= zLo) return 0
  // Far outside a face (the wedge's slices only widen upward, so checked at the kernel's top) the share is 0; deep
  // inside both faces and well above vTop it is 1.
  const vUp = v - TAIL * s - tip[1]
  const [a0, b0] = [tip[0] + slopes[0] * vUp, tip[0] + slopes[1] * vUp]
  const [lo0, hi0] = a0 < b0 ? [a0, b0] : [b0, a0]
  if (u < lo0 - TAIL * s || u > hi0 + TAIL * s) return 0
  if (zHi >= TAIL) {
    const vDown = v + TAIL * s - tip[1]
    const [a1, b1] = [tip[0] + slopes[0] * vDown, tip[0] + slopes[1] * vDown]
    if (Math.max(lo0, Math.min(a1, b1)) + TAIL * s < u && u < Math.min(hi0, Math.max(a1, b1)) - TAIL * s) return 1
  }
  const half = (zHi - zLo) / 2
  const mid = (zHi + zLo) / 2
  let sum = 0
  for (let k = 0; k < RULE.x.length; k++) {
    const z = mid + half * RULE.x[k]
    const dv = v + s * z - tip[1]
    const a = tip[0] + slopes[0] * dv
    const b = tip[0] + slopes[1] * dv
    const [lo, hi] = a < b ? [a, b] : [b, a]
    const width = normalCdf((hi - u) / s) - normalCdf((lo - u) / s)
    sum += RULE.w[k] * Math.exp(-0.5 * z * z) * width
  }
  return sum * half * INV_SQRT_2PI
}

interface Patch {
  us: Float64Array
  vs: Float64Array
  values: Float64Array
}

function patchAround(img: GreyImage, centre: Pt, radius: number): Patch {
  const us: number[] = []
  const vs: number[] = []
  const values: number[] = []
  const r = Math.ceil(radius)
  const [cu, cv] = [Math.round(centre[0]), Math.round(centre[1])]
  for (let v = cv - r; v <= cv + r; v++) {
    for (let u = cu - r; u <= cu + r; u++) {
      if (u < 0 || v < 0 || u >= img.width || v >= img.height) continue
      if ((u - centre[0]) ** 2 + (v - centre[1]) ** 2 > radius * radius) continue
      us.push(u)
      vs.push(v)
      values.push(img.data[v * img.width + u])
    }
  }
  return { us: Float64Array.from(us), vs: Float64Array.from(vs), values: Float64Array.from(values) }
}

/** The model's basis images for one parameter set: steel share, card share and table share of each pixel. */
function bases(p: Patch, tip: Pt, slopes: [number, number], s: number, cardEdgeV: number | null): Float64Array[] {
  const n = p.us.length
  const steel = new Float64Array(n)
  const card = new Float64Array(n)
  const table = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const [u, v] = [p.us[i], p.vs[i]]
    const w = wedgeShare(u, v, tip, slopes, s, tip[1])
    steel[i] = w
    if (cardEdgeV === null) {
      card[i] = 1 - w
      continue
    }
    // Card shows above its bottom edge wherever the steel does not; the wedge's part above that edge is steel.
    const above = normalCdf((cardEdgeV - v) / s)
    const wedgeAbove = cardEdgeV >= tip[1] ? w : wedgeShare(u, v, tip, slopes, s, cardEdgeV)
    card[i] = above - wedgeAbove
    table[i] = 1 - above - (w - wedgeAbove)
  }
  // The runner's soft shadow on the card, and the light's gradient, tilt the background across the patch.
  const slopeU = new Float64Array(n)
  const slopeV = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    slopeU[i] = card[i] * (p.us[i] - tip[0]) * 0.1
    slopeV[i] = card[i] * (p.vs[i] - tip[1]) * 0.1
  }
  return cardEdgeV === null ? [steel, card, slopeU, slopeV] : [steel, card, table, slopeU, slopeV]
}

/** Whether a basis image has weight in the patch (more than two pixels' worth); one without cannot be fitted. */
function carriesWeight(column: Float64Array): boolean {
  return column.reduce((a, x) => a + Math.abs(x), 0) > 2
}

/** Least-squares levels for the bases; a basis with no weight in the patch keeps level 0. */
function levels(columns: Float64Array[], values: Float64Array): number[] {
  const idx = columns.map((_, k) => k).filter((k) => carriesWeight(columns[k]))
  const ata = idx.map((a) => idx.map((b) => columns[a].reduce((sum, x, i) => sum + x * columns[b][i], 0)))
  const atb = idx.map((a) => columns[a].reduce((sum, x, i) => sum + x * values[i], 0))
  const x = solve(ata, atb)
  const out = columns.map(() => 0)
  if (x) idx.forEach((k, j) => (out[k] = x[j]))
  return out
}

function render(columns: Float64Array[], lv: number[]): Float64Array {
  const out = new Float64Array(columns[0].length)
  for (let k = 0; k < columns.length; k++) for (let i = 0; i < out.length; i++) out[i] += lv[k] * columns[k][i]
  return out
}

/** Fits the model above; null when the patch is too small or the fit diverges. */
export function fitTipModel(r: TipModelRequest): TipModelFit | null {
  const patch = patchAround(r.img, r.tip, r.radius)
  if (patch.us.length < 40) return null
  // The card edge is fitted when it lies within the patch's reach of the blur; otherwise it only adds a flat level.
  const withCard = r.cardEdgeV !== null && Math.abs(r.cardEdgeV - r.tip[1]) < r.radius + 3 * r.sigma
  const unpack = (q: number[]) => ({
    tip: [q[0], q[1]] as Pt, slopes: [q[2], q[3]] as [number, number], s: Math.exp(q[4]), card: withCard ? q[5] : null,
  })
  const model = (q: number[]) => {
    const m = unpack(q)
    const cols = bases(patch, m.tip, m.slopes, m.s, m.card)
    const rendered = render(cols, levels(cols, patch.values))
    return (i: number) => rendered[i]
  }
  const start = [r.tip[0], r.tip[1], r.slopes[0], r.slopes[1], Math.log(r.sigma)]
  if (withCard) start.push(r.cardEdgeV as number)
  const reach = 0.5 * r.radius
  const lm = levenbergMarquardt({ x: Array.from(patch.us, (_, i) => i), y: Array.from(patch.values) }, model, {
    initialValues: start,
    minValues: [start[0] - reach, start[1] - reach, start[2] - 0.5, start[3] - 0.5, Math.log(0.2), ...(withCard ? [start[5] - reach] : [])],
    maxValues: [start[0] + reach, start[1] + reach, start[2] + 0.5, start[3] + 0.5, Math.log(4 * r.sigma + 1), ...(withCard ? [start[5] + reach] : [])],
    gradientDifference: [0.01, 0.01, 0.002, 0.002, 0.01, ...(withCard ? [0.01] : [])],
    damping: 1e-2,
    maxIterations: 10,
    errorTolerance: 0,
  })
  const q = lm.parameterValues
  if (!q.every(Number.isFinite)) return null
  const m = unpack(q)
  const cols = bases(patch, m.tip, m.slopes, m.s, m.card)
  const lv = levels(cols, patch.values)
  // Card, and table when the card's edge is in the model: the levels the steel must stand out from.
  const background = lv.slice(1, m.card === null ? 2 : 3).filter((_, k) => carriesWeight(cols[k + 1]))
  const contrast = Math.min(...background.map((b) => Math.abs(lv[0] - b)))
  return { tip: m.tip, slopes: m.slopes, sigma: m.s, contrast }
}
