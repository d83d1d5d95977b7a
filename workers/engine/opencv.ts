import { createRequire } from 'node:module'

/**
 * The OpenCV.js module object. Its bundled typings describe the browser build and lack the flat ArUco names, so the
 * engine treats it as an untyped handle and keeps every call site small and local.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Cv = any
/** An OpenCV.js Mat (untyped for the same reason as {@link Cv}). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Mat = any

let loading: Promise<{ cv: Cv }> | null = null

/**
 * Loads OpenCV.js once per process. The module object has its own `then()` that resolves to itself, so awaiting it
 * spins forever: we load it with require, wait for the runtime, drop its `then`, and resolve a wrapper object.
 */
function load(): Promise<{ cv: Cv }> {
  return new Promise((resolve, reject) => {
    try {
      const cv = createRequire(import.meta.url)('@techstark/opencv-js') as Cv
      const done = () => {
        delete cv.then
        resolve({ cv })
      }
      if (cv.Mat) done()
      else cv.onRuntimeInitialized = done
    } catch (err) {
      reject(err)
    }
  })
}

/** Resolves to the initialised OpenCV.js module (wrapped, never the module itself, so it is safe to await). */
export async function getCv(): Promise<Cv> {
  loading ??= load()
  const { cv } = await loading
  return cv
}

/** Runs `fn` with the Mats it allocates through `track`, and deletes them all afterwards, whatever happens. */
export function withMats<T>(fn: (track: <M extends Mat>(mat: M) => M) => T): T {
  const mats: Mat[] = []
  const track = <M extends Mat>(mat: M): M => {
    mats.push(mat)
    return mat
  }
  try {
    return fn(track)
  } finally {
    for (const mat of mats) if (!mat.isDeleted()) mat.delete()
  }
}
