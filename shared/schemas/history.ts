import { z } from 'zod'
import { TARGET_STATUSES } from '../targets/read'
import { runnerHeightStationSchema } from './analysis'

/** One measured analysis in a blade's history, with its metrics read against the blade's targets. */
export const historyRowSchema = z.object({
  analysisId: z.uuid(),
  takenAt: z.string().describe('When the photo was measured, ISO 8601'),
  skater: z.string(),
  pair: z.string().describe('Name of the pair'),
  bladeId: z.uuid(),
  side: z.enum(['left', 'right']),
  sizeIn: z.number(),
  sharpeningsSoFar: z.number().int().describe('Sharpenings the blade had when the photo was taken'),
  rootRadiusSixteenths: z.number().int().nullable().describe('Root radius of the latest sharpening by then, 1/16 in'),
  touchPointMm: z.number(),
  touchPointPmMm: z.number(),
  heelLiftMm: z.number(),
  heelLiftPmMm: z.number(),
  heelLiftReadAt: z.enum(['heel end', 'heel station']),
  contactLengthMm: z.number(),
  contactLengthPmMm: z.number(),
  toeRadiusMm: z.number().nullable(),
  middleRadiusMm: z.number().nullable(),
  heelRadiusMm: z.number().nullable(),
  runnerHeightMm: z.number().nullable().describe('Runner height at its lowest station, mm; null when the top edge did not show'),
  runnerHeightPmMm: z.number().nullable(),
  status: z.enum(TARGET_STATUSES).describe('Worst status of touch point, heel lift and contact length'),
  statusText: z.string().describe('The status with the metrics that carry it'),
  baseline: z.boolean().describe('True for the analysis the blade is compared against'),
  algorithmVersion: z.string().nullable(),
})

export type HistoryRow = z.infer<typeof historyRowSchema>

/**
 * CSV columns, in order, with the row field each comes from. The README lists them for people; keep both in step.
 * Lengths in mm; radii of the rocker sections in mm; root radius in sixteenths of an inch.
 */
export const CSV_COLUMNS: readonly [string, keyof HistoryRow][] = [
  ['date', 'takenAt'],
  ['skater', 'skater'],
  ['pair', 'pair'],
  ['blade_id', 'bladeId'],
  ['side', 'side'],
  ['size_in', 'sizeIn'],
  ['sharpenings_so_far', 'sharpeningsSoFar'],
  ['root_radius_16ths_in', 'rootRadiusSixteenths'],
  ['touch_point_mm', 'touchPointMm'],
  ['touch_point_pm_mm', 'touchPointPmMm'],
  ['heel_lift_mm', 'heelLiftMm'],
  ['heel_lift_pm_mm', 'heelLiftPmMm'],
  ['heel_lift_read_at', 'heelLiftReadAt'],
  ['contact_length_mm', 'contactLengthMm'],
  ['contact_length_pm_mm', 'contactLengthPmMm'],
  ['toe_radius_mm', 'toeRadiusMm'],
  ['middle_radius_mm', 'middleRadiusMm'],
  ['heel_radius_mm', 'heelRadiusMm'],
  ['runner_height_mm', 'runnerHeightMm'],
  ['runner_height_pm_mm', 'runnerHeightPmMm'],
  ['status', 'statusText'],
  ['baseline', 'baseline'],
  ['analysis_id', 'analysisId'],
  ['algorithm_version', 'algorithmVersion'],
]

/** RFC 4180 field: quoted when it holds a comma, quote or line break; a leading = + − @ is defused for spreadsheets. */
function csvField(v: unknown): string {
  if (v === null || v === undefined) return ''
  let s = typeof v === 'number' ? String(Math.round(v * 1000) / 1000) : String(v)
  if (/^[=+\-@]/.test(s) && typeof v !== 'number') s = `'${s}`
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}

/** The history as CSV text (RFC 4180, CRLF line ends, a header row). */
export function historyCsv(rows: readonly HistoryRow[]): string {
  const lines = [CSV_COLUMNS.map(([name]) => name).join(',')]
  for (const row of rows) lines.push(CSV_COLUMNS.map(([, key]) => csvField(row[key])).join(','))
  return `${lines.join('\r\n')}\r\n`
}

export const baselineSchema = z.object({
  analysisId: z.uuid(),
  kind: z.enum(['first analysis', 'marked reference']).describe('Registered new: its first analysis; or one a technician marked'),
  markedBy: z.string().nullable(),
  markedAt: z.string().nullable(),
})

const lineSchema = z.object({ slope: z.number(), intercept: z.number() })

export const projectionSchema = z.object({
  metric: z.enum(['touchPointMm', 'heelLiftMm']),
  band: z.object({ min: z.number().nullable(), max: z.number().nullable() }),
  line: lineSchema.nullable().describe('Theil–Sen line of the metric (mm) against sharpenings so far'),
  nowSharpenings: z.number().nullable(),
  nowValue: z.number().nullable(),
  towards: z.enum(['min', 'max']).nullable(),
  remaining: z.number().int().nullable().describe('Sharpenings left inside the band; null when it never leaves or too few points'),
})

export const bladeHistorySchema = z.object({
  bladeId: z.uuid(),
  baseline: baselineSchema.nullable(),
  rows: z.array(historyRowSchema).describe('Measured analyses, oldest first'),
  projections: z.array(projectionSchema),
  wear: z.object({
    state: z.enum(['re-profile', 'replace']).nullable(),
    reasons: z.array(z.string()),
    heightAfterRestoreMm: z.number().nullable(),
  }),
  wearRule: z.string().describe('The rule the wear state follows, as the page states it'),
  runnerHeight: z.object({
    measured: z.boolean().describe('True when the latest analysis measured the runner height (its top edge showed)'),
    minMm: z.number().nullable().describe('The applicable shop\u2019s minimum runner height, mm'),
    shop: z.string().nullable(),
    latest: runnerHeightStationSchema.nullable().describe('Lowest station of the latest analysis'),
    baseline: runnerHeightStationSchema.nullable().describe('Lowest station of the baseline analysis'),
    lossStations: z.array(z.object({
      alongMm: z.number(),
      lossMm: z.number().describe('Baseline height − latest height at the station, mm (+ = lower now)'),
      plusMinusMm: z.number(),
    })).describe('Height lost since the baseline at each station both analyses measured'),
    loss: z.object({ meanMm: z.number(), plusMinusMm: z.number() }).nullable().describe('Mean loss over those stations, mm'),
  }),
  sharpenings: z.array(z.object({
    sharpenedOn: z.string(),
    sharpeningsSoFar: z.number().int(),
    rootRadiusSixteenths: z.number().int().nullable(),
    hockeyGrind: z.boolean(),
  })),
})

export const markBaselineSchema = z.object({ analysisId: z.uuid() })

export type Baseline = z.infer<typeof baselineSchema>
export type BladeHistory = z.infer<typeof bladeHistorySchema>
