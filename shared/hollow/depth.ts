import { hollowDepth, sixteenthsToMm } from '../geometry/hollow'

/** Runner widths figure blades come in, mm (common practice, no published source): about 3.8 to 4.7 mm. */
export const RUNNER_WIDTH_MIN_MM = 3.8
export const RUNNER_WIDTH_MAX_MM = 4.7
/** Width assumed when nobody has measured the runner, mm. */
export const RUNNER_WIDTH_DEFAULT_MM = 4.0

export interface HollowDepthResult {
  rootRadiusMm: number
  widthMm: number
  /** Depth of the hollow's centre below the two edges, mm. */
  depthMm: number
}

/**
 * Hollow depth (mm) for a root radius given in sixteenths of an inch and a runner width in mm, through
 * shared/geometry's circular-segment formula. Throws a RangeError for a width outside 3.8–4.7 mm or a radius
 * under 1/16 in.
 */
export function hollowDepthFromSixteenths(sixteenths: number, widthMm = RUNNER_WIDTH_DEFAULT_MM): HollowDepthResult {
  if (!(widthMm >= RUNNER_WIDTH_MIN_MM - 1e-9 && widthMm <= RUNNER_WIDTH_MAX_MM + 1e-9)) {
    throw new RangeError(`runner width must be ${RUNNER_WIDTH_MIN_MM}–${RUNNER_WIDTH_MAX_MM} mm`)
  }
  if (!(sixteenths >= 1)) throw new RangeError('root radius must be at least 1/16 in')
  const rootRadiusMm = sixteenthsToMm(sixteenths)
  return { rootRadiusMm, widthMm, depthMm: hollowDepth(rootRadiusMm, widthMm) }
}
