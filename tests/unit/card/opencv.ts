import { createRequire } from 'node:module'

// Minimal typing of the opencv.js surface the card tests use.
export interface CvMat { rows: number; cols: number; data: Uint8Array; ucharAt(r: number, c: number): number; delete(): void }
export interface Cv {
  Mat: new () => CvMat
  DICT_4X4_50: number
  getPredefinedDictionary(name: number): { delete(): void }
  generateImageMarker(dict: unknown, id: number, sidePixels: number, out: CvMat, borderBits: number): void
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
