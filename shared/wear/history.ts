import type { MetricReading } from '../targets/readings'
import type { TargetStatus } from '../targets/read'

/** What the count needs of a sharpening. Dates are calendar dates, YYYY-MM-DD. */
export interface SharpeningMark {
  sharpenedOn: string
  analysisBeforeId: string | null
  analysisAfterId: string | null
}

/**
 * Sharpenings a blade had when an analysis was taken: those it had when registered, plus every recorded sharpening
 * linked to this analysis as its "after", or dated on or before the analysis's day and not linked to it as its
 * "before" (a same-day photo counts as after the sharpening unless someone said otherwise).
 */
export function sharpeningsAt(
  analysis: { id: string; takenOn: string },
  sharpenings: readonly SharpeningMark[],
  atRegistration: number,
): number {
  let n = atRegistration
  for (const s of sharpenings) {
    if (s.analysisAfterId === analysis.id) n++
    else if (s.analysisBeforeId !== analysis.id && s.sharpenedOn <= analysis.takenOn) n++
  }
  return n
}

/** The root radius (sixteenths of an inch) of the latest sharpening on or before a day that recorded one. */
export function rootRadiusOn(day: string, sharpenings: readonly (SharpeningMark & { rootRadiusSixteenths: number | null })[]): number | null {
  const before = sharpenings
    .filter((s) => s.sharpenedOn <= day && s.rootRadiusSixteenths !== null)
    .sort((a, b) => (a.sharpenedOn < b.sharpenedOn ? 1 : -1))
  return before[0]?.rootRadiusSixteenths ?? null
}

const RANK: Record<TargetStatus, number> = { 'on target': 0, 'near limit': 1, 'off target': 2 }

/** The worst status among readings, and which metrics carry it: "off target (touch point, heel lift)". */
export function overallStatus(readings: readonly MetricReading[]): { status: TargetStatus; text: string } {
  const worst = readings.reduce<TargetStatus>((w, r) => (RANK[r.status] > RANK[w] ? r.status : w), 'on target')
  const which = readings.filter((r) => r.status === worst && worst !== 'on target').map((r) => r.label.toLowerCase())
  return { status: worst, text: which.length ? `${worst} (${which.join(', ')})` : worst }
}
