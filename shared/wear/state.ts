import type { TargetStatus } from '../targets/read'

/** Wear states beyond the target reading (DESIGN.md §5): our words. */
export type WearState = 're-profile' | 'replace'

/**
 * The rule, as the Blade page states it. Restoring a rocker's shape means grinding the whole running surface down
 * to where the deepest wear already is, so the runner left after a re-profile is the baseline runner height minus
 * the most steel removed anywhere along the blade.
 */
export const WEAR_RULE =
  'Replace when the runner height is at or below the shop\u2019s minimum, or when bringing the rocker back to its ' +
  'shape would take the runner below it (the runner left after a re-profile is its height at the baseline minus ' +
  'the most steel removed anywhere along the blade). Re-profile when the touch point or heel lift is off target ' +
  'and the runner has the height to bring it back. Runner height is read from the photo at stations every 10 mm ' +
  'where the runner\u2019s top edge shows, and the lowest counts; the steel removed is the height lost at those ' +
  'stations since the baseline.'

export interface WearStateInput {
  /** Status of the rocker metrics (touch point, heel lift) on the latest analysis. */
  rockerStatuses: readonly TargetStatus[]
  /** Lowest runner height over the measuring stations now, mm; null when the top edge was not measured. */
  runnerHeightMm: number | null
  /** Lowest runner height at the baseline, mm; null when unknown. */
  baselineRunnerHeightMm: number | null
  /** Steel removed since the baseline at each station along the rocker, mm (+ = removed); nulls are skipped. */
  steelRemovedMm: readonly (number | null)[]
  /** The shop's minimum runner height, mm; null when the shop has not set one. */
  minRunnerHeightMm: number | null
}

export interface WearAssessment {
  state: WearState | null
  /** Plain sentences saying why, for the page and the report. */
  reasons: string[]
  /** Runner height left after restoring the rocker's shape, mm; null when it cannot be told. */
  heightAfterRestoreMm: number | null
}

/** Runner height (mm) left after re-grinding the rocker to its baseline shape: baseline height − most steel removed. */
export function heightAfterRestore(baselineRunnerHeightMm: number | null, steelRemovedMm: readonly (number | null)[]) {
  const removed = steelRemovedMm.filter((v): v is number => v !== null && Number.isFinite(v))
  if (baselineRunnerHeightMm === null || removed.length === 0) return null
  return baselineRunnerHeightMm - Math.max(0, ...removed)
}

/** Why a re-profile's effect on the runner cannot be judged from the photos alone. */
function missingForRestore(after: number | null, min: number | null): string {
  if (after === null && min === null) return 'There is no baseline runner height to measure wear from and no shop minimum'
  if (after === null) return 'There is no baseline runner height to measure wear from'
  return 'The shop has set no minimum runner height'
}

/** Applies WEAR_RULE. */
export function assessWear(input: WearStateInput): WearAssessment {
  const after = heightAfterRestore(input.baselineRunnerHeightMm, input.steelRemovedMm)
  const min = input.minRunnerHeightMm
  const offTarget = input.rockerStatuses.includes('off target')
  const reasons: string[] = []
  if (min !== null && input.runnerHeightMm !== null && input.runnerHeightMm <= min) {
    reasons.push(`The runner is ${input.runnerHeightMm.toFixed(2)} mm high, at or below the shop\u2019s minimum of ${min.toFixed(2)} mm.`)
  }
  if (offTarget && min !== null && after !== null && after <= min) {
    reasons.push(`Bringing the rocker back would leave ${after.toFixed(2)} mm of runner, at or below the shop\u2019s minimum of ${min.toFixed(2)} mm.`)
  }
  if (reasons.length > 0) return { state: 'replace', reasons, heightAfterRestoreMm: after }
  if (offTarget) {
    reasons.push(
      after !== null && min !== null
        ? `The touch point or heel lift is off target; a re-profile would leave ${after.toFixed(2)} mm of runner, above the shop\u2019s minimum.`
        : `The touch point or heel lift is off target. ${missingForRestore(after, min)}: have a technician check the runner height before re-profiling.`,
    )
    return { state: 're-profile', reasons, heightAfterRestoreMm: after }
  }
  return { state: null, reasons, heightAfterRestoreMm: after }
}
