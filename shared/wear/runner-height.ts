import { heightLoss, lowestStation, type RunnerHeightStation } from '../geometry/runner-height'
import type { AnalysisResult } from '../schemas/analysis'

/** What a blade's history says about its runner height (DESIGN §6), from its baseline and latest analyses. */
export interface RunnerHeightSummary {
  /** Lowest station of the latest analysis; null when its photo did not show the top edge. */
  latest: RunnerHeightStation | null
  /** Lowest station of the baseline analysis; null when there is none or it did not show the top edge. */
  baseline: RunnerHeightStation | null
  /** Height lost since the baseline at each station both measured (mm, + = lower now), with its ±. */
  lossStations: { alongMm: number; lossMm: number; plusMinusMm: number }[]
  /** Mean loss over those stations and its ± (the stations' ± is mostly systematic, so it is not divided down). */
  loss: { meanMm: number; plusMinusMm: number } | null
}

/** Runner height now, at the baseline, and lost between them; the baseline is skipped when it is the latest itself. */
export function runnerHeightSummary(baseline: AnalysisResult | null, latest: AnalysisResult | null): RunnerHeightSummary {
  const now = latest?.runnerHeights ?? []
  const then = baseline && baseline !== latest ? (baseline.runnerHeights ?? []) : []
  const lossStations = heightLoss(then, now)
  const loss = lossStations.length
    ? {
        meanMm: lossStations.reduce((s, q) => s + q.lossMm, 0) / lossStations.length,
        plusMinusMm: Math.max(...lossStations.map((q) => q.plusMinusMm)),
      }
    : null
  return { latest: lowestStation(now), baseline: lowestStation(baseline?.runnerHeights ?? []), lossStations, loss }
}

/** Plain sentences for the page and the report about the runner height and the shop's minimum (and whose it is). */
export function describeRunnerHeight(s: RunnerHeightSummary, minMm: number | null, shop: string | null = null): string {
  const parts: string[] = []
  if (s.latest === null) parts.push("Runner height: the runner's top edge did not show in the latest photo, so it was not measured.")
  else {
    const { heightMm, plusMinusMm, alongMm } = s.latest
    parts.push(`Runner height: ${heightMm.toFixed(2)} ± ${plusMinusMm.toFixed(2)} mm at its lowest station (${alongMm.toFixed(0)} mm behind the base pick).`)
    if (s.loss) {
      const n = s.lossStations.length
      const noise = Math.abs(s.loss.meanMm) <= s.loss.plusMinusMm ? ', inside the noise' : ''
      const stations = `mean of ${n} station${n === 1 ? '' : 's'} both photos show`
      parts.push(`Lost since the baseline: ${s.loss.meanMm.toFixed(2)} ± ${s.loss.plusMinusMm.toFixed(2)} mm (${stations})${noise}.`)
    } else if (s.baseline === null) parts.push('No baseline runner height to compare with.')
    else parts.push('The baseline and the latest photo show the top edge at no common station.')
  }
  parts.push(minMm === null ? 'No shop minimum set.' : `The shop's minimum is ${minMm.toFixed(1)} mm${shop ? ` (${shop})` : ''}.`)
  return parts.join(' ')
}
