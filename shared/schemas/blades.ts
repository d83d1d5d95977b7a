import { z } from 'zod'

/** Disciplines a blade is made for; dance blades have a shorter tail and a tighter rocker. */
export const disciplineSchema = z.enum(['freestyle', 'dance', 'pairs', 'synchro']).describe('Discipline of the blade')

export const bladeSideSchema = z.enum(['left', 'right']).describe('Which foot the blade is mounted on')

export const bladeStatusSchema = z.enum(['in_use', 'retired']).describe('Whether the blade is still skated on')

/** Nominal blade size in inches, in the 1/4 in steps blades are sold in (8 to 12.25 in covers adult blades). */
export const sizeInSchema = z
  .number()
  .min(6)
  .max(14)
  .refine((v) => Number.isInteger(v * 4), { message: 'Blade sizes go in 1/4 in steps, e.g. 9.25 or 9.5' })
  .describe('Nominal blade size, inches, in 1/4 in steps')

const isoDate = z.iso.date().describe('Calendar date, YYYY-MM-DD')

export const idParamSchema = z.object({ id: z.uuid() })

export const createPairSchema = z.object({
  label: z.string().trim().min(1, 'Give the pair a name').max(80).describe('Name of the pair, e.g. "Competition skates"'),
  sizeIn: sizeInSchema,
  discipline: disciplineSchema,
  modelLabel: z.string().trim().max(80).optional().describe('Free-text model label written on the blades'),
  mountedOn: isoDate.optional().describe('When the blades were mounted on the boots'),
  sharpeningsAtRegistration: z
    .number().int().min(0).max(200).default(0)
    .describe('0 when new; otherwise how many sharpenings the blades had when registered'),
})

export const updatePairSchema = z.object({ label: z.string().trim().min(1).max(80) })

export const updateBladeSchema = z.object({
  sizeIn: sizeInSchema.optional(),
  discipline: disciplineSchema.optional(),
  modelLabel: z.string().trim().max(80).nullable().optional(),
  mountedOn: isoDate.nullable().optional(),
  sharpeningsAtRegistration: z.number().int().min(0).max(200).optional(),
  status: bladeStatusSchema.optional(),
  notes: z.string().max(4000).nullable().optional(),
})

export const bladeSchema = z.object({
  id: z.uuid(),
  pairId: z.uuid(),
  skaterId: z.uuid(),
  side: bladeSideSchema,
  discipline: disciplineSchema,
  sizeIn: z.number(),
  modelLabel: z.string().nullable(),
  mountedOn: z.string().nullable(),
  sharpeningsAtRegistration: z.number().int().describe('0 = registered new'),
  status: bladeStatusSchema,
  notes: z.string().nullable(),
  createdAt: z.string(),
})

export const pairSchema = z.object({
  id: z.uuid(),
  skaterId: z.uuid(),
  label: z.string(),
  sizeIn: z.number(),
  discipline: disciplineSchema,
  createdAt: z.string(),
  blades: z.array(bladeSchema),
})

/** Root radius in sixteenths of an inch, as shops write it (7/16 in → 7). */
export const rootRadiusSixteenthsSchema = z.number().int().min(3).max(16).describe('Root radius, 1/16 in')

export const createSharpeningSchema = z.object({
  sharpenedOn: isoDate,
  shop: z.string().trim().max(120).optional(),
  technician: z.string().trim().max(120).optional(),
  rootRadiusSixteenths: rootRadiusSixteenthsSchema.optional(),
  notes: z.string().max(4000).optional(),
  analysisBeforeId: z.uuid().optional(),
  analysisAfterId: z.uuid().optional(),
})

export const sharpeningSchema = z.object({
  id: z.uuid(),
  bladeId: z.uuid(),
  sharpenedOn: z.string(),
  shop: z.string().nullable(),
  technician: z.string().nullable(),
  rootRadiusSixteenths: z.number().int().nullable(),
  notes: z.string().nullable(),
  analysisBeforeId: z.uuid().nullable(),
  analysisAfterId: z.uuid().nullable(),
  createdAt: z.string(),
})

export type Discipline = z.infer<typeof disciplineSchema>
export type BladeSide = z.infer<typeof bladeSideSchema>
export type CreatePairBody = z.infer<typeof createPairSchema>
export type UpdateBladeBody = z.infer<typeof updateBladeSchema>
export type BladeDto = z.infer<typeof bladeSchema>
export type PairDto = z.infer<typeof pairSchema>
export type CreateSharpeningBody = z.infer<typeof createSharpeningSchema>
export type SharpeningDto = z.infer<typeof sharpeningSchema>
