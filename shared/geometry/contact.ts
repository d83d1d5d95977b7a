/**
 * Light gap a person sees against a bright background: 2 µm, in mm. From memory, a convention we state in the UI
 * (DESIGN §4.5), not a published value.
 */
export const CONTACT_GAP_MM = 0.002

/**
 * Contact length (mm): the chord over which a circle of radius radiusMm stays within gapMm of its tangent line,
 * c = 2√(2·R·δ) — the small-gap form of the circular-segment chord 2√(2Rδ − δ²), which differs by under 0.01 µm here.
 */
export function contactLength(radiusMm: number, gapMm = CONTACT_GAP_MM): number {
  if (!(radiusMm > 0)) throw new RangeError('contact length needs a positive radius')
  return 2 * Math.sqrt(2 * radiusMm * gapMm)
}

/** ± of the contact length from a relative radius uncertainty: c ∝ √R, so σc / c = ½ σR / R. */
export function contactLengthSigma(radiusMm: number, radiusRelativeSigma: number, gapMm = CONTACT_GAP_MM): number {
  return 0.5 * radiusRelativeSigma * contactLength(radiusMm, gapMm)
}
