import { gaussianPeak, sample } from './image'
import { fitEdgeWithBoundary, fitEdgeWithKnownCard, levelOutsideEdge } from './step-model'
import { median } from './stats'
import type { Strip } from './rectify'

type Pt = [number, number]

/** The lower side of a closed outline: the path between its leftmost and rightmost points that lies lower (larger v). */
export function lowerPath(outline: Pt[]): Pt[] {
  let left = 0
  let right = 0
  for (let i = 1; i < outline.length; i++) {
    if (outline[i][0] < outline[left][0] || (outline[i][0] === outline[left][0] && outline[i][1] > outline[left][1])) left = i
    if (outline[i][0] > outline[right][0] || (outline[i][0] === outline[right][0] && outline[i][1] > outline[right][1])) right = i
  }
  const walk = (from: number, to: number): Pt[] => {
    const out: Pt[] = []
    for (let i = from; ; i = (i + 1) % outline.length) {
      out.push(outline[i])
      if (i === to) break
    }
    return out
  }
  const a = walk(left, right)
  const b = walk(right, left).reverse()
  const meanV = (p: Pt[]) => p.reduce((s, q) => s + q[1], 0) / p.length
  return meanV(a) >= meanV(b) ? a : b
}

/**
 * Trims backward excursions at either end of a lower path: along the blade's bottom, x never falls back by more than
 * `tolPx`, so where the outline first runs along a boot or a plate and then returns, the part before (or after) is
 * not the runner's edge. Points below row `lowV` never start a trim: down there the outline is on the toe picks,
 * whose raked teeth make it step back by a millimetre or more (a generated photo lost its whole toe that way).
 */
export function trimExcursions(path: Pt[], tolPx: number, lowV = Infinity): Pt[] {
  const n = path.length
  let start = 0
  let suffixMin = Infinity
  for (let k = n - 1; k >= 0; k--) {
    if (k < n / 2 && path[k][1] < lowV && path[k][0] > suffixMin + tolPx) {
      start = k + 1
      break
    }
    suffixMin = Math.min(suffixMin, path[k][0])
  }
  let end = n - 1
  let prefixMax = -Infinity
  for (let k = 0; k < n; k++) {
    if (k > n / 2 && path[k][1] < lowV && path[k][0] < prefixMax - tolPx) {
      end = k - 1
      break
    }
    prefixMax = Math.max(prefixMax, path[k][0])
  }
  return path.slice(start, end + 1)
}

/** Resamples a polyline at equal arc-length steps after a moving-average smoothing of `halfWindow` points. */
export function smoothResample(path: Pt[], halfWindow: number, step: number): Pt[] {
  const smooth: Pt[] = path.map((_, i) => {
    let sx = 0
    let sy = 0
    let n = 0
    for (let k = Math.max(0, i - halfWindow); k <= Math.min(path.length - 1, i + halfWindow); k++) {
      sx += path[k][0]
      sy += path[k][1]
      n++
    }
    return [sx / n, sy / n]
  })
  const out: Pt[] = [smooth[0]]
  let carry = 0
  for (let i = 1; i < smooth.length; i++) {
    const [ax, ay] = smooth[i - 1]
    const seg = Math.hypot(smooth[i][0] - ax, smooth[i][1] - ay)
    let s = step - carry
    while (s <= seg) {
      out.push([ax + ((smooth[i][0] - ax) * s) / seg, ay + ((smooth[i][1] - ay) * s) / seg])
      s += step
    }
    carry = seg - (s - step)
  }
  return out
}

export interface EdgeSample {
  /** Sub-pixel edge position, strip px. */
  p: Pt
  /** Peak gradient (grey levels per strip px) and the edge's blur width (Gaussian sigma, strip px). */
  strength: number
  sigma: number
}

/** Drops edge points far softer than the rest: shadow outlines, which blur with their depth, are not the steel. */
export function sharpOnly(samples: EdgeSample[]): EdgeSample[] {
  // A sample whose profile ran off the strip has no blur to read (NaN): it can neither set the typical blur (a NaN
  // would sort anywhere and could make the median NaN, dropping every sample) nor pass the test.
  const typical = median(samples.map((s) => s.sigma).filter(Number.isFinite))
  return samples.filter((s) => s.sigma <= 2 * typical + 0.5)
}

/** Weakest gradient accepted where the table is behind the edge, grey levels per px (about 3 sigma of its noise). */
const TABLE_MIN_GRADIENT = 4

