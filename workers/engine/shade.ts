import { sample, type GreyImage } from './image'
import type { Calibration, CardMarkers } from './calibrate'
import { distort } from './camera'
import { apply, type Pt } from './projective'
import { median } from './stats'

/** Expected brightness of blank card at a photo pixel (distorted px), from the card's light fall-off. */
export type CardShade = (u: number, v: number) => number

/** Blank card between neighbouring markers (midpoints of marker centres a column or a row apart), card mm. */
function blankPoints(layout: CardMarkers): Pt[] {
  const centres = layout.markers.map((m) => {
    const c = m.cornersMm
    return [(c[0][0] + c[2][0]) / 2, (c[0][1] + c[2][1]) / 2] as Pt
  })
  const side = Math.hypot(layout.markers[0].cornersMm[1][0] - layout.markers[0].cornersMm[0][0], layout.markers[0].cornersMm[1][1] - layout.markers[0].cornersMm[0][1])
  const out: Pt[] = []
  for (let i = 0; i < centres.length; i++) {
    for (let j = i + 1; j < centres.length; j++) {
      const d = Math.hypot(centres[i][0] - centres[j][0], centres[i][1] - centres[j][1])
      // Neighbours only: a column gap or a row gap, never across the card.
      if (d > 1.1 * side && d < 4 * side) out.push([(centres[i][0] + centres[j][0]) / 2, (centres[i][1] + centres[j][1]) / 2])
    }
  }
  return out
}

function solve4(a: number[][], b: number[]): number[] | null {
  const m = a.map((row, i) => [...row, b[i]])
  for (let c = 0; c < 4; c++) {
    let p = c
    for (let r = c + 1; r < 4; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r
    ;[m[c], m[p]] = [m[p], m[c]]
    if (Math.abs(m[c][c]) < 1e-12) return null
    for (let r = 0; r < 4; r++) {
      if (r === c) continue
      const f = m[r][c] / m[c][c]
      for (let k = c; k < 5; k++) m[r][k] -= f * m[c][k]
    }
  }
  return m.map((row, i) => row[4] / m[i][i])
}

/**
 * Fits the card's shading over the photo from blank card between the markers: a + b·x + c·y + d·(x² + y²) on
 * coordinates centred and scaled by the photo size — a linear light gradient and a lens vignette.
 */
export function fitCardShade(img: GreyImage, cal: Calibration, layout: CardMarkers): CardShade {
  const pts = blankPoints(layout).map((p) => distort(cal.distortion, apply(cal.homography, p)))
  const samples: { x: number; y: number; level: number }[] = []
  for (const [u, v] of pts) {
    const around: number[] = []
    for (let dy = -3; dy <= 3; dy++) for (let dx = -3; dx <= 3; dx++) around.push(sample(img, u + 2 * dx, v + 2 * dy))
    const level = median(around.filter(Number.isFinite))
    if (Number.isFinite(level)) samples.push({ x: u / img.width - 0.5, y: v / img.height - 0.5, level })
  }
  const flat = median(samples.map((s) => s.level))
  const constant: CardShade = () => flat
  if (samples.length < 8) return constant
  const ata = [0, 1, 2, 3].map(() => [0, 0, 0, 0])
  const atb = [0, 0, 0, 0]
  for (const s of samples) {
    const row = [1, s.x, s.y, s.x * s.x + s.y * s.y]
    for (let i = 0; i < 4; i++) {
      atb[i] += row[i] * s.level
      for (let j = 0; j < 4; j++) ata[i][j] += row[i] * row[j]
    }
  }
  const c = solve4(ata, atb)
  if (!c) return constant
  return (u, v) => {
    const x = u / img.width - 0.5
    const y = v / img.height - 0.5
    return Math.max(1, c[0] + c[1] * x + c[2] * y + c[3] * (x * x + y * y))
  }
}
