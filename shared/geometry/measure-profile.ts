import type { AnalysisResult, AnalysisWarning } from '../schemas/analysis'
import { contactLength, contactLengthSigma } from './contact'
import { findFlatSpots, findKinks } from './defects'
import { measureEdgeNoise } from './edge-noise'
import type { BladeFrame, ToeSide } from './frames'
import { bladeToCard, cardToBlade } from './frames'
import type { EdgeMark } from './heel'
import { directionAngles, extrapolateStationLift, findHeelEnd, rockerEndIndex, rockerStartIndex } from './heel'
import { MM_PER_INCH } from './hollow'
import type { Support } from './landmarks'
import { detectSupport, orderedWork, overrideBasePick } from './landmarks'
import { ProfileError } from './profile-error'
import type { WindowFit } from './radius-profile'
import { PROFILE_STEP_MM, STRAIGHT_CURVATURE, radiusProfile, sectionRadii } from './radius-profile'
import { measureUncertainty } from './profile-uncertainty'
import type { Vec2 } from './vec'
import { lerp, median, radToDeg } from './vec'

export type Discipline = 'freestyle' | 'dance' | 'pairs' | 'synchro'

/** What the image engine hands to geometry. All lengths in mm. */
export interface ProfileInput {
  /** Bottom edge from the toe-pick tips to the heel end, card-frame mm (x right, y down), densely sampled. */
  edgeMm: Vec2[]
  /** Which end of the edge, in card x, is the toe. */
  toe: ToeSide
  /** Nominal blade length, inches. */
  sizeIn: number
  discipline: Discipline
  /** Per-point noise of the edge (1σ, mm). */
  edgeSigmaMm: number
  /** Card calibration residual (1σ, mm). */
  calibrationSigmaMm: number
  overrides?: { basePickAlongMm?: number; heelEndAlongMm?: number }
}

/** Largest direction change taken for noise where the rocker leaves the pick gap (common practice, no published source). */
const MAX_ROCKER_START_TOLERANCE_DEG = 15

/** Heel station: nominal length − 45 mm behind B (our convention, DESIGN §4.4). */
export const HEEL_STATION_OFFSET_MM = 45
/** An edge spanning less than this fraction of the nominal length is not a blade's bottom edge. */
export const MIN_TRACED_FRACTION = 0.5
/** Measured vs nominal length mismatch that is flagged (DESIGN §3). */
export const LENGTH_TOLERANCE = 0.03

/** Every metric geometry owns, in the shapes of the analysis schema, plus the frame for drawing and comparing. */
export type ProfileMeasurement = Pick<
  AnalysisResult,
  | 'touchPointMm' | 'heelLiftMm' | 'heelLiftStationMm' | 'heelLiftExtrapolated' | 'contactLengthMm' | 'bladeLengthMm'
  | 'uncertainty' | 'radiusProfile' | 'sectionRadii' | 'flatSpots' | 'kinks' | 'landmarks' | 'warnings' | 'overrides'
> & {
  frame: BladeFrame
  /** Edge in the blade frame (x along L from B, y up), ordered toe → heel. */
  bladeMm: Vec2[]
  rockerStartAlongMm: number
  rockerEndAlongMm: number
  /** Median RMS residual of the radius-profile fits (mm): the edge's noise as measured. */
  edgeResidualMm: number
}

interface Located {
  support: Support
  blade: Vec2[]
  card: Vec2[]
  touchIndex: number
  heel: EdgeMark
  angles: Float64Array
}

function locate(input: ProfileInput): Located {
  if (input.edgeMm.length < 100)
    throw new ProfileError('BLADE_NOT_FOUND', 'Too little of the blade\u2019s bottom edge was traced to measure it.')
  const { work, card } = orderedWork(input.edgeMm, input.toe)
  const extent = Math.max(...work.map((p) => p[0])) - Math.min(...work.map((p) => p[0]))
  const nominal = input.sizeIn * MM_PER_INCH
  if (extent < MIN_TRACED_FRACTION * nominal)
    throw new ProfileError(
      'BLADE_NOT_FOUND',
      `Only about ${Math.round(extent)} mm of the blade\u2019s bottom edge was traced; a ${input.sizeIn} in blade is about ${Math.round(nominal)} mm long.`,
    )
  let support = detectSupport(work, input.toe)
  let blade = card.map((p) => cardToBlade(support.frame, p))
  const o = input.overrides
  if (o?.basePickAlongMm !== undefined) {
    const tIndex = blade.findIndex((p, i) => i > support.basePickIndex && p[0] >= support.touchPointMm)
    const start = rockerStartIndex(blade, directionAngles(blade), tIndex)
    support = overrideBasePick(work, input.toe, support, blade, o.basePickAlongMm, start)
    blade = card.map((p) => cardToBlade(support.frame, p))
  }
  const touchIndex = Math.max(blade.findIndex((p, i) => i > support.basePickIndex && p[0] >= support.touchPointMm), 1)
  const angles = directionAngles(blade)
  const heel = o?.heelEndAlongMm !== undefined ? firstReaching(blade, touchIndex, o.heelEndAlongMm) : findHeelEnd(blade, angles, touchIndex)
  if (!heel) throw new ProfileError('BLADE_CUT_OFF', 'The heel end is not in the traced edge.')
  return { support, blade, card, touchIndex, heel, angles }
}

