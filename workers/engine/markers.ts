import type { Cv, Mat } from './opencv'
import { withMats } from './opencv'
import type { GreyImage } from './image'

/** A detected marker: its id and four corners in full-resolution photo px, in the dictionary's corner order. */
export interface DetectedMarker {
  id: number
  corners: [number, number][]
}

/** Longest side of the reduced image the detector searches; markers stay well over the detector's minimum there. */
export const DETECT_MAX_SIDE = 1800

/** Wraps a grey image as a Mat (copied; the caller frees it). */
export function toMat(cv: Cv, img: GreyImage): Mat {
  const mat = new cv.Mat(img.height, img.width, cv.CV_8UC1)
  mat.data.set(img.data)
  return mat
}

/** Reduces a grey image so its longer side is at most `maxSide` (area averaging); returns it and the scale used. */
export function reduce(cv: Cv, full: Mat, maxSide: number): { mat: Mat; scale: number } {
  const scale = Math.min(1, maxSide / Math.max(full.cols, full.rows))
  const mat = new cv.Mat()
  if (scale === 1) full.copyTo(mat)
  else cv.resize(full, mat, new cv.Size(Math.round(full.cols * scale), Math.round(full.rows * scale)), 0, 0, cv.INTER_AREA)
  return { mat, scale }
}

/**
 * Finds DICT_4X4_50 markers on a reduced image and returns their corners scaled back to full resolution, with the
 * number of square candidates the detector rejected (a blurred card still leaves many; a photo without one, few).
 */
export function detectMarkers(cv: Cv, reduced: Mat, scale: number): { markers: DetectedMarker[]; rejected: number } {
  return withMats((track) => {
    const dictionary = track(cv.getPredefinedDictionary(cv.DICT_4X4_50))
    const params = track(new cv.aruco_DetectorParameters())
    const refine = track(new cv.aruco_RefineParameters(10, 3, true))
    const detector = track(new cv.aruco_ArucoDetector(dictionary, params, refine))
    const corners = track(new cv.MatVector())
    const ids = track(new cv.Mat())
    const rejected = track(new cv.MatVector())
    detector.detectMarkers(reduced, corners, ids, rejected)
    const found: DetectedMarker[] = []
    for (let i = 0; i < ids.rows; i++) {
      const c = corners.get(i)
      const pts: [number, number][] = []
      // Corner coordinates refer to pixel centres of the reduced image; map them to centres of the full image.
      for (let k = 0; k < 4; k++) pts.push([(c.data32F[2 * k] + 0.5) / scale - 0.5, (c.data32F[2 * k + 1] + 0.5) / scale - 0.5])
      c.delete()
      found.push({ id: ids.data32S[i], corners: pts })
    }
    return { markers: found, rejected: rejected.size() as number }
  })
}
