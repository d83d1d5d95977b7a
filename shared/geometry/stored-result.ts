import { analysisResultSchema, type AnalysisResult, type Overrides, type TopEdge } from '../schemas/analysis'
import { localScale } from './homography'
import { measureProfile, type Discipline, type ProfileMeasurement } from './measure-profile'
import { runnerHeights } from './runner-height'
import type { Vec2 } from './vec'

/**
 * The metric fields of an analysis result from a traced edge, shared by the engine (a new photo) and the server (B or
 * E moved by a person, recomputed from the stored edge with no image read), so both give the same numbers.
 */

/**
 * Edge-location error that does not average out along the edge, photo px: shadows merging with the steel's step, the
 * card-to-table step nearby and the rebuilt pick tip shift stretches of the edge by a fraction of a pixel to a pixel,
 * more than the point-to-point scatter, so the ± must carry it. Calibrated on the accuracy bench (100 generated
 * photos): at 1.5 px the truth lay inside 90 % of the touch-point ± already at 0.47 of their width; 0.8 px gave 91 %
 * coverage at 12 MP, and 1.0 px keeps a margin as harder photos (now measured rather than refused) join in.
 */
export const SYSTEMATIC_EDGE_PX = 1.0

/** The blade a result belongs to, and any landmarks a person moved. */
export interface MeasureOptions {
  /** Nominal blade size, inches (e.g. 9.5). */
  sizeIn: number
  discipline: Discipline
  overrides?: Overrides | null
}

/** A traced edge (card mm, toe first or last as `toe` says) and its 1σ errors, mm. */
export interface ProfileInputs {
  edgeMm: Vec2[]
  toe: 'left' | 'right'
  edgeSigmaMm: number
  calibrationSigmaMm: number
}

export function profileOfEdge(inputs: ProfileInputs, options: MeasureOptions): ProfileMeasurement {
  return measureProfile({
    edgeMm: inputs.edgeMm, toe: inputs.toe, sizeIn: options.sizeIn, discipline: options.discipline,
    edgeSigmaMm: inputs.edgeSigmaMm, calibrationSigmaMm: inputs.calibrationSigmaMm,
    overrides: options.overrides ?? undefined,
  })
}

/** The schema's metric fields of a profile measurement (dropping geometry's working data). */
export function metricFields(m: ProfileMeasurement) {
  const { frame, bladeMm, rockerStartAlongMm, rockerEndAlongMm, edgeResidualMm, ...fields } = m
  void [frame, bladeMm, rockerStartAlongMm, rockerEndAlongMm, edgeResidualMm]
  return fields
}

/** What the runner-height fields of a result are computed from: the traced edges and their 1σ errors, mm. */
export interface RunnerHeightSource {
  bottomMm: Vec2[]
  topEdge: TopEdge | null
  bottomSigmaMm: number
  calibrationSigmaMm: number
}

/**
 * The result's top edge and runner heights, in the frame of a profile measurement (recomputed whenever B or E
 * moves): stations every 10 mm from the rocker start to E where the top edge shows; nulls where it shows nowhere.
 */
export function runnerHeightFields(m: ProfileMeasurement, src: RunnerHeightSource): Pick<AnalysisResult, 'topEdge' | 'runnerHeights'> {
  if (!src.topEdge) return { topEdge: null, runnerHeights: null }
  const stations = runnerHeights({
    frame: m.frame, bottomCardMm: src.bottomMm, topCardMm: src.topEdge.cardMm,
    fromAlongMm: m.rockerStartAlongMm, toAlongMm: m.landmarks.heelEnd.alongMm,
    bottomSigmaMm: src.bottomSigmaMm, topSigmaMm: src.topEdge.sigmaMm, calibrationSigmaMm: src.calibrationSigmaMm,
  })
  return { topEdge: src.topEdge, runnerHeights: stations.length ? stations : null }
}

/** The edge sigma the engine used, rebuilt from what the result stores (its residual and the photo's scale). */
function storedEdgeSigma(result: AnalysisResult): number {
  const edge = result.edge.cardMm as Vec2[]
  const pxPerMm = localScale(result.edge.homography, edge[Math.floor(edge.length / 2)])
  return Math.max(result.quality.edgeResidualMm, SYSTEMATIC_EDGE_PX / pxPerMm)
}

/** Recomputes the metrics of a stored result from its stored edge with moved landmarks; no image is read. */
export function recomputeFromEdge(
  result: AnalysisResult,
  overrides: Overrides | null,
  blade: { sizeIn: number; discipline: Discipline },
): AnalysisResult {
  const edge = result.edge.cardMm as Vec2[]
  const toe = edge[0][0] <= edge[edge.length - 1][0] ? 'left' : 'right'
  const sigmas = { edgeSigmaMm: storedEdgeSigma(result), calibrationSigmaMm: result.card.residualMm }
  const measured = profileOfEdge({ edgeMm: edge, toe, ...sigmas }, { ...blade, overrides })
  // Stations are along L from B, so they move with B; results from before the top edge was traced keep none.
  const heights = result.topEdge === undefined ? {} : runnerHeightFields(measured, {
    bottomMm: edge, topEdge: result.topEdge, bottomSigmaMm: sigmas.edgeSigmaMm, calibrationSigmaMm: sigmas.calibrationSigmaMm,
  })
  return analysisResultSchema.parse({ ...result, ...metricFields(measured), ...heights })
}