/**
 * The blade frame detection finds with no overrides — the frame in which overrides' alongMm are measured. To turn
 * a landmark a person dragged on the photo into an override: photo px → card mm (inverse homography), then
 * cardToBlade(detectedFrame(input), point)[0].
 */
export function detectedFrame(input: ProfileInput): BladeFrame {
  const { work } = orderedWork(input.edgeMm, input.toe)
  return detectSupport(work, input.toe).frame
}

/**
 * Where a person put E: the first place behind T where the edge reaches alongMm, interpolated between points.
 * Walking from T, that is the running surface or the start of the heel corner, never higher up the heel face.
 */
function firstReaching(blade: readonly Vec2[], from: number, alongMm: number): EdgeMark {
  for (let i = Math.max(from, 1); i < blade.length; i++)
    if (blade[i][0] >= alongMm) {
      const [a, b] = [blade[i - 1], blade[i]]
      const t = b[0] === a[0] ? 0 : Math.min(Math.max((alongMm - a[0]) / (b[0] - a[0]), 0), 1)
      return { point: lerp(a, b, t), index: i }
    }
  return { point: blade[blade.length - 1], index: blade.length - 1 }
}

/**
 * Measures a traced blade edge (DESIGN §4.3–4.7): support line, base pick, touch point, heel end and lift, heel
 * station lift, contact length, radius profile, sections, flat spots, kinks, landmarks and their ± — all in the
 * blade frame (x along L from B toward the heel, y up, mm). Throws ProfileError when the edge cannot support them.
 */
export function measureProfile(input: ProfileInput): ProfileMeasurement {
  const loc = locate(input)
  const { blade, heel, support } = loc
  const r = rockerOf(loc, input.edgeSigmaMm)
  const profile = radiusProfile(r.rocker, r.startX, r.endX)
  const edgeResidualMm = profile.length ? median(profile.map((w) => w.rmsMm)) : input.edgeSigmaMm
  const sigma = Math.max(input.edgeSigmaMm, edgeResidualMm)
  const measuredNoise = measureEdgeNoise(r.rocker)
  const averagingSigma = Math.max(sigma, measuredNoise.sigmaMm * Math.sqrt(measuredNoise.tau))
  const station = stationLift(input, blade, heel, r.endX)
  const radiusT = touchRadius(support, profile)
  const unc = measureUncertainty({
    noise: { edgeSigmaMm: sigma, averagingSigmaMm: averagingSigma, calibrationSigmaMm: input.calibrationSigmaMm },
    support, profile, heel, angles: loc.angles, blade, station, radiusT,
  })
  const rT = Number.isFinite(radiusT) ? radiusT : 1 / STRAIGHT_CURVATURE
  return {
    touchPointMm: support.touchPointMm,
    heelLiftMm: heel.point[1],
    heelLiftStationMm: station.liftMm,
    heelLiftExtrapolated: station.liftMm !== null,
    contactLengthMm: contactLength(rT),
    bladeLengthMm: lengthAlong(blade),
    uncertainty: {
      touchPointMm: unc.touchPointMm,
      heelLiftMm: unc.heelLiftMm,
      heelLiftStationMm: unc.heelLiftStationMm,
      contactLengthMm: contactLengthSigma(rT, unc.radiusRelativeAtTouch),
      radiusRelative: unc.radiusRelative,
    },
    radiusProfile: profile.map(({ alongMm, curvaturePerMm, radiusMm }) => ({ alongMm, curvaturePerMm, radiusMm })),
    sectionRadii: sectionRadii(r.rocker, r.startX, support.touchPointMm, r.endX),
    flatSpots: findFlatSpots(r.rocker, r.startX, r.endX, averagingSigma),
    kinks: findKinks(r.rocker, r.startX, r.endX, curvatureLookup(profile, radiusT), averagingSigma),
    landmarks: landmarks(support, heel),
    warnings: warningsFor(input, blade, radiusT, station.unreachable),
    overrides: input.overrides && Object.keys(input.overrides).length ? { ...input.overrides } : null,
    frame: support.frame,
    bladeMm: blade,
    rockerStartAlongMm: r.startX,
    rockerEndAlongMm: r.endX,
    edgeResidualMm,
  }
}

