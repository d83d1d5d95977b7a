import { z } from 'zod'

const vec = z.tuple([z.number(), z.number()])

export const comparedAnalysisSchema = z.object({
  analysisId: z.uuid(),
  bladeId: z.uuid(),
  side: z.enum(['left', 'right']),
  takenAt: z.string(),
})

export const metricChangeSchema = z.object({
  metric: z.enum(['touchPointMm', 'heelLiftMm', 'contactLengthMm', 'toeRadiusMm', 'middleRadiusMm', 'heelRadiusMm', 'runnerHeightMm'])
    .describe('runnerHeightMm: the mean runner height over the stations both analyses measured'),
  from: z.number().nullable(),
  to: z.number().nullable(),
  change: z.number().nullable().describe('second − first, mm'),
  plusMinus: z.number().nullable().describe('± of the change, mm (the two ± in quadrature)'),
  insideNoise: z.boolean().nullable().describe('True when |change| ≤ its ±'),
})

export const comparisonSchema = z.object({
  kind: z.enum(['any', 'baseline', 'pair', 'sharpening', 'reference']),
  first: comparedAnalysisSchema,
  second: comparedAnalysisSchema,
  registration: z.object({
    on: z.array(z.string()).describe('Parts the profiles were registered on'),
    rmsMm: z.number(),
    rotationDeg: z.number(),
    shiftMm: vec,
  }),
  overlay: z.object({ first: z.array(vec), second: z.array(vec) }).describe('Both edges in the first blade frame, mm'),
  steelRemoved: z.array(z.object({
    alongMm: z.number(),
    removedMm: z.number().nullable().describe('mm, + = removed'),
    plusMinusMm: z.number().nullable().describe('± of the steel removed, mm (registration and edge noise, about 95 %)'),
    insideNoise: z.boolean().nullable().describe('True when |removed| ≤ its ±'),
  })),
  changes: z.array(metricChangeSchema),
  notes: z.array(z.string()).describe('What people should know when reading this comparison'),
  pairReadings: z.array(z.object({
    metric: z.enum(['pairTouchPointDiffMm', 'pairHeelLiftDiffMm']),
    label: z.string(),
    value: z.number().describe('|left − right|, mm'),
    plusMinus: z.number(),
    band: z.object({ min: z.number().nullable(), max: z.number().nullable() }),
    status: z.enum(['on target', 'near limit', 'off target']),
  })).optional().describe('Left vs right against the pair targets (pair comparisons only)'),
})

export type ComparisonDto = z.infer<typeof comparisonSchema>
