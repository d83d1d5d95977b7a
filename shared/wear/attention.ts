import type { MetricReading } from '../targets/readings'
import type { WearProjection } from './projection'
import type { WearState } from './state'

/** How urgently a blade needs someone's eyes: 3 replace, 2 off target or re-profile, 1 near a limit or soon, 0 fine. */
export type AttentionLevel = 0 | 1 | 2 | 3

export interface AttentionInput {
  /** Readings of the latest analysis (touch point, heel lift, contact length); empty when never measured. */
  latest: readonly MetricReading[]
  wearState: WearState | null
  projections: readonly (WearProjection & { metric: 'touchPointMm' | 'heelLiftMm' })[]
  /** Left vs right readings of the pair, when both blades have been measured. */
  pair: readonly MetricReading[]
  /** Root radius of the latest recorded sharpening, sixteenths of an inch. */
  hockeyGrind: boolean
  /** Days since the latest analysis; null when never measured. */
  daysSinceMeasured: number | null
}

/** Sharpenings left at or under which a projection is worth a mention. */
export const SOON_SHARPENINGS = 2
/** A blade unmeasured this long (days) is worth a fresh photo. */
export const STALE_DAYS = 180

const NAMES = { touchPointMm: 'touch point', heelLiftMm: 'heel lift' } as const

/** Why a blade needs attention, most urgent first, and its level: our rules over the wear state and the readings. */
export function attentionFor(a: AttentionInput): { level: AttentionLevel; reasons: string[] } {
  const found: [AttentionLevel, string][] = []
  if (a.wearState === 'replace') found.push([3, 'worn beyond re-profiling: replace'])
  if (a.wearState === 're-profile') found.push([2, 'needs a re-profile'])
  for (const r of a.latest) {
    if (r.status === 'off target') found.push([2, `${r.label.toLowerCase()} off target`])
    else if (r.status === 'near limit') found.push([1, `${r.label.toLowerCase()} near its limit`])
  }
  for (const r of a.pair) if (r.status === 'off target') found.push([2, `left and right differ: ${r.label.toLowerCase()}`])
  for (const p of a.projections) {
    if (p.remaining !== null && p.remaining > 0 && p.remaining <= SOON_SHARPENINGS) {
      found.push([1, `about ${p.remaining} sharpening${p.remaining === 1 ? '' : 's'} before the ${NAMES[p.metric]} leaves its target`])
    }
  }
  if (a.hockeyGrind) found.push([1, 'last sharpened with a hockey-range root radius'])
  if (a.daysSinceMeasured === null) found.push([1, 'never measured'])
  else if (a.daysSinceMeasured > STALE_DAYS) found.push([1, `not measured for ${Math.floor(a.daysSinceMeasured)} days`])
  found.sort((x, y) => y[0] - x[0])
  return { level: (found[0]?.[0] ?? 0) as AttentionLevel, reasons: found.map(([, why]) => why) }
}