/** The rocker proper, from where it leaves the pick gap to where the heel corner begins (blade frame, by x). */
function rockerOf({ blade, angles, heel, touchIndex }: Located, edgeSigmaMm: number): { rocker: Vec2[]; startX: number; endX: number } {
  // Tolerance: 5°, or 5σ of a direction difference (two ±0.5 mm chords, each σ·√2 / 1 mm) on a noisy edge — but
  // never past 15°: the pick gap's rear face climbs at 30° or more, and a σ that includes systematic error (which
  // moves whole stretches, not neighbouring points apart) would otherwise let the rocker run into the picks.
  const toleranceDeg = Math.min(MAX_ROCKER_START_TOLERANCE_DEG, Math.max(5, radToDeg(5 * 2 * edgeSigmaMm)))
  const startIndex = rockerStartIndex(blade, angles, touchIndex, toleranceDeg)
  const endIndex = rockerEndIndex(blade, angles, heel.index, touchIndex)
  return { rocker: blade.slice(startIndex, endIndex + 1), startX: blade[startIndex][0], endX: blade[endIndex][0] }
}

const lengthAlong = (blade: readonly Vec2[]): number =>
  Math.max(...blade.map((p) => p[0])) - Math.min(...blade.map((p) => p[0]))

function landmarks(support: Support, heel: EdgeMark): ProfileMeasurement['landmarks'] {
  const mark = (alongMm: number, at: Vec2) => ({ alongMm, cardMm: bladeToCard(support.frame, at) as [number, number] })
  return {
    basePick: mark(0, [0, 0]),
    touchPoint: mark(support.touchPointMm, [support.touchPointMm, 0]),
    heelEnd: mark(heel.point[0], heel.point),
  }
}

function warningsFor(input: ProfileInput, blade: readonly Vec2[], radiusT: number, stationUnreachable: boolean): AnalysisWarning[] {
  const warnings = lengthWarnings(input, blade)
  if (!Number.isFinite(radiusT))
    warnings.push({ code: 'STRAIGHT_AT_TOUCH', message: 'The rocker is straight at the touch point; contact length is a lower bound.' })
  if (stationUnreachable)
    warnings.push({ code: 'HEEL_STATION_UNREACHABLE', message: 'The heel station lies beyond the rocker\u2019s fitted circle.' })
  return warnings
}

interface StationResult {
  liftMm: number | null
  unreachable: boolean
  xs: number[]
  stationX: number
}

function stationLift(input: ProfileInput, blade: readonly Vec2[], heel: EdgeMark, rockerEndX: number): StationResult {
  const stationX = input.sizeIn * MM_PER_INCH - HEEL_STATION_OFFSET_MM
  if (heel.point[0] >= stationX) return { liftMm: null, unreachable: false, xs: [], stationX }
  const rocker = blade.filter((p, i) => i < heel.index && p[0] > 0)
  const ex = extrapolateStationLift(rocker, rockerEndX, stationX)
  const xs = rocker.filter((p) => p[0] >= ex.fromAlongMm && p[0] <= ex.toAlongMm).map((p) => p[0])
  return { liftMm: ex.liftMm, unreachable: ex.liftMm === null, xs, stationX }
}

/** Radius at T: the circle fitted for the touch point, else the nearest profile window. Infinity when straight. */
function touchRadius(support: Support, profile: readonly WindowFit[]): number {
  if (support.touchFit && support.touchFit.curvature >= STRAIGHT_CURVATURE) return support.touchFit.circle.r
  const near = [...profile].sort((a, b) => Math.abs(a.alongMm - support.touchPointMm) - Math.abs(b.alongMm - support.touchPointMm))[0]
  return near?.radiusMm ?? Infinity
}

/** Trend curvature at x for the kink scan: the nearest radius-profile window (or the circle at T). */
function curvatureLookup(profile: readonly WindowFit[], radiusT: number): (x: number) => number {
  if (!profile.length) return () => (Number.isFinite(radiusT) ? 1 / radiusT : 0)
  return (x) => {
    const i = Math.min(Math.max(Math.round((x - profile[0].alongMm) / PROFILE_STEP_MM), 0), profile.length - 1)
    return profile[i].curvaturePerMm
  }
}

function lengthWarnings(input: ProfileInput, blade: readonly Vec2[]): AnalysisWarning[] {
  const ratio = lengthAlong(blade) / (input.sizeIn * MM_PER_INCH)
  // Dance blades are shorter than their boot size by design, so only an over-length reads as a scale error there.
  const off = input.discipline === 'dance' ? ratio > 1 + LENGTH_TOLERANCE : Math.abs(ratio - 1) > LENGTH_TOLERANCE
  if (!off) return []
  const pct = Math.round((ratio - 1) * 100)
  return [{ code: 'LENGTH_MISMATCH', message: `The blade measures ${Math.abs(pct)} % ${pct > 0 ? 'longer' : 'shorter'} than its nominal size; check the card\u2019s print scale.` }]
}

