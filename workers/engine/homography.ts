import type { Mat3, Pt } from './projective'
import { fitHomographyDlt } from './dlt'

/** Card mm → photo px homography from corresponding points (one place to swap in the shared geometry's fit). */
export function fitHomography(card: Pt[], photo: Pt[]): Mat3 {
  return fitHomographyDlt(card, photo)
}