/** Options of the search across the edge: how far into the steel and out of it, px, and the steel's polarity. */
export interface NormalSearch {
  insidePx: number
  outsidePx: number
  darker: boolean
  /** Where the table, not the card, lies behind the edge: the step may have either sign there. */
  tableAt: (u: number, v: number) => boolean
  /** Steel brightness over the card's. */
  steelRatio: number
  /** Expected brightness of blank card at a strip pixel, grey levels. */
  shadeAt: (u: number, v: number) => number
  /** How far below the card's bottom edge a strip point's ray meets the card plane, strip px (negative above it). */
  tableDepthAt?: (u: number, v: number) => number
}

/**
 * Where, walking in from the coarse point at index k0, the steel ends again: the search must not reach across a thin
 * tooth or a narrow gap to the next edge of the same polarity. Skips a shadow first, then spans the steel.
 */
function steelStart(profile: Float64Array, k0: number, mid: number, darker: boolean): number {
  const steel = (v: number) => (darker ? v < mid : v > mid)
  let k = k0
  while (k > 0 && !steel(profile[k])) k--
  while (k > 0 && steel(profile[k - 1])) k--
  return k
}

/** Profile across the edge at one point, averaged over three parallel lines one pixel apart against noise. */
function crossProfile(strip: Strip, p: Pt, n: Pt, from: number, out: Float64Array): void {
  for (let k = 0; k < out.length; k++) {
    const s = from + k
    let sum = 0
    for (const t of [-1, 0, 1]) sum += sample(strip.img, p[0] + n[0] * s - n[1] * t, p[1] + n[1] * s + n[0] * t)
    // Past the strip's border, repeat the last value: a flat tail adds no gradient peak.
    out[k] = Number.isFinite(sum) ? sum / 3 : k > 0 ? out[k - 1] : NaN
  }
}

/**
 * The innermost clear gradient peak of the steel's polarity: a shadow on the card makes a second, softer step of the
 * same polarity farther out, so the first strong peak from the steel side is the steel's edge.
 */
function innermostPeak(grad: Float64Array, polarity: 1 | -1 | 0): { at: number; value: number } | null {
  const signed = (k: number) => (polarity === 0 ? Math.abs(grad[k]) : polarity * grad[k])
  let max = 0
  for (let k = 1; k < grad.length - 1; k++) max = Math.max(max, signed(k))
  if (!(max > 0)) return null
  for (let k = 1; k < grad.length - 1; k++) {
    const g = signed(k)
    if (g >= 0.4 * max && g >= signed(k - 1) && g >= signed(k + 1)) {
      const sign: 1 | -1 = grad[k] >= 0 ? 1 : -1
      const local = gaussianPeak(grad.subarray(k - 1, k + 2), sign)
      return local ? { at: k - 1 + local.at, value: local.value } : { at: k, value: grad[k] }
    }
  }
  return null
}

/** Height of the step around a peak: mean brightness `reach` ± 1 px beyond it minus as far before it (clamped). */
function localStep(profile: Float64Array, at: number, reach: number): number {
  const k = Math.round(at)
  return Math.abs(meanOf(profile, k + reach - 1, k + reach + 1) - meanOf(profile, k - reach - 1, k - reach + 1))
}

/**
 * The edge's blur (Gaussian sigma, px) from its peak gradient and the step's height. The step is read 3 px either side
 * and, for a wider edge, again about 2.5 sigmas out: read 3 px out, a blur of 6 px shows only 40 % of its step and
 * looks like 2 px, so a defocused photo would pass for a sharp one.
 */
export function edgeBlur(profile: Float64Array, at: number, peak: number): number {
  let reach = 3
  let sigma = NaN
  for (let pass = 0; pass < 4; pass++) {
    sigma = localStep(profile, at, reach) / (Math.abs(peak) * Math.sqrt(2 * Math.PI))
    const next = Math.max(3, Math.ceil(2.5 * sigma))
    if (!(next > reach)) break
    reach = next
  }
  return sigma
}

/** Mean of profile[from..to] (indices clamped to the profile), NaN when nothing is left. */
function meanOf(profile: Float64Array, from: number, to: number): number {
  let sum = 0
  let n = 0
  for (let k = Math.max(0, from); k <= Math.min(profile.length - 1, to); k++) {
    sum += profile[k]
    n++
  }
  return n ? sum / n : NaN
}

/** Where along the normal through p (positions from … from + n − 1, px) the card's bottom edge lies; null if not there. */
function boundaryAlong(depthAt: (u: number, v: number) => number, p: Pt, normal: Pt, from: number, n: number): number | null {
  const to = from + n - 1
  const d0 = depthAt(p[0] + normal[0] * from, p[1] + normal[1] * from)
  const d1 = depthAt(p[0] + normal[0] * to, p[1] + normal[1] * to)
  // The depth is an affine function of the card point, so nearly linear along a short normal.
  return d0 < 0 && d1 > 0 ? from + ((to - from) * -d0) / (d1 - d0) : null
}

