import { invert, multiply, normalise, type Mat3, type Pt } from './projective'

// Temporary: the engine's own normalised DLT until shared/geometry's homography lands; then this file goes.

function similarity(points: Pt[]): Mat3 {
  let mx = 0
  let my = 0
  for (const [x, y] of points) {
    mx += x
    my += y
  }
  mx /= points.length
  my /= points.length
  let dist = 0
  for (const [x, y] of points) dist += Math.hypot(x - mx, y - my)
  const s = Math.SQRT2 / (dist / points.length || 1)
  return [s, 0, -s * mx, 0, s, -s * my, 0, 0, 1]
}

function solve(a: number[][], b: number[]): number[] {
  const n = b.length
  for (let c = 0; c < n; c++) {
    let p = c
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r
    ;[a[c], a[p]] = [a[p], a[c]]
    ;[b[c], b[p]] = [b[p], b[c]]
    for (let r = c + 1; r < n; r++) {
      const f = a[r][c] / a[c][c]
      for (let k = c; k < n; k++) a[r][k] -= f * a[c][k]
      b[r] -= f * b[c]
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]
    for (let k = r + 1; k < n; k++) s -= a[r][k] * x[k]
    x[r] = s / a[r][r]
  }
  return x
}

/** Homography src → dst by the normalised DLT (Hartley & Zisserman, algorithm 4.2), with h33 fixed to 1. */
export function fitHomographyDlt(src: Pt[], dst: Pt[]): Mat3 {
  const ts = similarity(src)
  const td = similarity(dst)
  const ata = Array.from({ length: 8 }, () => new Array<number>(8).fill(0))
  const atb = new Array<number>(8).fill(0)
  const addRow = (row: number[], rhs: number) => {
    for (let i = 0; i < 8; i++) {
      atb[i] += row[i] * rhs
      for (let j = 0; j < 8; j++) ata[i][j] += row[i] * row[j]
    }
  }
  for (let i = 0; i < src.length; i++) {
    const [x, y] = [ts[0] * src[i][0] + ts[2], ts[4] * src[i][1] + ts[5]]
    const [u, v] = [td[0] * dst[i][0] + td[2], td[4] * dst[i][1] + td[5]]
    addRow([x, y, 1, 0, 0, 0, -u * x, -u * y], u)
    addRow([0, 0, 0, x, y, 1, -v * x, -v * y], v)
  }
  const h = solve(ata, atb)
  return normalise(multiply(invert(td), multiply([...h, 1], ts)))
}
