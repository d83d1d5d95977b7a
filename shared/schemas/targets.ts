import { z } from 'zod'
import { TARGET_METRICS } from '../targets/bands'
import { TARGET_LAYERS } from '../targets/resolve'
import { isValidBand } from '../targets/resolve'

export const targetMetricSchema = z.enum(TARGET_METRICS).describe('Metric a band applies to; the unit is in its name')

export const bandSchema = z.object({
  min: z.number().finite().nullable().describe('Lower limit in the metric\u2019s unit; null for none'),
  max: z.number().finite().nullable().describe('Upper limit in the metric\u2019s unit; null for none'),
})

/** Body of a PUT that sets one band in one layer. */
export const setTargetSchema = bandSchema
  .extend({ note: z.string().trim().max(500).nullable().optional().describe('Why this band, for the others to read') })
  .refine((b) => isValidBand({ min: b.min, max: b.max }), {
    message: 'Give at least one limit, with the lower one not above the upper one',
    path: ['min'],
  })

export const targetAuthorSchema = z.object({
  accountId: z.string(),
  displayName: z.string(),
  role: z.string().optional().describe('The capacity they set it in: skater, coach, or technician / shop admin'),
})

export const targetSettingSchema = z.object({
  metric: targetMetricSchema,
  band: bandSchema,
  setBy: targetAuthorSchema.nullable(),
  setAt: z.string().nullable().describe('ISO 8601; null for the platform\u2019s defaults'),
  note: z.string().nullable().optional(),
})

export const resolvedTargetSchema = targetSettingSchema.extend({ layer: z.enum(TARGET_LAYERS) })

/** The bands that apply to one blade, each with the layer it came from. */
export const bladeTargetsSchema = z.object({
  bladeId: z.uuid(),
  shop: z.object({ id: z.uuid(), name: z.string() }).nullable().describe('The shop whose defaults apply, if any'),
  targets: z.array(resolvedTargetSchema),
})

export type SetTargetBody = z.infer<typeof setTargetSchema>
export type TargetSettingDto = z.infer<typeof targetSettingSchema>
export type ResolvedTargetDto = z.infer<typeof resolvedTargetSchema>
export type BladeTargetsDto = z.infer<typeof bladeTargetsSchema>

/** A shop's wear settings; runner heights are in mm from the running surface to the runner's top edge. */
export const shopWearSettingsSchema = z.object({
  minRunnerHeightMm: z.number().min(5).max(60).nullable().describe('Replace at or below this runner height, mm; null when not set'),
  setBy: z.string().nullable(),
  setAt: z.string().nullable(),
})
export const setShopWearSchema = z.object({ minRunnerHeightMm: z.number().min(5).max(60).describe('mm') })

export type ShopWearSettingsDto = z.infer<typeof shopWearSettingsSchema>
