/** Small dense linear algebra on number[][] (row-major); sizes here are at most 9×9. */
export type Matrix = number[][]

export function zeros(rows: number, cols: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(cols).fill(0))
}

export function matMul(a: Matrix, b: Matrix): Matrix {
  const out = zeros(a.length, b[0].length)
  for (let i = 0; i < a.length; i++)
    for (let k = 0; k < b.length; k++) {
      const aik = a[i][k]
      for (let j = 0; j < b[0].length; j++) out[i][j] += aik * b[k][j]
    }
  return out
}

export const transpose = (a: Matrix): Matrix => a[0].map((_, j) => a.map((row) => row[j]))

/**
 * Solves A x = b by Gaussian elimination with partial pivoting.
 * Returns null when A is singular to working precision, so callers can treat a degenerate geometry explicitly.
 */
export function solve(a: Matrix, b: number[]): number[] | null {
  const n = b.length
  const m = a.map((row, i) => [...row, b[i]])
  const scaleRef = Math.max(...a.flat().map(Math.abs), Number.MIN_VALUE)
  for (let col = 0; col < n; col++) {
    let piv = col
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[piv][col])) piv = r
    if (Math.abs(m[piv][col]) <= 1e-14 * scaleRef) return null
    ;[m[col], m[piv]] = [m[piv], m[col]]
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col]
      for (let c = col; c <= n; c++) m[r][c] -= f * m[col][c]
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n]
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c]
    x[r] = s / m[r][r]
  }
  return x
}

/** Inverse of a square matrix, or null when singular. */
export function inverse(a: Matrix): Matrix | null {
  const n = a.length
  const cols: number[][] = []
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0)
    e[j] = 1
    const x = solve(a, e)
    if (!x) return null
    cols.push(x)
  }
  return transpose(cols)
}

/**
 * Eigen-decomposition of a symmetric matrix by cyclic Jacobi rotations.
 * Returns eigenvalues ascending with their unit eigenvectors; accurate for the small, possibly ill-conditioned
 * normal matrices of the DLT, where forming a characteristic polynomial would lose precision.
 */
export function symmetricEigen(input: Matrix): { values: number[]; vectors: number[][] } {
  const n = input.length
  const a = input.map((r) => [...r])
  const v = zeros(n, n)
  for (let i = 0; i < n; i++) v[i][i] = 1
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += a[p][q] ** 2
    if (off < 1e-30) break
    for (let p = 0; p < n; p++)
      for (let q = p + 1; q < n; q++) {
        if (a[p][q] === 0) continue
        const theta = (a[q][q] - a[p][p]) / (2 * a[p][q])
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1))
        const c = 1 / Math.sqrt(t * t + 1)
        const s = t * c
        rotateJacobi(a, v, p, q, c, s)
      }
  }
  const order = a.map((row, i) => [row[i], i]).sort((x, y) => x[0] - y[0])
  return { values: order.map((o) => o[0]), vectors: order.map(([, i]) => v.map((row) => row[i])) }
}

function rotateJacobi(a: Matrix, v: Matrix, p: number, q: number, c: number, s: number): void {
  const n = a.length
  for (let k = 0; k < n; k++) {
    const akp = a[k][p]
    const akq = a[k][q]
    a[k][p] = c * akp - s * akq
    a[k][q] = s * akp + c * akq
  }
  for (let k = 0; k < n; k++) {
    const apk = a[p][k]
    const aqk = a[q][k]
    a[p][k] = c * apk - s * aqk
    a[q][k] = s * apk + c * aqk
  }
  for (let k = 0; k < n; k++) {
    const vkp = v[k][p]
    const vkq = v[k][q]
    v[k][p] = c * vkp - s * vkq
    v[k][q] = s * vkp + c * vkq
  }
}
