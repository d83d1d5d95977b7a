import type { AnalysisResult, TopEdge } from '../../shared/schemas/analysis'
import type { ProfileMeasurement } from '../../shared/geometry/measure-profile'
import { runnerHeights } from '../../shared/geometry/runner-height'
import type { Pt } from './projective'

/** What the runner-height fields of a result are computed from: the traced edges and their 1σ errors, mm. */
export interface RunnerHeightSource {
  bottomMm: Pt[]
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
