import { analysisResultSchema, type AnalysisResult, type Overrides, type RefusalCode } from '../../shared/schemas/analysis'
import { measureProfile, type Discipline, type ProfileMeasurement } from '../../shared/geometry/measure-profile'
import { ProfileError } from '../../shared/geometry/profile-error'
import { extractEdge, type ExtractedEdge } from './extract'
import { EngineRefusal } from './errors'
import { SYSTEMATIC_EDGE_PX } from './blade'
import { localScale } from './rectify'
import { runnerHeightFields } from './runner-height-result'
import type { Mat3, Pt } from './projective'

/** Version of the measurement algorithm; stored with every analysis so results can be recomputed or compared. */
export const ALGORITHM_VERSION = 'engine-1.2.0'

export type { Discipline }

export interface AnalyzeOptions {
  /** Nominal blade size, inches (e.g. 9.5). */
  sizeIn: number
  discipline: Discipline
  /** The person's ruler reading of the card's 100 mm check bar, mm. */
  checkBarMm?: number | null
  overrides?: Overrides | null
}

export type AnalyzeOutcome =
  | { ok: true; result: AnalysisResult }
  | { ok: false; error: { code: RefusalCode; message: string } }

function toRows(h: Mat3): number[][] {
  return [h.slice(0, 3), h.slice(3, 6), h.slice(6, 9)]
}

interface ProfileInputs {
  edgeMm: Pt[]
  toe: 'left' | 'right'
  edgeSigmaMm: number
  calibrationSigmaMm: number
}

function profile(inputs: ProfileInputs, options: AnalyzeOptions): ProfileMeasurement {
  return measureProfile({
    edgeMm: inputs.edgeMm, toe: inputs.toe, sizeIn: options.sizeIn, discipline: options.discipline,
    edgeSigmaMm: inputs.edgeSigmaMm, calibrationSigmaMm: inputs.calibrationSigmaMm,
    overrides: options.overrides ?? undefined,
  })
}

/** The schema's metric fields of a profile measurement (dropping geometry's working data). */
function metrics(m: ProfileMeasurement) {
  const { frame, bladeMm, rockerStartAlongMm, rockerEndAlongMm, edgeResidualMm, ...fields } = m
  void [frame, bladeMm, rockerStartAlongMm, rockerEndAlongMm, edgeResidualMm]
  return fields
}

function buildResult(x: ExtractedEdge, options: AnalyzeOptions): AnalysisResult {
  const inputs: ProfileInputs = {
    edgeMm: x.edge.edgeMm, toe: x.edge.toe, edgeSigmaMm: x.edge.edgeSigmaMm,
    calibrationSigmaMm: x.calibration.residualMm,
  }
  const measured = profile(inputs, options)
  return analysisResultSchema.parse({
    ...metrics(measured),
    algorithmVersion: ALGORITHM_VERSION,
    edge: { cardMm: x.edge.edgeMm, homography: toRows(x.overlayHomography) },
    ...runnerHeightFields(measured, {
      bottomMm: x.edge.edgeMm, topEdge: x.topEdge, bottomSigmaMm: x.edge.edgeSigmaMm, calibrationSigmaMm: x.calibration.residualMm,
    }),
    card: {
      cardId: x.layout.cardId, residualMm: x.calibration.residualMm, residualPx: x.calibration.residualPx,
      checkBarMm: options.checkBarMm ?? null,
    },
    quality: {
      edgeResidualMm: Math.max(x.edge.edgeScatterMm, measured.edgeResidualMm),
      // Sharpness: 1 / edge blur in mm (Gaussian sigma), so 10 means a 0.1 mm blur.
      sharpness: 1 / Math.max(0.01, x.edge.blurMm),
      coverage: Math.min(1, x.edge.coverage),
    },
  })
}

function refusal(err: unknown): AnalyzeOutcome {
  if (err instanceof EngineRefusal) return { ok: false, error: { code: err.code, message: err.message } }
  // The geometry could not find its landmarks on the traced edge; its message is written for people.
  if (err instanceof ProfileError) return { ok: false, error: { code: err.code, message: err.message } }
  throw err
}

/** Measures a blade photo: calibrates the card, traces the edge and computes the profile, or says why it cannot. */
export async function analyzePhoto(bytes: Buffer, options: AnalyzeOptions): Promise<AnalyzeOutcome> {
  try {
    const extracted = await extractEdge(bytes, options.checkBarMm)
    return { ok: true, result: buildResult(extracted, options) }
  } catch (err) {
    return refusal(err)
  }
}

/** The edge sigma analyzePhoto used, rebuilt from what the result stores (its residual and the photo's scale). */
function storedEdgeSigma(result: AnalysisResult): number {
  const edge = result.edge.cardMm as Pt[]
  const pxPerMm = localScale(result.edge.homography.flat(), edge[Math.floor(edge.length / 2)])
  return Math.max(result.quality.edgeResidualMm, SYSTEMATIC_EDGE_PX / pxPerMm)
}

/** Recomputes the metrics of a stored result from its stored edge with moved landmarks; no image is read. */
export function recomputeFromEdge(
  result: AnalysisResult,
  overrides: Overrides | null,
  blade: { sizeIn: number; discipline: Discipline },
): AnalysisResult {
  const edge = result.edge.cardMm as Pt[]
  const toe = edge[0][0] <= edge[edge.length - 1][0] ? 'left' : 'right'
  const options: AnalyzeOptions = { ...blade, overrides }
  const sigmas = { edgeSigmaMm: storedEdgeSigma(result), calibrationSigmaMm: result.card.residualMm }
  const measured = profile({ edgeMm: edge, toe, ...sigmas }, options)
  // Stations are along L from B, so they move with B; results from before the top edge was traced keep none.
  const heights = result.topEdge === undefined ? {} : runnerHeightFields(measured, {
    bottomMm: edge, topEdge: result.topEdge, bottomSigmaMm: sigmas.edgeSigmaMm, calibrationSigmaMm: sigmas.calibrationSigmaMm,
  })
  return analysisResultSchema.parse({ ...result, ...metrics(measured), ...heights })
}
