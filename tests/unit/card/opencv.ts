import { createRequire } from 'node:module'

// Minimal typing of the opencv.js surface the card tests use.
export interface CvMat {
  rows: number; cols: number; data: Uint8Array; data32F: Float32Array
  ucharAt(r: number, c: number): number; delete(): void
}
export interface CvMatVector { size(): number; get(i: number): CvMat; delete(): void }
export interface Cv {
  Mat: new () => CvMat
  MatVector: new () => CvMatVector
  DICT_4X4_50: number
  CV_8UC1: number
  matFromArray(rows: number, cols: number, type: number, data: ArrayLike<number>): CvMat
  getPredefinedDictionary(name: number): { delete(): void }
  generateImageMarker(dict: unknown, id: number, sidePixels: number, out: CvMat, borderBits: number): void
  aruco_DetectorParameters: new () => { cornerRefinementMethod: number; delete(): void }
  aruco_RefineParameters: new (minRepDistance: number, errorCorrectionRate: number, checkAllOrders: boolean) => { delete(): void }
  aruco_ArucoDetector: new (dict: unknown, params: unknown, refine: unknown) => {
    detectMarkers(img: CvMat, corners: CvMatVector, ids: CvMat, rejected: CvMatVector): void
    delete(): void
  }
  onRuntimeInitialized?: () => void
  then?: unknown
}

let loading: Promise<Cv> | undefined

/**
 * Loads opencv.js once. Works around its self-resolving `then()` (STACK.md: awaiting the module object hangs):
 * require it instead of importing, and delete `then` before resolving our own promise with it.
 */
export function loadOpenCv(): Promise<Cv> {
  loading ??= new Promise((resolve) => {
    const cv = createRequire(import.meta.url)('@techstark/opencv-js') as Cv
    const done = () => { delete cv.then; resolve(cv) }
    if ((cv as unknown as { Mat?: unknown }).Mat) done()
    else cv.onRuntimeInitialized = done
  })
  return loading
}

/**
 * ArUco DICT_4X4_50 detections in a grey image: id → four corners in px (opencv's order: as printed, clockwise),
 * optionally refined to sub-pixel by opencv's own corner refinement.
 */
export async function detectMarkers(grey: Uint8Array, width: number, height: number, subPixel = false): Promise<Map<number, number[][]>> {
  const cv = await loadOpenCv()
  const img = cv.matFromArray(height, width, cv.CV_8UC1, grey)
  const dict = cv.getPredefinedDictionary(cv.DICT_4X4_50)
  const params = new cv.aruco_DetectorParameters()
  // CORNER_REFINE_SUBPIX = 1 in OpenCV's aruco module.
  if (subPixel) params.cornerRefinementMethod = 1
  const refine = new cv.aruco_RefineParameters(10, 3, true)
  const detector = new cv.aruco_ArucoDetector(dict, params, refine)
  const corners = new cv.MatVector()
  const rejected = new cv.MatVector()
  const ids = new cv.Mat()
  try {
    detector.detectMarkers(img, corners, ids, rejected)
    const found = new Map<number, number[][]>()
    for (let i = 0; i < corners.size(); i++) {
      const c = corners.get(i)
      const f = c.data32F
      found.set(new Int32Array(ids.data.buffer, ids.data.byteOffset, ids.rows * ids.cols)[i], [0, 1, 2, 3].map((k) => [f[2 * k], f[2 * k + 1]]))
      c.delete()
    }
    return found
  } finally {
    for (const m of [img, corners, rejected, ids, detector, refine, params, dict]) m.delete()
  }
}