/** The card's bottom edge this close behind a gradient peak (in blur sigmas, plus px) biases it: fit the model there. */
const BOUNDARY_SIGMAS = 4
const BOUNDARY_MARGIN_PX = 2
/** How far from the gradient peak the model fit searches, px; a fit that moves the edge farther is not trusted. */
const MODEL_REACH_PX = 3
const MODEL_MAX_SHIFT_PX = 1.5

interface NearBoundary {
  index: number
  coarse: Pt
  normal: Pt
  guess: number
  boundary: number
  /** Expected brightness of the steel and of blank card at the point, grey levels. */
  steelLevel: number
  cardLevel: number
}

/**
 * Whether the profile just inside a fitted edge (beyond the blur) looks like steel. Where the runner's shadow darkens
 * the strip of card above the card's bottom edge, the card-to-table step can look like the steel's own edge; the
 * shadowed card there is still far from the steel's brightness.
 */
function steelInside(profile: Float64Array, from: number, e: number, sigma: number, q: NearBoundary): boolean {
  const level = meanOf(profile, Math.floor(e - 2.5 * sigma - 2 - from), Math.ceil(e - 2.5 * sigma - from))
  return Math.abs(level - q.steelLevel) <= STEEL_LEVEL_TOLERANCE * Math.abs(q.cardLevel - q.steelLevel)
}

/** A sample whose gradient peak lies well clear of the card's bottom edge (WIDE_STRIP_PX), with card between. */
interface WideStrip {
  coarse: Pt
  normal: Pt
  guess: number
  cardLevel: number
}

/** Strip widths (px between the gradient peak and the card's bottom edge) at which the card's level beside the steel is read. */
const WIDE_STRIP_PX = [4, 10] as const
/** Fewest wide strips for the reading to be used; beyond MAX_WIDE_STRIPS every k-th is read (under twice as many). */
const MIN_WIDE_STRIPS = 10
const MAX_WIDE_STRIPS = 80
/** How far into the steel the edge is searched once the card's level is known, px. */
const KNOWN_CARD_REACH_IN_PX = 6

/**
 * The card's brightness right beside the steel, as a share of the card's expected brightness there (the shade map),
 * read where the strip of card under the steel is wide enough to show it. The runner's shadow darkens the card most
 * right beside the steel, and a narrow strip holds only that darkest part; the share is one per photo, since the
 * shadow's depth and shape are. Null when too few wide strips are seen.
 */
function cardBesideSteel(strip: Strip, wide: WideStrip[], from: number, n: number, sigma: number): number | null {
  if (wide.length < MIN_WIDE_STRIPS) return null
  const step = Math.max(1, Math.floor(wide.length / MAX_WIDE_STRIPS))
  const profile = new Float64Array(n)
  const shares: number[] = []
  for (let i = 0; i < wide.length; i += step) {
    const w = wide[i]
    crossProfile(strip, w.coarse, w.normal, from, profile)
    const level = levelOutsideEdge(profile, from, w.guess, sigma)
    if (level !== null && w.cardLevel > 0) shares.push(level / w.cardLevel)
  }
  // A shadow only darkens: a reading above the shade map is the map's own error or glare (measured on two 3 MP
  // photos, 1.03–1.04: held at 1 their touch points read 15 mm closer to the truth).
  return shares.length >= MIN_WIDE_STRIPS ? Math.min(1, median(shares)) : null
}

/** How far from the expected steel level the profile inside an edge may lie, as a share of the steel–card contrast. */
const STEEL_LEVEL_TOLERANCE = 0.35

/**
 * Moves the samples whose gradient peak lies just above the card's bottom edge to the edge position the blurred
 * steel–card–table model explains best (step-model.ts), using the blur measured on the samples clear of it. Where
 * the photo shows enough wide strips of card under the steel, the strip's level is taken from them
 * (`cardBesideSteel`) and only the steel and table levels are fitted: a narrow strip shows only its level times its
 * width, so with both free the fit wanders (on 60 generated photos at 12 MP, touch point p95 6.8 → 4.4 mm). Without
 * that reading, the free model is used and a sample whose fit moves it more than a gradient peak's bias can be is
 * dropped rather than kept at either place.
 */
