import { analysisResultSchema, type AnalysisResult, type RefusalCode } from '../../shared/schemas/analysis'
import type { Discipline } from '../../shared/geometry/measure-profile'
import { ProfileError } from '../../shared/geometry/profile-error'
import { metricFields, profileOfEdge, runnerHeightFields, type MeasureOptions, type ProfileInputs } from '../../shared/geometry/stored-result'
import { extractEdge, type ExtractedEdge } from './extract'
import { EngineRefusal } from './errors'
import { toRows } from './projective'

/** Version of the measurement algorithm; stored with every analysis so results can be recomputed or compared. */
export const ALGORITHM_VERSION = 'engine-1.6.0'

export type { Discipline }

export interface AnalyzeOptions extends MeasureOptions {
  /** The person's ruler reading of the card's 100 mm check bar, mm. */
  checkBarMm?: number | null
}

export type AnalyzeOutcome =
  | { ok: true; result: AnalysisResult }
  | { ok: false; error: { code: RefusalCode; message: string } }

function buildResult(x: ExtractedEdge, options: AnalyzeOptions): AnalysisResult {
  const inputs: ProfileInputs = {
    edgeMm: x.edge.edgeMm, toe: x.edge.toe, edgeSigmaMm: x.edge.edgeSigmaMm,
    calibrationSigmaMm: x.calibration.residualMm,
  }
  const measured = profileOfEdge(inputs, options)
  return analysisResultSchema.parse({
    ...metricFields(measured),
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
