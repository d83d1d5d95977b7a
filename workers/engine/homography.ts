import { fitHomography as fitShared } from '../../shared/geometry/homography'
import type { Mat3, Pt } from './projective'

/** Card mm → photo px homography from corresponding points (the shared normalised DLT), as a flat row-major array. */
export function fitHomography(card: Pt[], photo: Pt[]): Mat3 {
  return fitShared(card, photo).flat()
}