function refitNearBoundary(strip: Strip, out: EdgeSample[], near: NearBoundary[], wide: WideStrip[], from: number, n: number): EdgeSample[] {
  if (!near.length) return out
  const flagged = new Set(near.map((q) => q.index))
  const clear = out.filter((_, i) => !flagged.has(i)).map((q) => q.sigma)
  const sigma = clear.length ? median(clear) : 1
  const profile = new Float64Array(n)
  const dropped = new Set<number>()
  const besideSteel = cardBesideSteel(strip, wide, from, n, sigma)
  for (const q of near) {
    crossProfile(strip, q.coarse, q.normal, from, profile)
    const e = besideSteel !== null
      ? fitEdgeWithKnownCard({ profile, from, boundary: q.boundary, sigma, guess: q.guess, reachIn: KNOWN_CARD_REACH_IN_PX, reachOut: MODEL_REACH_PX, cardLevel: besideSteel * q.cardLevel })
      : fitEdgeWithBoundary({ profile, from, boundary: q.boundary, sigma, guess: q.guess, reach: MODEL_REACH_PX })
    // With the card's level known the fit's own search range bounds the shift; the free model needs the tighter limit.
    const shiftLimit = besideSteel !== null ? Infinity : MODEL_MAX_SHIFT_PX
    if (e === null || Math.abs(e - q.guess) > shiftLimit || !steelInside(profile, from, e, sigma, q)) dropped.add(q.index)
    else out[q.index].p = [q.coarse[0] + q.normal[0] * e, q.coarse[1] + q.normal[1] * e]
  }
  return out.filter((_, i) => !dropped.has(i))
}

/**
 * Refines each point of a coarse edge along its outward normal: samples the strip across the edge, differentiates,
 * and fits a Gaussian to the steel-to-card gradient peak. Points with no clear peak are dropped. Where the card's
 * bottom edge lies just beyond the peak, the point is refitted with a model of both steps.
 */
export function refineAlongNormals(strip: Strip, coarse: Pt[], search: NormalSearch): EdgeSample[] {
  const from = -Math.round(search.insidePx)
  const n = Math.round(search.insidePx) + Math.round(search.outsidePx) + 1
  const profile = new Float64Array(n)
  const grad = new Float64Array(n)
  // Walking outward from the steel, brightness rises if the steel is darker than the card.
  const sign: 1 | -1 = search.darker ? 1 : -1
  const out: EdgeSample[] = []
  const nearBoundary: NearBoundary[] = []
  const wide: WideStrip[] = []
  for (let i = 0; i < coarse.length; i++) {
    const a = coarse[Math.max(0, i - 2)]
    const b = coarse[Math.min(coarse.length - 1, i + 2)]
    const len = Math.hypot(b[0] - a[0], b[1] - a[1])
    if (len === 0) continue
    // The lower path runs left to right with the steel on its upper side, so (−ty, tx) points out of the steel.
    const normal: Pt = [-(b[1] - a[1]) / len, (b[0] - a[0]) / len]
    crossProfile(strip, coarse[i], normal, from, profile)
    for (let k = 1; k < n - 1; k++) grad[k] = (profile[k + 1] - profile[k - 1]) / 2
    grad[0] = 0
    grad[n - 1] = 0
    const onTable = search.tableAt(coarse[i][0] + normal[0] * search.outsidePx, coarse[i][1] + normal[1] * search.outsidePx)
    const shade = search.shadeAt(coarse[i][0], coarse[i][1])
    const step = Math.abs(search.steelRatio - 1) * shade
    const k0 = steelStart(profile, -from, (shade * (1 + search.steelRatio)) / 2, search.darker)
    const peak = innermostPeak(grad.subarray(k0), onTable ? 0 : sign)
    if (peak) peak.at += k0
    // Steel against the table may differ from it by only a few grey levels: accept any clear peak there.
    const floor = onTable ? Math.min(0.08 * step, TABLE_MIN_GRADIENT) : 0.08 * step
    if (!peak || !Number.isFinite(peak.value) || Math.abs(peak.value) < floor) continue
    const s = from + peak.at
    const sigma = edgeBlur(profile, peak.at, peak.value)
    const boundary = search.tableDepthAt ? boundaryAlong(search.tableDepthAt, coarse[i], normal, from, n) : null
    if (boundary !== null && boundary > s - BOUNDARY_MARGIN_PX && boundary < s + BOUNDARY_SIGMAS * Math.max(1, sigma) + BOUNDARY_MARGIN_PX)
      nearBoundary.push({ index: out.length, coarse: coarse[i], normal, guess: s, boundary, steelLevel: shade * search.steelRatio, cardLevel: shade })
    else if (boundary !== null && boundary - s > WIDE_STRIP_PX[0] && boundary - s < WIDE_STRIP_PX[1])
      wide.push({ coarse: coarse[i], normal, guess: s, cardLevel: shade })
    out.push({ p: [coarse[i][0] + normal[0] * s, coarse[i][1] + normal[1] * s], strength: Math.abs(peak.value), sigma })
  }
  return refitNearBoundary(strip, out, nearBoundary, wide, from, n)
}
