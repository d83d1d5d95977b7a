/** Millimetres per inch, exact since 1959 (international yard and pound agreement). */
export const MM_PER_INCH = 25.4
/** Millimetres per foot (12 in), exact. */
export const MM_PER_FOOT = 12 * MM_PER_INCH

export const inchesToMm = (inches: number): number => inches * MM_PER_INCH
export const mmToInches = (mm: number): number => mm / MM_PER_INCH
export const feetToMm = (feet: number): number => feet * MM_PER_FOOT
export const mmToFeet = (mm: number): number => mm / MM_PER_FOOT
/** n sixteenths of an inch in mm (n × 1.5875). */
export const sixteenthsToMm = (sixteenths: number): number => (sixteenths * MM_PER_INCH) / 16
export const mmToSixteenths = (mm: number): number => (mm * 16) / MM_PER_INCH

/** Sagitta (mm) of a chord of length chordMm on a circle of radius radiusMm: s = r − √(r² − (c/2)²). */
export function sagitta(radiusMm: number, chordMm: number): number {
  const half = chordMm / 2
  if (!(radiusMm > 0) || half > radiusMm) throw new RangeError('chord longer than the circle\u2019s diameter')
  // r − √(r² − h²) written as h² / (r + √(r² − h²)) to keep precision when the sag is tiny against r.
  return (half * half) / (radiusMm + Math.sqrt(radiusMm * radiusMm - half * half))
}

/** Radius (mm) of the circle through a chord of length chordMm with sagitta sagittaMm: r = (s² + (c/2)²) / 2s. */
export function radiusFromSagitta(sagittaMm: number, chordMm: number): number {
  if (!(sagittaMm > 0)) throw new RangeError('sagitta must be positive')
  return (sagittaMm * sagittaMm + (chordMm / 2) ** 2) / (2 * sagittaMm)
}

/** Chord (mm) of a circle of radius radiusMm cut at depth depthMm: c = 2√(2Rd − d²). */
export function chordAtDepth(radiusMm: number, depthMm: number): number {
  if (depthMm < 0 || depthMm > 2 * radiusMm) throw new RangeError('depth outside the circle')
  return 2 * Math.sqrt(2 * radiusMm * depthMm - depthMm * depthMm)
}

/**
 * Hollow depth (mm) across a runner of width widthMm ground at root radius rootRadiusMm: the sagitta of the runner
 * width, R − √(R² − (w/2)²).
 */
export const hollowDepth = (rootRadiusMm: number, widthMm: number): number => sagitta(rootRadiusMm, widthMm)

/** Root radius in sixteenths of an inch that a round coin of diameter diameterMm checks (its radius). */
export const coinRadiusSixteenths = (diameterMm: number): number => mmToSixteenths(diameterMm / 2)
